import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { outboxKeys } from "./keys";
import type { MailStatus } from "../../shared/schemas/outbox";
import type { OutboxMailDto, ResendResultDto } from "../../shared/contracts/outbox";

export { MAIL_STATUSES, type MailStatus } from "../../shared/schemas/outbox";
export type { OutboxMailDto, ResendResultDto } from "../../shared/contracts/outbox";
export { outboxKeys } from "./keys";

export const outboxApi = {
  list: (status?: MailStatus) => api<{ mails: OutboxMailDto[] }>("/api/outbox", { query: { status } }).then((r) => r.mails),
  resend: (id: number) => api<ResendResultDto>(`/api/outbox/${id}/resend`, { method: "POST" }),
};

/** The owner's outgoing mail. */
export function useOutboxQuery(status?: MailStatus) {
  return useQuery({ queryKey: outboxKeys.list(status), queryFn: () => outboxApi.list(status) });
}

export function useResendMailMutation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (id: number) => outboxApi.resend(id), onSuccess: () => void qc.invalidateQueries({ queryKey: outboxKeys.all }) });
}
