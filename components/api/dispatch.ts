import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { boardKeys, calendarKeys, invoiceKeys, orderKeys, reportKeys } from "./keys";
import type { DispatchAdjustment } from "../../shared/schemas/billing";
import type { DispatchResponse } from "../../shared/contracts/billing";

export type { DispatchAdjustment } from "../../shared/schemas/billing";
export type { DispatchResult } from "../../shared/contracts/billing";

export const dispatchApi = {
  confirm: (date: string, adjustments: DispatchAdjustment[]) =>
    api<DispatchResponse>(`/api/deliveries/${date}/confirm`, { method: "POST", body: { adjustments } }).then((r) => r.result),
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
