import { LessThan, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { notFound } from "../http/errors";
import { CreditNote } from "./credit-note.entity";
import { Invoice, type InvoiceStatus } from "./invoice.entity";
import { NumberCounter } from "./number-counter.entity";
import { Payment } from "./payment.entity";
import { Refund } from "./refund.entity";
import { TaxCertificate } from "./tax-certificate.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { amountDue, formatDocNumber, taxCents } from "../../shared/billing";
import { addDays, localToday } from "../../shared/calendar";

/**
 * The invoice ledger: the steps every money movement is made of, each inside the caller's transaction —
 * gapless numbers, the exemption in force, an invoice's status from its figures, a credit note, a payment
 * and a refund recorded once. The issuing, payment and Stripe services build on these.
 */

// ---- numbers ----------------------------------------------------------------------------------

/**
 * The next number in a series for a year, allocated inside the caller's transaction under a row lock:
 * two processes issuing at once wait for each other, and a rolled-back transaction gives its number back.
 */
export async function allocateNumber(m: EntityManager, series: string, year: number): Promise<number> {
  let [row] = await m.query("SELECT next FROM number_counter WHERE series = ? AND year = ? FOR UPDATE", [series, year]);
  if (!row) {
    // The year's first number: racing creators may deadlock here; callers run in retryOnDeadlock.
    await m.query("INSERT IGNORE INTO number_counter (series, year, next) VALUES (?, ?, 1)", [series, year]);
    [row] = await m.query("SELECT next FROM number_counter WHERE series = ? AND year = ? FOR UPDATE", [series, year]);
  }
  const n = Number(row.next);
  await m.getRepository(NumberCounter).update({ series, year }, { next: n + 1 });
  return n;
}

// ---- tax exemption --------------------------------------------------------------------------------

export async function validExemption(m: EntityManager, accountId: number, onDate: string): Promise<TaxCertificate | null> {
  return m.getRepository(TaxCertificate).createQueryBuilder("c")
    .where("c.accountId = :a AND c.status = 'approved' AND c.expiresOn >= :d", { a: accountId, d: onDate })
    .orderBy("c.expiresOn", "DESC").getOne();
}

// ---- status -------------------------------------------------------------------------------------

export function statusOf(inv: Pick<Invoice, "status" | "totalCents" | "creditedCents" | "paidCents" | "refundedCents"> & { overpaymentRefundedCents?: number }): InvoiceStatus {
  if (inv.status === "void") return "void";
  // Money given back because it was paid twice is not a refund of the sale.
  const saleRefunded = inv.refundedCents - (inv.overpaymentRefundedCents ?? 0);
  const paid = inv.paidCents - (inv.overpaymentRefundedCents ?? 0);
  if (saleRefunded > 0 && saleRefunded >= paid && paid > 0) return "refunded";
  if (saleRefunded > 0) return "partially_refunded";
  return amountDue({ ...inv, refundedCents: 0 }) === 0 ? "paid" : "open";
}

/**
 * What was paid beyond what the invoice is worth (after credit notes and refunds): a card payment that arrived
 * after the invoice was settled another way. 0 when not overpaid.
 */
export function overpaidCents(inv: Pick<Invoice, "totalCents" | "creditedCents" | "paidCents" | "refundedCents">): number {
  return Math.max(0, inv.paidCents - inv.refundedCents - (inv.totalCents - inv.creditedCents));
}

export async function refreshStatus(m: EntityManager, invoiceId: number): Promise<Invoice> {
  const inv = await m.getRepository(Invoice).findOneByOrFail({ id: invoiceId });
  const status = statusOf(inv);
  if (status !== inv.status) await m.getRepository(Invoice).update({ id: inv.id }, { status });
  return { ...inv, status };
}

// ---- credit notes ------------------------------------------------------------------------------

export async function createCreditNote(ctx: AppContext, m: EntityManager, inv: Invoice, lines: { description: string; quantity: number; unitPriceCents: number; amountCents: number }[], reason: string, disposition: "applied" | "refund" | "carry", stripeRefundId: string | null = null): Promise<CreditNote> {
  const bakery = await getBakery(ctx, m);
  const subtotal = lines.reduce((s, l) => s + l.amountCents, 0);
  const tax = taxCents(subtotal, inv.taxRateBp);
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const year = Number(today.slice(0, 4));
  const seq = await allocateNumber(m, "credit", year);
  const cn = await m.getRepository(CreditNote).save(m.getRepository(CreditNote).create({
    number: formatDocNumber(`${bakery.invoicePrefix}-CN`, year, seq), invoiceId: inv.id, accountId: inv.accountId, reason,
    lines: JSON.stringify(lines), subtotalCents: subtotal, taxCents: tax, totalCents: subtotal + tax, disposition, carriedToInvoiceId: null, stripeRefundId, issueDate: today,
  }));
  // Applied and refunded credit both come off what the invoice is worth; a refund also returns money
  // already paid (refundedCents), so the buyer does not owe it again. Carried credit waits for the next invoice.
  if (disposition === "applied" || disposition === "refund") {
    await m.getRepository(Invoice).increment({ id: inv.id }, "creditedCents", cn.totalCents);
    await refreshStatus(m, inv.id);
  }
  return cn;
}

// ---- payments -----------------------------------------------------------------------------------------

/** Record money received. A Stripe payment intent is recorded once, whichever event brings it. */
export async function recordPayment(ctx: AppContext, m: EntityManager, p: { invoiceId: number; amountCents: number; method: Payment["method"]; reference?: string; receivedOn?: string; stripePaymentIntentId?: string | null; stripeChargeId?: string | null; recordedById?: number | null }): Promise<Payment | null> {
  if (p.stripePaymentIntentId) {
    const known = await m.getRepository(Payment).findOneBy({ stripePaymentIntentId: p.stripePaymentIntentId });
    if (known) {
      if (!known.stripeChargeId && p.stripeChargeId) await m.getRepository(Payment).update({ id: known.id }, { stripeChargeId: p.stripeChargeId });
      return null;
    }
  }
  const inv = await m.getRepository(Invoice).createQueryBuilder("i").setLock("pessimistic_write").where("i.id = :id", { id: p.invoiceId }).getOne();
  if (!inv) throw notFound("That invoice");
  const bakery = await getBakery(ctx, m);
  let payment: Payment;
  try {
    payment = await m.getRepository(Payment).save(m.getRepository(Payment).create({
      invoiceId: inv.id, method: p.method, amountCents: p.amountCents, reference: p.reference ?? "", stripePaymentIntentId: p.stripePaymentIntentId ?? null,
      stripeChargeId: p.stripeChargeId ?? null, receivedOn: p.receivedOn ?? localToday(ctx.clock.now(), bakery.timeZone), recordedById: p.recordedById ?? null,
    }));
  } catch (err) {
    if ((err as { errno?: number; driverError?: { errno?: number } }).driverError?.errno === 1062) return null; // the twin event won
    throw err;
  }
  await m.getRepository(Invoice).increment({ id: inv.id }, "paidCents", p.amountCents);
  if (p.amountCents > amountDue(inv)) {
    // Kept (the money was taken) and shown to the bookkeeper as an overpayment, with a refund in one action.
    ctx.logger.warn({ invoiceId: inv.id, amountCents: p.amountCents, dueCents: amountDue(inv), method: p.method }, "payment exceeds what the invoice owes: overpayment");
  }
  const updated = await refreshStatus(m, inv.id);
  if (updated.status === "paid") await liftHoldIfClear(ctx, m, inv.accountId);
  return payment;
}

async function liftHoldIfClear(ctx: AppContext, m: EntityManager, accountId: number) {
  const account = await m.getRepository(CustomerAccount).findOneBy({ id: accountId });
  if (!account?.creditHold) return;
  const bakery = await getBakery(ctx, m);
  const limit = addDays(localToday(ctx.clock.now(), bakery.timeZone), -bakery.creditHoldDays);
  const stillOverdue = await m.getRepository(Invoice).countBy({ accountId, status: "open", dueDate: LessThan(limit) });
  if (stillOverdue === 0) await m.getRepository(CustomerAccount).update({ id: accountId }, { status: account.status === "on_hold" ? "active" : account.status, creditHold: false });
}

/** A Stripe refund seen (from our own call or a charge.refunded event): recorded once per refund id. */
export async function recordRefund(ctx: AppContext, m: EntityManager, r: { invoiceId: number; stripeRefundId: string; stripeChargeId: string | null; amountCents: number; creditNoteId?: number | null; overpayment?: boolean }) {
  if (await m.getRepository(Refund).existsBy({ stripeRefundId: r.stripeRefundId })) return false;
  try {
    await m.getRepository(Refund).insert({ invoiceId: r.invoiceId, stripeRefundId: r.stripeRefundId, stripeChargeId: r.stripeChargeId, amountCents: r.amountCents, creditNoteId: r.creditNoteId ?? null, overpayment: !!r.overpayment });
  } catch (err) {
    if ((err as { driverError?: { errno?: number } }).driverError?.errno === 1062) return false;
    throw err;
  }
  await m.getRepository(Invoice).increment({ id: r.invoiceId }, "refundedCents", r.amountCents);
  if (r.overpayment) await m.getRepository(Invoice).increment({ id: r.invoiceId }, "overpaymentRefundedCents", r.amountCents);
  await refreshStatus(m, r.invoiceId);
  return true;
}
