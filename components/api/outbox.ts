import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";

export const MAIL_STATUSES = ["pending", "sending", "sent", "failed"] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

export interface OutboxMailDto {
  id: number;
  kind: string;
  to: string;
  subject: string;
  status: MailStatus;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string | null;
  sentAt: string | null;
  createdAt: string;
  messageId: string;
}

export const outboxKeys = {
  all: ["outbox"] as const,
  list: (status?: MailStatus) => [...outboxKeys.all, "list", status ?? ""] as const,
};

export const outboxApi = {
  list: (status?: MailStatus) => api<{ mails: OutboxMailDto[] }>("/api/outbox", { query: { status } }).then((r) => r.mails),
  resend: (id: number) => api<{ queued: boolean }>(`/api/outbox/${id}/resend`, { method: "POST" }),
};

/** The owner's outgoing mail. */
export function useOutboxQuery(status?: MailStatus) {
  return useQuery({ queryKey: outboxKeys.list(status), queryFn: () => outboxApi.list(status) });
}

export function useResendMailMutation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (id: number) => outboxApi.resend(id), onSuccess: () => void qc.invalidateQueries({ queryKey: outboxKeys.all }) });
}
