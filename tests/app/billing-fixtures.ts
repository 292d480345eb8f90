import type { InvoiceDetailDto, InvoiceDto } from "../../components/api/invoices";
import type { PayoutDetailDto } from "../../components/api/payouts";

/** Invoices shaped like GET /api/invoices answers (the bakery's today in helpers is 2025-12-02). */
export function invoiceDto(overrides: Partial<InvoiceDto> = {}): InvoiceDto {
  return {
    id: 41,
    number: "HB-2025-00041",
    accountId: 11,
    accountName: "Tidewater Café",
    kind: "order",
    status: "open",
    issueDate: "2025-12-01",
    dueDate: "2025-12-01",
    periodStart: null,
    periodEnd: null,
    currency: "USD",
    subtotalCents: 5400,
    taxRateBp: 875,
    taxCents: 473,
    totalCents: 5873,
    creditedCents: 0,
    paidCents: 0,
    refundedCents: 0,
    amountDueCents: 5873,
    overpaidCents: 0,
    overdue: false,
    taxExempt: false,
    sentAt: "2025-12-01T23:00:00.000Z",
    ...overrides,
  };
}

export function invoiceDetail(overrides: Partial<InvoiceDto> = {}, extra: Partial<Omit<InvoiceDetailDto, "invoice">> = {}): InvoiceDetailDto {
  const invoice = invoiceDto(overrides);
  return {
    invoice,
    lines: [{ id: 301, orderId: 901, deliveryDate: "2025-12-01", description: "Milk-bread dinner rolls (tray of 15 rolls)", quantity: 3, unitPriceCents: 1800, amountCents: 5400 }],
    payments: [],
    creditNotes: [],
    refunds: [],
    emails: [],
    alerts: [],
    reminders: [],
    ...extra,
  };
}

export const PAID_DETAIL: InvoiceDetailDto = invoiceDetail(
  { status: "paid", paidCents: 5873, amountDueCents: 0 },
  { payments: [{ id: 71, method: "card", amountCents: 5873, reference: "cs_test_1", receivedOn: "2025-12-02", stripePaymentIntentId: "pi_1", stripeChargeId: "ch_1" }] },
);

export function payoutDetail(overrides: Partial<PayoutDetailDto> = {}): PayoutDetailDto {
  return {
    payout: { id: "po_fake_1", amountCents: 11058, currency: "usd", status: "paid", arrivalDate: "2025-12-04" },
    grossCents: 11746,
    feesCents: 688,
    refundsCents: 0,
    netCents: 11058,
    netMatchesPayout: true,
    transactions: [
      { balanceTransactionId: "txn_1", type: "charge", source: "ch_1", amountCents: 5873, feeCents: 200, netCents: 5673, invoiceId: 41, invoiceNumber: "HB-2025-00041", accountName: "Tidewater Café", date: "2025-12-01", cardPaymentRef: "pi_1", matched: true, problem: null },
      { balanceTransactionId: "txn_2", type: "charge", source: "ch_stray", amountCents: 5873, feeCents: 488, netCents: 5385, invoiceId: null, invoiceNumber: null, accountName: null, date: "2025-12-02", cardPaymentRef: "ch_stray", matched: false, problem: "No Panwise payment or refund for this transaction." },
    ],
    unmatched: 1,
    reconciled: null,
    history: [],
    ...overrides,
  };
}
