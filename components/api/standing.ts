import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { boardKeys, calendarKeys, orderKeys, standingKeys } from "./keys";
import type { StandingOrderDto, StandingOrderInput } from "../../shared/schemas/orders";
import type { MaterialiseResult } from "../../shared/contracts/standing";

export type { MaterialiseResult } from "../../shared/contracts/standing";
export { standingKeys } from "./keys";

export const standingApi = {
  get: (accountId?: number) => api<{ standingOrder: StandingOrderDto | null }>("/api/standing-orders", { query: { accountId } }).then((r) => r.standingOrder),
  save: (input: StandingOrderInput) => api<{ standingOrder: StandingOrderDto }>("/api/standing-orders", { method: "PUT", body: input }).then((r) => r.standingOrder),
  materialise: () => api<{ result: MaterialiseResult }>("/api/standing-orders/materialise", { method: "POST" }).then((r) => r.result),
};

export function useStandingOrderQuery(accountId?: number) {
  return useQuery({ queryKey: standingKeys.detail(accountId), queryFn: () => standingApi.get(accountId) });
}

function useOrdersMade() {
  const qc = useQueryClient();
  return () => {
    // Saving makes, changes or cancels orders for the dates it covers.
    void qc.invalidateQueries({ queryKey: orderKeys.all });
    void qc.invalidateQueries({ queryKey: calendarKeys.all });
    void qc.invalidateQueries({ queryKey: boardKeys.all });
  };
}

export function useSaveStandingOrderMutation(accountId?: number) {
  const qc = useQueryClient();
  const made = useOrdersMade();
  return useMutation({
    mutationFn: standingApi.save,
    onSuccess: (standingOrder) => {
      qc.setQueryData(standingKeys.detail(accountId), standingOrder);
      made();
    },
  });
}

/** The owner's "make standing orders now" (the scheduled job does the same). */
export function useMaterialiseMutation() {
  const qc = useQueryClient();
  const made = useOrdersMade();
  return useMutation({
    mutationFn: standingApi.materialise,
    onSuccess: () => {
      made();
      void qc.invalidateQueries({ queryKey: standingKeys.all });
    },
  });
}
