import { stringify } from "csv-stringify/sync";
import { In } from "typeorm";
import type { AppContext } from "../http/context";
import { Invoice } from "./invoice.entity";
import { Payment } from "./payment.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { listPayouts, payoutDetail } from "./payouts.service";
import { AGING_BUCKETS, INVOICE_KIND_LABELS, INVOICE_STATUS_LABELS, PAYMENT_METHOD_LABELS, agingBucket, amountDue, payoutStatusLabel, type AgingBucket } from "../../shared/billing";
import { localToday } from "../../shared/calendar";
import { toDecimal } from "../../shared/money";
import type { ExportFile } from "../../shared/schemas/billing";
import type { AgingAmounts, AgingDto } from "../../shared/contracts/billing";

// ---- aging and exports -----------------------------------------------------------------------

export async function aging(ctx: AppContext): Promise<AgingDto> {
  const bakery = await getBakery(ctx);
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const open = await ctx.dataSource.getRepository(Invoice).find({ where: { status: In(["open", "partially_refunded"]) } });
  const accounts = new Map((await ctx.dataSource.getRepository(CustomerAccount).find()).map((a) => [a.id, a]));
  const rows = new Map<number, Record<AgingBucket, number> & { total: number }>();
  for (const inv of open) {
    const due = amountDue(inv);
    if (due <= 0) continue;
    const r = rows.get(inv.accountId) ?? { current: 0, "1-30": 0, "31-60": 0, "61-90": 0, "90+": 0, total: 0 };
    r[agingBucket(inv.dueDate, today)] += due;
    r.total += due;
    rows.set(inv.accountId, r);
  }
  const list = [...rows].map(([accountId, b]) => ({ accountId, accountName: accounts.get(accountId)?.businessName ?? "", onHold: accounts.get(accountId)?.status === "on_hold", creditHold: accounts.get(accountId)?.status === "on_hold" && !!accounts.get(accountId)?.creditHold, ...b })).sort((a, b) => b.total - a.total);
  const totals = Object.fromEntries([...AGING_BUCKETS, "total"].map((k) => [k, list.reduce((s, r) => s + (r as unknown as Record<string, number>)[k], 0)])) as AgingAmounts;
  return { today, buckets: [...AGING_BUCKETS], accounts: list, totals };
}

/**
 * CSV with formula injection neutralised (OWASP "CSV Injection": a cell starting with =, +, -, @, tab or CR
 * is run as a formula by spreadsheets). Text cells go through csv-stringify's `escape_formulas` (a leading
 * "'"). Amounts are passed as numbers of minor units and written by `cast.number` as plain decimals
 * ("-12.50"); csv-stringify leaves a numeric field's leading "-" alone (lib/api/index.js: the "-" case skips
 * fields whose type is number), and a cell that is only a signed decimal is read as a number, not a formula
 * (the same exemption Oracle APEX documents for its CSV escaping: "sign characters are only escaped if they
 * are not part of numbers"). Counts are written as digit strings. Every cast result is checked to be a number.
 */
export function csvTable(header: string[], rows: { currency: string; cells: (string | number | null)[] }[]): string {
  const head = stringify([header], { escape_formulas: true });
  return head + rows.map((r) => stringify([r.cells.map((c) => c ?? "")], {
    escape_formulas: true,
    cast: {
      number: (cents: number) => {
        if (!Number.isInteger(cents)) throw new Error(`CSV amounts are whole minor units, got ${cents}`);
        const out = toDecimal(cents, r.currency);
        if (!/^-?\d+(\.\d+)?$/.test(out)) throw new Error(`not a plain decimal: ${out}`);
        return out;
      },
    },
  })).join("");
}

/**
 * Export column headers: plain words in Title Case, named after what the column holds (never a processor's
 * object name), as the CSV spec in DEVELOPERS.md sets out. "Ref" is a reference a person can look up at the
 * card processor or the bank.
 */
