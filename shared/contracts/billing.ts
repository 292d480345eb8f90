/**
 * The billing API's answers, declared once for both sides: the server's services and routes declare these as
 * their return types (`listInvoices(...): Promise<InvoiceListDto>`, `res.json(x satisfies ...)`), the client's
 * hooks in components/api/* ask for them. A field renamed on one side only fails the type check
 * (tests/shared/billing-contract.test.ts proves it). Money is integer cents of `currency`; dates are YYYY-MM-DD,
 * instants ISO 8601. The request bodies are the zod schemas in shared/schemas/billing.ts.
 */
import type { AgingBucket, InvoiceKindCode, InvoiceStatusCode, PaymentMethodCode, PaymentTerms } from "../billing";
import type { Weekday } from "../calendar";

// ---- invoices ---------------------------------------------------------------------------------------

export type InvoiceStatus = InvoiceStatusCode;

/** One invoice as the API lists it; money in integer cents of `currency`. */
export interface InvoiceDto {
  id: number;
  number: string;
  accountId: number;
  accountName: string;
  kind: InvoiceKindCode;
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

/** GET /api/invoices */
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
  method: PaymentMethodCode;
  amountCents: number;
  reference: string;
  receivedOn: string;
  stripePaymentIntentId: string | null;
  stripeChargeId: string | null;
}

/** A payment just recorded by hand (POST /api/invoices/:id/payments): the stored row. */
export interface RecordedPaymentDto extends PaymentDto {
  invoiceId: number;
  recordedById: number | null;
  createdAt: string;
}

export interface CreditNoteLineDto {
  description: string;
  quantity: number;
  unitPriceCents: number;
  amountCents: number;
}

export type CreditNoteDisposition = "applied" | "refund" | "carry";

