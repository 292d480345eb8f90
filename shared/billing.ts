/**
 * Invoice arithmetic in integer minor units (cents).
 * Rounding rule: sales tax is worked out once per invoice (or credit note) on its subtotal, then rounded
 * half up to the cent (a half cent goes up). Lines are never taxed and rounded one by one.
 */
import { DateTime } from "luxon";

export const PAYMENT_TERMS = ["card", "net7", "net14", "net30"] as const;
export type PaymentTerms = (typeof PAYMENT_TERMS)[number];
export const PAYMENT_TERMS_LABELS: Record<PaymentTerms, string> = {
  card: "Card on each invoice",
  net7: "Weekly statement, net 7",
  net14: "Weekly statement, net 14",
  net30: "Weekly statement, net 30",
};

/**
 * What a person reads for the billing codes the server stores: on screens, in e-mails and in the CSV exports
 * (issue 10 "No raw codes reach a person"). One source for the app and the server.
 */
export type InvoiceStatusCode = "open" | "paid" | "void" | "partially_refunded" | "refunded";
export const INVOICE_STATUS_LABELS: Record<InvoiceStatusCode, string> = {
  open: "Open",
  paid: "Paid",
  void: "Void",
  partially_refunded: "Part refunded",
  refunded: "Refunded",
};
export type InvoiceKindCode = "order" | "statement";
export const INVOICE_KIND_LABELS: Record<InvoiceKindCode, string> = { order: "Invoice", statement: "Weekly statement" };
export type PaymentMethodCode = "card" | "bank_transfer" | "cheque" | "cash" | "other";
/** The stored code `cheque` stays; a person in the US reads "Check". */
export const PAYMENT_METHOD_LABELS: Record<PaymentMethodCode, string> = {
  card: "Card",
  bank_transfer: "Bank transfer",
  cheque: "Check",
  cash: "Cash",
  other: "Other",
};
/** A payout's status as the card processor reports it (Stripe's payout `status`: paid, pending, in_transit, canceled, failed). */
export const PAYOUT_STATUS_LABELS: Record<string, string> = { paid: "Arrived", pending: "On its way", in_transit: "On its way", failed: "Failed", canceled: "Canceled" };
/** A status the processor may add later reads as a plain word, never its code. */
export const payoutStatusLabel = (status: string): string => PAYOUT_STATUS_LABELS[status] ?? "Unknown status";

export function termDays(terms: PaymentTerms): number {
  return terms === "card" ? 0 : Number(terms.slice(3));
}

/** Half up to the cent: taxCents(1000, 875) = 87.5 → 88. Integer arithmetic, no floating error. */
export function taxCents(subtotalCents: number, rateBp: number): number {
  const scaled = subtotalCents * rateBp; // tax × 10,000
  const q = Math.floor(scaled / 10000);
  return scaled - q * 10000 >= 5000 ? q + 1 : q;
}

export function invoiceTotals(lines: { amountCents: number }[], rateBp: number) {
  const subtotalCents = lines.reduce((s, l) => s + l.amountCents, 0);
  const tax = taxCents(subtotalCents, rateBp);
  return { subtotalCents, taxCents: tax, totalCents: subtotalCents + tax };
}

/** What is still owed on an invoice. */
export function amountDue(inv: { totalCents: number; creditedCents: number; paidCents: number; refundedCents: number }): number {
  return Math.max(0, inv.totalCents - inv.creditedCents - inv.paidCents + inv.refundedCents);
}

export function dueDate(issueDate: string, terms: PaymentTerms): string {
  return DateTime.fromISO(issueDate).plus({ days: termDays(terms) }).toISODate()!;
}

export const AGING_BUCKETS = ["current", "1-30", "31-60", "61-90", "90+"] as const;
export type AgingBucket = (typeof AGING_BUCKETS)[number];

/** Days past due → bucket: not yet due is "current". */
export function agingBucket(due: string, today: string): AgingBucket {
  const days = Math.round(DateTime.fromISO(today).diff(DateTime.fromISO(due), "days").days);
  if (days <= 0) return "current";
  if (days <= 30) return "1-30";
  if (days <= 60) return "31-60";
  if (days <= 90) return "61-90";
  return "90+";
}

/** "HB-2026-00042" */
export const formatDocNumber = (prefix: string, year: number, seq: number) => `${prefix}-${year}-${String(seq).padStart(5, "0")}`;

// ---- payment reminders --------------------------------------------------------------------------------

/** A reminder sent by hand, or one of the schedule's three: before the due date, on it, after it. */
export type ReminderStage = "manual" | "before_due" | "on_due" | "after_due";
export const REMINDER_STAGE_LABELS: Record<ReminderStage, string> = { manual: "Sent by hand", before_due: "3 days before due", on_due: "On the due date", after_due: "7 days overdue" };

/** The schedule the bookkeeper can turn on: days from the due date for each stage (negative: before it). */
export const REMINDER_SCHEDULE: readonly { stage: Exclude<ReminderStage, "manual">; days: number }[] = [
  { stage: "before_due", days: -3 },
  { stage: "on_due", days: 0 },
  { stage: "after_due", days: 7 },
];

/** Whole days from `from` to `to` (YYYY-MM-DD, calendar dates). */
const dayDiff = (from: string, to: string) => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);

/**
 * The scheduled reminder an unpaid invoice is due for today, or null: the latest stage whose day has come that
 * has not been sent, and only if no later stage was (turning the schedule on never sends a backlog of old stages,
 * and each stage goes out at most once). `issueDate`: a stage that fell before the invoice existed is skipped.
 */
export function dueReminderStage(p: { issueDate: string; dueDate: string; today: string; sent: readonly ReminderStage[] }): Exclude<ReminderStage, "manual"> | null {
  const reached = REMINDER_SCHEDULE.filter((s) => dayDiff(p.dueDate, p.today) >= s.days && dayDiff(p.issueDate, p.dueDate) + s.days >= 0);
  const latest = reached[reached.length - 1];
  if (!latest) return null;
  const order = REMINDER_SCHEDULE.map((s) => s.stage);
  const sentLatest = Math.max(-1, ...p.sent.filter((s) => s !== "manual").map((s) => order.indexOf(s as Exclude<ReminderStage, "manual">)));
  return order.indexOf(latest.stage) > sentLatest ? latest.stage : null;
}
