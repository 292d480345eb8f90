import { Linking, Platform } from "react-native";
import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { saveBlob } from "./files";
import { accountKeys, invoiceKeys, officeKeys, payoutKeys, reportKeys } from "./keys";

export const INVOICE_STATUSES = ["open", "paid", "void", "partially_refunded", "refunded"] as const;
export type InvoiceStatus = (typeof INVOICE_STATUSES)[number];
export const INVOICE_SORTS = ["newest", "oldest", "due", "amount", "account"] as const;
export type InvoiceSort = (typeof INVOICE_SORTS)[number];
export const PAYMENT_METHODS = ["bank_transfer", "cheque", "cash", "other"] as const;
export type ManualPaymentMethod = (typeof PAYMENT_METHODS)[number];

/** One invoice as the API lists it; money in integer cents of `currency`. */
export interface InvoiceDto {
  id: number;
  number: string;
  accountId: number;
  accountName: string;
  kind: "order" | "statement";
  status: InvoiceStatus;
  issueDate: string;
  dueDate: string;
  periodStart: string | null;
  periodEnd: string | null;
  currency: string;
  subtotalCents: number;
  taxRateBp: number;
  taxCents: number;
  totalCents: number;
  creditedCents: number;
  paidCents: number;
  refundedCents: number;
  amountDueCents: number;
  /** Paid beyond what the invoice is worth (a card page paid after it was settled another way): refund it. */
  overpaidCents: number;
  overdue: boolean;
  taxExempt: boolean;
  sentAt: string | null;
}

export interface InvoiceTotalsDto {
  count: number;
  totalCents: number;
  dueCents: number;
  paidCents: number;
  /** How many of the listed invoices were paid more than they owe. */
  overpaidCount?: number;
}

export interface InvoiceListDto {
  invoices: InvoiceDto[];
  totals: InvoiceTotalsDto;
}

export interface InvoiceLineDto {
  id: number;
  orderId: number;
  deliveryDate: string;
  description: string;
  quantity: number;
  unitPriceCents: number;
  amountCents: number;
}

export interface PaymentDto {
  id: number;
  method: "card" | ManualPaymentMethod;
  amountCents: number;
  reference: string;
  receivedOn: string;
  stripePaymentIntentId: string | null;
  stripeChargeId: string | null;
}

export interface CreditNoteLineDto {
  description: string;
  quantity: number;
  unitPriceCents: number;
  amountCents: number;
}

export interface CreditNoteDto {
  id: number;
  number: string;
  reason: string;
  totalCents: number;
  subtotalCents: number;
  taxCents: number;
  disposition: "applied" | "refund" | "carry";
  issueDate: string;
  lines: CreditNoteLineDto[];
  /** Set when this note was issued on an earlier invoice and carried onto this one. */
  carriedFromInvoiceId: number | null;
}

export interface RefundDto {
  id: number;
  stripeRefundId: string;
  amountCents: number;
  /** Gave back an overpayment rather than part of the sale. */
  overpayment?: boolean;
  createdAt: string;
}

/** Something on the invoice the bookkeeper should look at. */
export interface InvoiceAlertDto {
  /** "overpayment": paid more than it owes; "rejected_event": a payment notice from Stripe that did not check out. */
  kind: "overpayment" | "rejected_event";
  message: string;
  amountCents: number | null;
  eventId: string | null;
  at: string | null;
}

export interface OverpaymentRefundResult {
  stripeRefundId: string;
  amountCents: number;
}

export interface InvoiceEmailDto {
  id: number;
  kind: string;
  to: string;
  subject: string;
  status: "pending" | "sending" | "sent" | "failed";
  sentAt: string | null;
  createdAt: string;
}

export interface InvoiceDetailDto {
  invoice: InvoiceDto;
  lines: InvoiceLineDto[];
  payments: PaymentDto[];
  creditNotes: CreditNoteDto[];
  refunds: RefundDto[];
  /** The invoice mail and payment receipts, with their delivery status. */
  emails?: InvoiceEmailDto[];
  /** Overpayments and rejected payment notices (office screens show them). */
  alerts?: InvoiceAlertDto[];
}

export interface InvoiceListParams {
  status?: InvoiceStatus;
  accountId?: number;
  from?: string;
  to?: string;
  overdue?: boolean;
  q?: string;
  sort?: InvoiceSort;
}

export interface PaymentInput {
  amountCents: number;
  method: ManualPaymentMethod;
  reference: string;
  receivedOn: string;
}

export interface CreditNoteInput {
  reason: string;
  lines: { description: string; quantity: number; unitPriceCents: number }[];
  carry?: boolean;
}

export interface CreditNoteResult {
  id: number;
  number: string;
  totalCents: number;
  disposition: CreditNoteDto["disposition"];
}

export { invoiceKeys } from "./keys";

export const invoicesApi = {
  list: (p: InvoiceListParams = {}) =>
    api<InvoiceListDto>("/api/invoices", { query: { status: p.status, accountId: p.accountId, from: p.from, to: p.to, overdue: p.overdue ? 1 : undefined, q: p.q?.trim(), sort: p.sort } }),
  get: (id: number) => api<InvoiceDetailDto>(`/api/invoices/${id}`),
  pdf: (id: number) => apiBlob(`/api/invoices/${id}/pdf`),
  checkout: (id: number) => api<{ url: string }>(`/api/invoices/${id}/checkout`, { method: "POST" }),
  recordPayment: (id: number, input: PaymentInput) => api<{ payment: PaymentDto }>(`/api/invoices/${id}/payments`, { method: "POST", body: input }).then((r) => r.payment),
  creditNote: (id: number, input: CreditNoteInput) => api<{ creditNote: CreditNoteResult }>(`/api/invoices/${id}/credit-notes`, { method: "POST", body: input }).then((r) => r.creditNote),
  refundOverpayment: (id: number) => api<{ refund: OverpaymentRefundResult }>(`/api/invoices/${id}/overpayment-refund`, { method: "POST" }).then((r) => r.refund),
  issueStatements: (through?: string) => api<{ issued: string[] }>("/api/invoices/statements", { method: "POST", body: through ? { through } : {} }).then((r) => r.issued),
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