export interface CreditNoteDto {
  id: number;
  number: string;
  reason: string;
  totalCents: number;
  subtotalCents: number;
  taxCents: number;
  disposition: CreditNoteDisposition;
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

export interface InvoiceEmailDto {
  id: number;
  kind: string;
  to: string;
  subject: string;
  status: "pending" | "sending" | "sent" | "failed";
  sentAt: string | null;
  createdAt: string;
}

/** GET /api/invoices/:id */
export interface InvoiceDetailDto {
  invoice: InvoiceDto;
  lines: InvoiceLineDto[];
  payments: PaymentDto[];
  creditNotes: CreditNoteDto[];
  refunds: RefundDto[];
  /** The invoice mail and payment receipts, with their delivery status. */
  emails: InvoiceEmailDto[];
  /** Overpayments and rejected payment notices (office screens show them). */
  alerts: InvoiceAlertDto[];
  /** Payment reminders queued for it, by hand or by the schedule, oldest first. */
  reminders: InvoiceReminderDto[];
}

/** One payment reminder (POST /api/invoices/:id/reminders → `{ reminder }`). */
export interface InvoiceReminderDto {
  id: number;
  invoiceId: number;
  stage: import("../billing").ReminderStage;
  /** Who sent it by hand; null for the schedule. */
  sentById: number | null;
  at: string;
}

/** POST /api/invoices/reminders: the invoice numbers reminded now, and those left out (already reminded today). */
export interface RemindAllResponse {
  sent: string[];
  skipped: string[];
}

/** POST /api/invoices/:id/credit-notes → `{ creditNote }` */
export interface CreditNoteResult {
  id: number;
  number: string;
  totalCents: number;
  disposition: CreditNoteDisposition;
}

/** POST /api/invoices/:id/overpayment-refund → `{ refund }`: the extra, given back to the card(s) it came from. */
export interface OverpaymentRefundResult {
  stripeRefundId: string;
  amountCents: number;
  refunds: { stripeRefundId: string; amountCents: number }[];
}

/** POST /api/invoices/:id/checkout: the card processor's hosted payment page. */
export interface CheckoutDto {
  url: string;
}

export interface StatementsResponse {
  /** The numbers of the invoices issued. */
  issued: string[];
}
export interface RecordPaymentResponse {
  payment: RecordedPaymentDto;
}
export interface CreditNoteResponse {
  creditNote: CreditNoteResult;
}
export interface OverpaymentRefundResponse {
  refund: OverpaymentRefundResult;
}

/** POST /api/stripe/webhook: every authentic event is acknowledged, rejected ones too. */
export interface WebhookAckDto {
  received: true;
  duplicate: boolean;
  rejected: boolean;
}

// ---- deliveries -------------------------------------------------------------------------------------

/** POST /api/deliveries/:date/confirm → `{ result }` */
export interface DispatchResult {
  /** Orders marked delivered. */
  delivered: number;
  /** Invoice numbers issued at once (accounts that pay by card). */
  invoices: string[];
}
export interface DispatchResponse {
  result: DispatchResult;
}

/** GET/PUT /api/accounts/:id/delivery → `{ delivery }` */
export interface AccountDeliveryDto {
  /** null: every day the bakery delivers. */
  routeWeekdays: Weekday[] | null;
  minimumOrderCents: number;
  priceListId: number | null;
}

// ---- payouts ----------------------------------------------------------------------------------------

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

/** GET /api/payouts */
export interface PayoutListResponse {
  payouts: PayoutDto[];
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

/** GET /api/payouts/:id and POST /api/payouts/:id/reconcile */
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
  /** Every reconcile and undo, oldest first (who, when, the note or the reason). */
  history: { action: "reconciled" | "undone"; at: string; byId: number; byName: string | null; note: string }[];
}

// ---- reports ----------------------------------------------------------------------------------------

export type AgingAmounts = Record<AgingBucket, number> & { total: number };

export interface AgingRowDto extends AgingAmounts {
  accountId: number;
  accountName: string;
  onHold: boolean;
  /** The hold is the automatic credit hold (overdue invoices), not a pause by hand. */
  creditHold: boolean;
}

export interface AgingDto {
  today: string;
  buckets: AgingBucket[];
  accounts: AgingRowDto[];
  totals: AgingAmounts;
}

/** GET /api/reports/aging */
export interface AgingResponse {
  aging: AgingDto;
}

// ---- billing settings and account terms -------------------------------------------------------------

/** The bakery's billing settings; the tax rate is in basis points (875 = 8.75 %). */
export interface BillingSettingsDto {
  salesTaxRateBp: number;
  invoicePrefix: string;
  creditHoldDays: number;
  paymentInstructions: string;
  /** The payment-reminder schedule is on (3 days before due, on the due date, 7 days after). */
  remindersOn: boolean;
}

/** GET and PUT /api/settings/billing */
export interface BillingSettingsResponse {
  settings: BillingSettingsDto;
}

/** PUT /api/accounts/:id/terms */
export interface PaymentTermsResponse {
  paymentTerms: PaymentTerms;
}

// ---- tax certificates -------------------------------------------------------------------------------

export type CertificateStatus = "pending" | "approved" | "rejected";

/** A resale / tax-exemption certificate on file for an account. */
export interface TaxCertificateDto {
  id: number;
  status: CertificateStatus;
  expiresOn: string;
  expired: boolean;
  contentType: string;
  sizeBytes: number;
  createdAt: string;
}

/** What an account may still store, and the expiry dates accepted today. */
export interface CertificateLimitsDto {
  maxCount: number;
  maxBytesPerAccount: number;
  maxFileBytes: number;
  count: number;
  usedBytes: number;
  expiresFrom: string;
  expiresTo: string;
}

/** GET /api/accounts/:id/certificates */
export interface CertificateListDto {
  certificates: TaxCertificateDto[];
  limits: CertificateLimitsDto;
}

/** POST /api/accounts/:id/certificates → `{ certificate }` */
export type UploadedCertificateDto = Pick<TaxCertificateDto, "id" | "status" | "expiresOn" | "sizeBytes">;
export interface UploadCertificateResponse {
  certificate: UploadedCertificateDto;
}

/** POST /api/certificates/:id/review → `{ certificate }` */
export interface ReviewedCertificateDto {
  id: number;
  status: Exclude<CertificateStatus, "pending">;
}
export interface ReviewCertificateResponse {
  certificate: ReviewedCertificateDto;
}
