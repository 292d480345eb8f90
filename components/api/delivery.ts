import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { calendarKeys, deliveryKeys } from "./keys";
import type { Weekday } from "../../shared/calendar";
import type { AccountDeliveryDto } from "../../shared/contracts/billing";

export type { AccountDeliveryDto } from "../../shared/contracts/billing";

export { deliveryKeys } from "./keys";

export const deliveryApi = {
  get: (accountId: number) => api<{ delivery: AccountDeliveryDto }>(`/api/accounts/${accountId}/delivery`).then((r) => r.delivery),
  save: (accountId: number, input: AccountDeliveryDto) => api<{ delivery: AccountDeliveryDto }>(`/api/accounts/${accountId}/delivery`, { method: "PUT", body: input }).then((r) => r.delivery),
};

/** An account's route days, minimum order and price list (a buyer may read their own). */
export function useAccountDeliveryQuery(accountId: number | null) {
  return useQuery({ queryKey: deliveryKeys.detail(accountId ?? 0), queryFn: () => deliveryApi.get(accountId ?? 0), enabled: !!accountId && accountId > 0 });
}

export function useSaveAccountDeliveryMutation(accountId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: AccountDeliveryDto) => deliveryApi.save(accountId, input),
    onSuccess: (delivery) => {
      qc.setQueryData(deliveryKeys.detail(accountId), delivery);
      // Route days change which dates can be ordered; the price list changes the account's prices.
      void qc.invalidateQueries({ queryKey: calendarKeys.all });
    },
  });
}
