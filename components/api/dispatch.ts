import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { boardKeys, calendarKeys, invoiceKeys, orderKeys, reportKeys } from "./keys";

/** A line that went out short: what was delivered of it, and why. */
export interface DispatchAdjustment {
  orderId: number;
  productId: number;
  deliveredQuantity: number;
  reason?: string;
}

export interface DispatchResult {
  /** Orders marked delivered. */
  delivered: number;
  /** Invoice numbers issued at once (accounts that pay by card). */
  invoices: string[];
}

export const dispatchApi = {
  confirm: (date: string, adjustments: DispatchAdjustment[]) =>
    api<{ result: DispatchResult }>(`/api/deliveries/${date}/confirm`, { method: "POST", body: { adjustments } }).then((r) => r.result),
};

/** Confirm a delivery date's dispatch (owner, baker): its orders become delivered; card accounts are invoiced. */
export function useConfirmDispatchMutation(date: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (adjustments: DispatchAdjustment[]) => dispatchApi.confirm(date, adjustments),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: boardKeys.all });
      void qc.invalidateQueries({ queryKey: orderKeys.all });
      void qc.invalidateQueries({ queryKey: calendarKeys.all });
      void qc.invalidateQueries({ queryKey: invoiceKeys.all });
      void qc.invalidateQueries({ queryKey: reportKeys.all });
    },
  });
}