/**
 * The header style of every CSV (the CSV spec in DEVELOPERS.md): plain words in Title Case, every word capitalised,
 * acronyms kept (PO), an ISO 4217 currency code in parentheses last ("Order Total (USD)"). The tests check each header row against it.
 */
export const CSV_HEADER_STYLE = /^(?:[A-Z][a-z]*|[A-Z]{2,})(?: (?:[A-Z][a-z]*|[A-Z]{2,}))*(?: \([A-Z]{3}\))?$/;
export const INVOICE_CSV_COLUMNS = ["Invoice Number", "Account", "Kind", "Status", "Issue Date", "Due Date", "Currency", "Subtotal", "Tax", "Total", "Credited", "Paid", "Refunded", "Amount Due"];
export const PAYMENT_CSV_COLUMNS = ["Received On", "Invoice Number", "Account", "Method", "Currency", "Amount", "Reference", "Card Payment Ref", "Card Charge Ref"];
export const PAYOUT_CSV_COLUMNS = ["Bank Payout Ref", "Arrival Date", "Status", "Currency", "Amount", "Gross", "Fees", "Refunds", "Net", "Transactions", "Unmatched", "Reconciled At"];

/**
 * CSV exports (RFC 4180 through csv-stringify). Column spec, documented in DEVELOPERS.md: amounts are
 * decimal in the currency's units with the ISO 4217 code in its own column; dates YYYY-MM-DD; kind, status
 * and method columns hold the words a person reads on the screens (shared/billing.ts), never the stored code.
 */
export async function exportCsv(ctx: AppContext, file: ExportFile, range: { from?: string; to?: string } = {}): Promise<string> {
  const kind = file.replace(".csv", "") as "invoices" | "payments" | "payouts";
  const within = (d: string) => (!range.from || d >= range.from) && (!range.to || d <= range.to);
  const accounts = new Map((await ctx.dataSource.getRepository(CustomerAccount).find()).map((a) => [a.id, a.businessName]));
  if (kind === "invoices") {
    const rows = (await ctx.dataSource.getRepository(Invoice).find({ order: { id: "ASC" } })).filter((i) => within(i.issueDate));
    return csvTable(INVOICE_CSV_COLUMNS,
      rows.map((i) => ({ currency: i.currency, cells: [i.number, accounts.get(i.accountId) ?? "", INVOICE_KIND_LABELS[i.kind], INVOICE_STATUS_LABELS[i.status], i.issueDate, i.dueDate, i.currency, i.subtotalCents, i.taxCents, i.totalCents, i.creditedCents, i.paidCents, i.refundedCents, amountDue(i)] })));
  }
  if (kind === "payments") {
    const rows = (await ctx.dataSource.getRepository(Payment).find({ order: { id: "ASC" } })).filter((p) => within(p.receivedOn));
    const invoices = new Map((await ctx.dataSource.getRepository(Invoice).find()).map((i) => [i.id, i]));
    return csvTable(PAYMENT_CSV_COLUMNS,
      rows.map((p) => { const i = invoices.get(p.invoiceId)!; return { currency: i.currency, cells: [p.receivedOn, i.number, accounts.get(i.accountId) ?? "", PAYMENT_METHOD_LABELS[p.method], i.currency, p.amountCents, p.reference, p.stripePaymentIntentId ?? "", p.stripeChargeId ?? ""] }; }));
  }
  const payouts = (await listPayouts(ctx)).filter((p) => within(p.arrivalDate));
  const out: { currency: string; cells: (string | number | null)[] }[] = [];
  for (const p of payouts) {
    const d = await payoutDetail(ctx, p.id);
    const cur = p.currency.toUpperCase();
    out.push({ currency: cur, cells: [p.id, p.arrivalDate, payoutStatusLabel(p.status), cur, p.amountCents, d.grossCents, d.feesCents, d.refundsCents, d.netCents, String(d.transactions.length), String(d.unmatched), p.reconciledAt ?? ""] });
  }
  return csvTable(PAYOUT_CSV_COLUMNS, out);
}
