/** The owner's outgoing mail (GET /api/outbox): server/mail/outbox.service.ts `listOutbox`, newest first. */
import type { MailStatus } from "../schemas/outbox";

export interface OutboxMailDto {
  id: number;
  /** A stored kind (shared/mail.ts MAIL_KINDS); shown through mailKindLabel, never as written. */
  kind: string;
  to: string;
  subject: string;
  status: MailStatus;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  sentAt: string | null;
  createdAt: string;
  messageId: string;
}

/** POST /api/outbox/:id/resend (202). */
export interface ResendResultDto {
  queued: boolean;
}
