import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { payoutKeys, reportKeys } from "./keys";

/** A payout from the card processor to the bakery's bank; `currency` is lower case ("usd") as the processor writes it. */
export interface PayoutDto {
  id: string;
  amountCents: number;
  currency: string;
  status: string;
  arrivalDate: string;
  created: string;
  reconciledAt: string | null;
  reconciledById: number | null;
}

export interface PayoutTransactionDto {
  balanceTransactionId: string;
  type: string;
  source: string;
  amountCents: number;
  feeCents: number;
  netCents: number;
  invoiceId: number | null;
  invoiceNumber: string | null;
  /** The invoice's account, when the transaction matched one. */
  accountName: string | null;
  /** YYYY-MM-DD: the payment's received-on date, the refund's day, or the day the processor booked it. */
  date: string;
  /** The card processor's payment reference (payment intent, else charge); null for refunds and adjustments. */
  cardPaymentRef: string | null;
  matched: boolean;
  problem: string | null;
}

export interface PayoutDetailDto {
  payout: { id: string; amountCents: number; currency: string; status: string; arrivalDate: string };
  grossCents: number;
  feesCents: number;
  refundsCents: number;
  netCents: number;
  netMatchesPayout: boolean;
  transactions: PayoutTransactionDto[];
  unmatched: number;
  reconciled: { at: string; byId: number | null; note: string } | null;
}

export { payoutKeys } from "./keys";

export const payoutsApi = {
  list: () => api<{ payouts: PayoutDto[] }>("/api/payouts").then((r) => r.payouts),
  get: (id: string) => api<PayoutDetailDto>(`/api/payouts/${encodeURIComponent(id)}`),
  reconcile: (id: string, input: { note: string; force?: boolean }) => api<PayoutDetailDto>(`/api/payouts/${encodeURIComponent(id)}/reconcile`, { method: "POST", body: input }),
};

export function usePayoutsQuery() {
  return useQuery({ queryKey: payoutKeys.list(), queryFn: payoutsApi.list });
}

export function usePayoutQuery(id: string | null) {
  return useQuery({ queryKey: payoutKeys.detail(id ?? ""), queryFn: () => payoutsApi.get(id ?? ""), enabled: !!id });
}

export function useReconcilePayoutMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { note: string; force?: boolean }) => payoutsApi.reconcile(id, input),
    onSuccess: (detail) => {
      qc.setQueryData(payoutKeys.detail(id), detail);
      void qc.invalidateQueries({ queryKey: payoutKeys.list() });
      void qc.invalidateQueries({ queryKey: reportKeys.all });
    },
  });
}
