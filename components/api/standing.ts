import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { calendarKeys } from "./calendar";
import { boardKeys } from "./board";
import type { StandingOrderDto, StandingOrderInput } from "../../shared/schemas/orders";

export const standingKeys = {
  all: ["standingOrders"] as const,
  /** accountId 0: the signed-in buyer's own. */
  detail: (accountId?: number) => [...standingKeys.all, accountId ?? 0] as const,
};

export interface MaterialiseResult {
  created: number;
  updated: number;
  cancelled: number;
}

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
    void qc.invalidateQueries({ queryKey: ["orders"] });
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
