import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { boardKeys, calendarKeys, orderKeys, standingKeys, type OrderListParams } from "./keys";
import type { OrderCreateInput, OrderDto, OrderUpdateInput } from "../../shared/schemas/orders";

export { orderKeys, type OrderListParams } from "./keys";

export const ordersApi = {
  list: (params: OrderListParams = {}) => api<{ orders: OrderDto[] }>("/api/orders", { query: { ...params } }).then((r) => r.orders),
  get: (id: number) => api<{ order: OrderDto }>(`/api/orders/${id}`).then((r) => r.order),
  /** The key makes a retried submission count once (the server answers a repeat with the first result). */
  create: (input: OrderCreateInput, idempotencyKey: string) =>
    api<{ order: OrderDto }>("/api/orders", { method: "POST", body: input, headers: { "Idempotency-Key": idempotencyKey } }).then((r) => r.order),
  update: (id: number, patch: OrderUpdateInput) => api<{ order: OrderDto }>(`/api/orders/${id}`, { method: "PATCH", body: patch }).then((r) => r.order),
  /** `overrideReason`: the owner cancels past the cut-off (kept on the order). */
  cancel: (id: number, overrideReason?: string) => api<{ order: OrderDto }>(`/api/orders/${id}`, { method: "DELETE", query: { overrideReason } }).then((r) => r.order),
};

export function useOrdersQuery(params: OrderListParams, options: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: orderKeys.list(params), queryFn: () => ordersApi.list(params), enabled: options.enabled ?? true });
}

export function useOrderQuery(id: number | null) {
  return useQuery({ queryKey: orderKeys.detail(id ?? 0), queryFn: () => ordersApi.get(id ?? 0), enabled: !!id && id > 0 });
}

/** Everything an order shows up in: its own page, lists, the calendar, the board, the standing order's dates. */
export function useOrderChanged() {
  const qc = useQueryClient();
  return (order?: OrderDto) => {
    if (order) qc.setQueryData(orderKeys.detail(order.id), order);
    void qc.invalidateQueries({ queryKey: orderKeys.lists() });
    void qc.invalidateQueries({ queryKey: calendarKeys.all });
    void qc.invalidateQueries({ queryKey: boardKeys.all });
    void qc.invalidateQueries({ queryKey: standingKeys.all });
  };
}

export function useCreateOrderMutation() {
  const changed = useOrderChanged();
  return useMutation({
    mutationFn: ({ input, idempotencyKey }: { input: OrderCreateInput; idempotencyKey: string }) => ordersApi.create(input, idempotencyKey),
    onSuccess: changed,
  });
}

export function useUpdateOrderMutation(id: number) {
  const changed = useOrderChanged();
  return useMutation({ mutationFn: (patch: OrderUpdateInput) => ordersApi.update(id, patch), onSuccess: changed });
}

export function useCancelOrderMutation(id: number) {
  const changed = useOrderChanged();
  return useMutation({ mutationFn: (overrideReason?: string) => ordersApi.cancel(id, overrideReason), onSuccess: changed });
}
