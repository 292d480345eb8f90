import { z } from "zod";

/** Where a queued e-mail stands (mail_outbox.status). */
export const MAIL_STATUSES = ["pending", "sending", "sent", "failed"] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

/** GET /api/outbox?status= (owner). */
export const outboxListQuerySchema = z.object({ status: z.enum(MAIL_STATUSES).optional() });
