import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { deliveryKeys, priceListKeys, productKeys } from "./keys";
import type { PriceListDto, PriceListInput } from "../../shared/schemas/catalog";

export { priceListKeys } from "./keys";

export const priceListsApi = {
  list: () => api<{ priceLists: PriceListDto[] }>("/api/price-lists").then((r) => r.priceLists),
  create: (input: PriceListInput) => api<{ priceList: PriceListDto }>("/api/price-lists", { method: "POST", body: input }).then((r) => r.priceList),
  update: (id: number, input: PriceListInput) => api<{ priceList: PriceListDto }>(`/api/price-lists/${id}`, { method: "PUT", body: input }).then((r) => r.priceList),
  remove: (id: number) => api<void>(`/api/price-lists/${id}`, { method: "DELETE" }),
};

export function usePriceListsQuery(options: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: priceListKeys.list(), queryFn: priceListsApi.list, enabled: options.enabled ?? true });
}

function useInvalidatePricing() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: priceListKeys.all });
    // Prices shown with products and accounts' chosen lists depend on them.
    void qc.invalidateQueries({ queryKey: productKeys.all });
    void qc.invalidateQueries({ queryKey: deliveryKeys.all });
  };
}

export function useCreatePriceListMutation() {
  const invalidate = useInvalidatePricing();
  return useMutation({ mutationFn: priceListsApi.create, onSuccess: invalidate });
}

export function useUpdatePriceListMutation(id: number) {
  const invalidate = useInvalidatePricing();
  return useMutation({ mutationFn: (input: PriceListInput) => priceListsApi.update(id, input), onSuccess: invalidate });
}

export function useDeletePriceListMutation() {
  const invalidate = useInvalidatePricing();
  return useMutation({ mutationFn: priceListsApi.remove, onSuccess: invalidate });
}
