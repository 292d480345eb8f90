import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { payoutKeys, reportKeys } from "./keys";
import type { ReconcileInput } from "../../shared/schemas/billing";
import type { PayoutDetailDto, PayoutListResponse } from "../../shared/contracts/billing";

export type { PayoutDetailDto, PayoutDto, PayoutTransactionDto } from "../../shared/contracts/billing";

export { payoutKeys } from "./keys";

export const payoutsApi = {
  list: () => api<PayoutListResponse>("/api/payouts").then((r) => r.payouts),
  get: (id: string) => api<PayoutDetailDto>(`/api/payouts/${encodeURIComponent(id)}`),
  reconcile: (id: string, input: ReconcileInput) => api<PayoutDetailDto>(`/api/payouts/${encodeURIComponent(id)}/reconcile`, { method: "POST", body: input }),
  undoReconcile: (id: string, reason: string) => api<PayoutDetailDto>(`/api/payouts/${encodeURIComponent(id)}/undo-reconcile`, { method: "POST", body: { reason } }),
};

export function usePayoutsQuery() {
  return useQuery({ queryKey: payoutKeys.list(), queryFn: payoutsApi.list });
}

export function usePayoutQuery(id: string | null) {
  return useQuery({ queryKey: payoutKeys.detail(id ?? ""), queryFn: () => payoutsApi.get(id ?? ""), enabled: !!id });
}

/** A write that answers the payout's detail: shown at once, the list and the reports asked again. */
function usePayoutWrite<A>(id: string, write: (arg: A) => Promise<PayoutDetailDto>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: write,
    onSuccess: (detail) => {
      qc.setQueryData(payoutKeys.detail(id), detail);
      void qc.invalidateQueries({ queryKey: payoutKeys.list() });
      void qc.invalidateQueries({ queryKey: reportKeys.all });
    },
  });
}

export function useReconcilePayoutMutation(id: string) {
  return usePayoutWrite(id, (input: ReconcileInput) => payoutsApi.reconcile(id, input));
}

/** Take a reconciliation back, with the reason (kept in the payout's history). */
export function useUndoReconcileMutation(id: string) {
  return usePayoutWrite(id, (reason: string) => payoutsApi.undoReconcile(id, reason));
}
