import { Linking, Platform } from "react-native";
import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { saveBlob } from "./files";
import { accountKeys, invoiceKeys, officeKeys, payoutKeys, reportKeys } from "./keys";
import type { CreditNoteInput, InvoiceSort, PaymentInput } from "../../shared/schemas/billing";
import type {
  CheckoutDto, CreditNoteResponse, InvoiceDetailDto, InvoiceDto, InvoiceListDto, InvoiceReminderDto, InvoiceStatus, RemindAllResponse, OverpaymentRefundResponse, RecordPaymentResponse, StatementsResponse,
} from "../../shared/contracts/billing";

export { INVOICE_SORTS, INVOICE_STATUSES, PAYMENT_METHODS } from "../../shared/schemas/billing";
export type { CreditNoteInput, InvoiceSort, ManualPaymentMethod, PaymentInput } from "../../shared/schemas/billing";
export type {
  CheckoutDto, CreditNoteDto, CreditNoteLineDto, CreditNoteResult, InvoiceAlertDto, InvoiceDetailDto, InvoiceDto, InvoiceEmailDto, InvoiceLineDto,
  InvoiceListDto, InvoiceReminderDto, InvoiceStatus, InvoiceTotalsDto, OverpaymentRefundResult, PaymentDto, RefundDto, RemindAllResponse,
} from "../../shared/contracts/billing";

/** The list's filters as the screens hold them (the query string is parsed by shared/schemas/billing.ts invoiceListQuerySchema). */
export interface InvoiceListParams {
  status?: InvoiceStatus;
  accountId?: number;
  from?: string;
  to?: string;
  overdue?: boolean;
  q?: string;
  sort?: InvoiceSort;
}

export { invoiceKeys } from "./keys";

export const invoicesApi = {
  list: (p: InvoiceListParams = {}) =>
    api<InvoiceListDto>("/api/invoices", { query: { status: p.status, accountId: p.accountId, from: p.from, to: p.to, overdue: p.overdue ? 1 : undefined, q: p.q?.trim(), sort: p.sort } }),
  get: (id: number) => api<InvoiceDetailDto>(`/api/invoices/${id}`),
  pdf: (id: number) => apiBlob(`/api/invoices/${id}/pdf`),
  checkout: (id: number) => api<CheckoutDto>(`/api/invoices/${id}/checkout`, { method: "POST" }),
  recordPayment: (id: number, input: PaymentInput) => api<RecordPaymentResponse>(`/api/invoices/${id}/payments`, { method: "POST", body: input }).then((r) => r.payment),
  creditNote: (id: number, input: CreditNoteInput) => api<CreditNoteResponse>(`/api/invoices/${id}/credit-notes`, { method: "POST", body: input }).then((r) => r.creditNote),
  refundOverpayment: (id: number) => api<OverpaymentRefundResponse>(`/api/invoices/${id}/overpayment-refund`, { method: "POST" }).then((r) => r.refund),
  remind: (id: number) => api<{ reminder: InvoiceReminderDto }>(`/api/invoices/${id}/reminders`, { method: "POST" }).then((r) => r.reminder),
  remindAllOverdue: () => api<RemindAllResponse>("/api/invoices/reminders", { method: "POST" }),
  issueStatements: (through?: string) => api<StatementsResponse>("/api/invoices/statements", { method: "POST", body: through ? { through } : {} }).then((r) => r.issued),
};

export function useInvoicesQuery(params: InvoiceListParams, options: { enabled?: boolean } = {}) {
  // Changing a filter keeps the current rows on screen until the new ones arrive.
  return useQuery({ queryKey: invoiceKeys.list(params), queryFn: () => invoicesApi.list(params), enabled: options.enabled ?? true, placeholderData: keepPreviousData });
}

export interface InvoiceQueryOptions {
  /** Ask again every so many ms while the function says so (the payment return page polls). */
  refetchInterval?: number | false | ((detail: InvoiceDetailDto | undefined) => number | false);
}

export function useInvoiceQuery(id: number | null, options: InvoiceQueryOptions = {}) {
  const every = options.refetchInterval;
  return useQuery({
    queryKey: invoiceKeys.detail(id ?? 0),
    queryFn: () => invoicesApi.get(id ?? 0),
    enabled: !!id && id > 0,
    refetchInterval: typeof every === "function" ? (q) => every(q.state.data) : every,
    refetchIntervalInBackground: typeof every !== "undefined" && every !== false,
  });
}

/** Money came in or went out: the invoice, every list and report, and the accounts (a paid invoice can lift a credit hold). */
export function useBillingChanged() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: invoiceKeys.all });
    void qc.invalidateQueries({ queryKey: reportKeys.all });
    void qc.invalidateQueries({ queryKey: payoutKeys.all });
    void qc.invalidateQueries({ queryKey: accountKeys.all });
    void qc.invalidateQueries({ queryKey: officeKeys.all });
  };
}

export function useRecordPaymentMutation(id: number) {
  const changed = useBillingChanged();
  return useMutation({ mutationFn: (input: PaymentInput) => invoicesApi.recordPayment(id, input), onSuccess: changed });
}

export function useCreditNoteMutation(id: number) {
  const changed = useBillingChanged();
  return useMutation({ mutationFn: (input: CreditNoteInput) => invoicesApi.creditNote(id, input), onSuccess: changed });
}

/** Give back what was paid twice, to the card it came from (one action). */
export function useRefundOverpaymentMutation(id: number) {
  const changed = useBillingChanged();
  return useMutation({ mutationFn: () => invoicesApi.refundOverpayment(id), onSuccess: changed });
}

/** A payment reminder for one invoice, by hand (office); the invoice and the outbox show it. */
export function useRemindMutation(id: number) {
  const changed = useBillingChanged();
  return useMutation({ mutationFn: () => invoicesApi.remind(id), onSuccess: () => changed() });
}

/** One reminder per overdue invoice (office), leaving out those reminded today. */
export function useRemindAllOverdueMutation() {
  const changed = useBillingChanged();
  return useMutation({ mutationFn: invoicesApi.remindAllOverdue, onSuccess: () => changed() });
}

export function useIssueStatementsMutation() {
  const changed = useBillingChanged();
  return useMutation({ mutationFn: (through?: string) => invoicesApi.issueStatements(through), onSuccess: changed });
}

/** Leave the app for the card processor's hosted payment page (same tab on the web). */
export function openCheckoutPage(url: string): void {
  if (Platform.OS === "web" && typeof window !== "undefined" && window.location) {
    window.location.assign(url);
    return;
  }
  void Linking.openURL(url);
}

/** Make a hosted checkout for what is due, then go there. */
export function useCheckoutMutation(id: number) {
  return useMutation({
    mutationFn: () => invoicesApi.checkout(id),
    onSuccess: ({ url }) => openCheckoutPage(url),
  });
}

/** Download the invoice's PDF (web). */
export async function downloadInvoicePdf(invoice: Pick<InvoiceDto, "id" | "number">): Promise<void> {
  saveBlob(await invoicesApi.pdf(invoice.id), `${invoice.number}.pdf`);
}
