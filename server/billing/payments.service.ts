import type Stripe from "stripe";
import { stringify } from "csv-stringify/sync";
import { In } from "typeorm";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, conflict, notFound } from "../http/errors";
import { CheckoutSessionRecord, CreditNote, Invoice, Payment, PayoutReconciliation, Refund, StripeEventRecord } from "./billing.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { createCreditNote, recordPayment, recordRefund } from "./invoices.service";
import { enqueueMail } from "../mail/outbox.service";
import { receiptMail } from "../mail/templates";
import { AGING_BUCKETS, agingBucket, amountDue, taxCents, type AgingBucket } from "../../shared/billing";
import { localToday } from "../../shared/calendar";
import { retryOnDeadlock } from "../db/retry";
import { toDecimal } from "../../shared/money";
import type { SessionUser } from "../../shared/schemas/auth";

const isConnectionError = (err: unknown) => {
  const e = err as { type?: string; code?: string };
  return e?.type === "StripeConnectionError" || e?.type === "StripeAPIError" || e?.code === "ECONNREFUSED";
};
const unavailable = () => new HttpError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was charged; please try again in a minute.");

// ---- checkout --------------------------------------------------------------------------------

/**
 * A hosted checkout session for what is due on an invoice. Stripe is called first; only a session it
 * created is stored, so an outage leaves nothing half-made.
 */
export async function createCheckout(ctx: AppContext, actor: SessionUser, invoiceId: number): Promise<{ url: string }> {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneBy({ id: invoiceId });
  if (!inv || (actor.role === "buyer" && inv.accountId !== actor.accountId)) throw notFound("That invoice");
  if (inv.status === "void") throw conflict("invoice_void", "This invoice is void.");
  const due = amountDue(inv);
  if (due <= 0) throw conflict("nothing_due", "This invoice is already paid.");
  const account = await ctx.dataSource.getRepository(CustomerAccount).findOneByOrFail({ id: inv.accountId });
  // A session for this amount that is still open is offered again, so one debt never gets two live payment pages.
  const open = await ctx.dataSource.getRepository(CheckoutSessionRecord).createQueryBuilder("s")
    .where("s.invoiceId = :id AND s.status = 'open' AND s.amountCents = :due AND s.expiresAt > :now", { id: inv.id, due, now: ctx.clock.now() })
    .orderBy("s.createdAt", "DESC").getOne();
  if (open) return { url: open.url };
  const base = ctx.config.publicUrl;
  let session: Stripe.Checkout.Session;
  try {
    session = await ctx.stripe.checkout.sessions.create({
      mode: "payment",
      line_items: [{ quantity: 1, price_data: { currency: inv.currency.toLowerCase(), unit_amount: due, product_data: { name: `Invoice ${inv.number}` } } }],
      customer_email: account.billingEmail,
      client_reference_id: String(inv.id),
      metadata: { invoiceId: String(inv.id), invoiceNumber: inv.number },
      payment_intent_data: { metadata: { invoiceId: String(inv.id), invoiceNumber: inv.number } },
      success_url: `${base}/pay/return?invoice=${inv.id}&session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${base}/pay/return?invoice=${inv.id}&cancelled=1`,
    }, { idempotencyKey: `checkout-${inv.id}-${due}-${inv.paidCents}-${Math.floor(ctx.clock.now().getTime() / 60000)}` });
  } catch (err) {
    if (isConnectionError(err)) throw unavailable();
    throw err;
  }
  await ctx.dataSource.getRepository(CheckoutSessionRecord).save({ id: session.id, invoiceId: inv.id, amountCents: due, url: session.url!, status: "open", expiresAt: new Date((session.expires_at ?? 0) * 1000) });
  return { url: session.url! };
}

// ---- webhooks ------------------------------------------------------------------------------------

/**
 * Verify the signature on the raw body, then handle each event once (recorded by id, in the same
 * transaction as its effect). A payment is keyed by its payment intent, so the session-completed and
 * payment-succeeded events for one payment, in any order or repeated, record it once.
 */
export async function handleWebhook(ctx: AppContext, raw: Buffer, signature: string | undefined): Promise<{ handled: boolean }> {
  let event: Stripe.Event;
  try {
    event = ctx.stripe.webhooks.constructEvent(raw, signature ?? "", ctx.config.stripe.webhookSecret);
  } catch {
    throw badRequest("The webhook signature did not verify.");
  }
  return ctx.dataSource.transaction(async (m) => {
    try {
      await m.getRepository(StripeEventRecord).insert({ id: event.id, type: event.type });
    } catch (err) {
      if ((err as { driverError?: { errno?: number } }).driverError?.errno === 1062) return { handled: false };
      throw err;
    }
    switch (event.type) {
      case "checkout.session.completed": {
        const s = event.data.object as Stripe.Checkout.Session;
        const invoiceId = Number(s.metadata?.invoiceId);
        await m.getRepository(CheckoutSessionRecord).update({ id: s.id }, { status: "complete" });
        if (invoiceId && s.payment_status === "paid" && typeof s.payment_intent === "string") {
          const pi = await ctx.stripe.paymentIntents.retrieve(s.payment_intent).catch(() => null);
          const charge = pi && typeof pi.latest_charge === "string" ? pi.latest_charge : null;
          const p = await recordPayment(ctx, m, { invoiceId, amountCents: s.amount_total ?? 0, method: "card", reference: s.id, stripePaymentIntentId: s.payment_intent, stripeChargeId: charge });
          if (p) await queueReceipt(ctx, m, invoiceId, p.amountCents, "card");
        }
        break;
      }
      case "payment_intent.succeeded": {
        const pi = event.data.object as Stripe.PaymentIntent;
        const invoiceId = Number(pi.metadata?.invoiceId);
        if (invoiceId) {
          const p = await recordPayment(ctx, m, { invoiceId, amountCents: pi.amount_received || pi.amount, method: "card", reference: pi.id, stripePaymentIntentId: pi.id, stripeChargeId: typeof pi.latest_charge === "string" ? pi.latest_charge : null });
          if (p) await queueReceipt(ctx, m, invoiceId, p.amountCents, "card");
        }
        break;
      }
      case "charge.refunded": {
        const ch = event.data.object as Stripe.Charge;
        const pi = typeof ch.payment_intent === "string" ? ch.payment_intent : ch.payment_intent?.id ?? null;
        const payment = (await m.getRepository(Payment).findOneBy({ stripeChargeId: ch.id })) ?? (pi ? await m.getRepository(Payment).findOneBy({ stripePaymentIntentId: pi }) : null);
        if (!payment) {
          // The payment's own events have not landed yet: refuse, so this event is rolled back and Stripe retries it.
          if (pi || ch.metadata?.invoiceId) throw new HttpError(409, "payment_not_seen_yet", "The payment for this refund is not recorded yet; retry later.");
          break;
        }
        if (!payment.stripeChargeId) await m.getRepository(Payment).update({ id: payment.id }, { stripeChargeId: ch.id });
        const refunds = ch.refunds?.data?.length ? ch.refunds.data : (await ctx.stripe.refunds.list({ charge: ch.id, limit: 100 })).data;
        for (const r of refunds) await recordRefund(ctx, m, { invoiceId: payment.invoiceId, stripeRefundId: r.id, stripeChargeId: ch.id, amountCents: r.amount });
        break;
      }
      default:
        break; // payment_intent.payment_failed, payout.paid and others: recorded, nothing to change here
    }
    return { handled: true };
  });
}

async function queueReceipt(ctx: AppContext, m: import("typeorm").EntityManager, invoiceId: number, amountCents: number, method: string) {
  const inv = await m.getRepository(Invoice).findOneByOrFail({ id: invoiceId });
  const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: inv.accountId });
  const bakery = await getBakery(ctx, m);
  const mail = receiptMail({ bakeryName: bakery.name, currency: bakery.currency, number: inv.number, amountCents, method, url: `${ctx.config.publicUrl}/buyer/invoices/${inv.id}` });
  await enqueueMail(m, ctx, "receipt", { to: account.billingEmail, fromName: bakery.name, ...mail });
}

// ---- credit notes -----------------------------------------------------------------------------

/**
 * A credit note against an invoice for short or damaged goods: applied to what is still owed, refunded
 * through Stripe when it was paid by card, or carried to the account's next invoice.
 */
export async function issueCreditNote(ctx: AppContext, invoiceId: number, input: { reason: string; lines: { description: string; quantity: number; unitPriceCents: number }[]; carry?: boolean }) {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneBy({ id: invoiceId });
  if (!inv) throw notFound("That invoice");
  if (inv.status === "void") throw conflict("invoice_void", "This invoice is void.");
  const lines = input.lines.map((l) => ({ ...l, amountCents: l.quantity * l.unitPriceCents }));
  const subtotal = lines.reduce((s, l) => s + l.amountCents, 0);
  const total = subtotal + taxCents(subtotal, inv.taxRateBp);
  const due = amountDue(inv);
  const cardPayment = await ctx.dataSource.getRepository(Payment).findOne({ where: { invoiceId, method: "card" }, order: { id: "DESC" } });
  // What can go back to the card is what that card payment brought in, less what was already refunded on it.
  const refundedOnCard = cardPayment?.stripeChargeId
    ? Number((await ctx.dataSource.query("SELECT COALESCE(SUM(amountCents), 0) AS s FROM refund WHERE stripeChargeId = ?", [cardPayment.stripeChargeId]))[0].s)
    : 0;
  const refundable = cardPayment ? Math.min(inv.paidCents - inv.refundedCents, cardPayment.amountCents - refundedOnCard) : 0;
  if (total > inv.totalCents - inv.creditedCents) throw badRequest("The credit is more than what remains on the invoice.", { lines: "Too much." });
  const creditCount = await ctx.dataSource.getRepository(CreditNote).countBy({ invoiceId });
  if (!input.carry && due >= total) {
    return ctx.dataSource.transaction((m) => createCreditNote(ctx, m, inv, lines, input.reason, "applied"));
  }
  if (!input.carry && cardPayment?.stripePaymentIntentId && refundable >= total) {
    let refund: Stripe.Refund;
    try {
      // The key stays the same when this is retried after a failure: Stripe then returns the first refund, never a second.
      refund = await ctx.stripe.refunds.create({ payment_intent: cardPayment.stripePaymentIntentId, amount: total, reason: "requested_by_customer", metadata: { invoiceId: String(inv.id) } }, { idempotencyKey: `credit-${inv.id}-${creditCount}-${total}` });
    } catch (err) {
      if (isConnectionError(err)) throw unavailable();
      throw err;
    }
    return retryOnDeadlock(() => ctx.dataSource.transaction(async (m) => {
      if (await m.getRepository(CreditNote).existsBy({ stripeRefundId: refund.id })) throw conflict("already_refunded", "This credit was already refunded.");
      const cn = await createCreditNote(ctx, m, inv, lines, input.reason, "refund", refund.id);
      const recorded = await recordRefund(ctx, m, { invoiceId: inv.id, stripeRefundId: refund.id, stripeChargeId: typeof refund.charge === "string" ? refund.charge : null, amountCents: refund.amount, creditNoteId: cn.id });
      if (!recorded) {
        // The charge.refunded webhook recorded this refund first: link it to the credit note.
        await m.getRepository(Refund).update({ stripeRefundId: refund.id }, { creditNoteId: cn.id });
      }
      return cn;
    }));
  }
  return ctx.dataSource.transaction((m) => createCreditNote(ctx, m, inv, lines, input.reason, "carry"));
}

// ---- payouts and reconciliation ------------------------------------------------------------------

export async function listPayouts(ctx: AppContext) {
  let payouts: Stripe.Payout[];
  try {
    payouts = await ctx.stripe.payouts.list({ limit: 100 }).autoPagingToArray({ limit: 1000 });
  } catch (err) {
    if (isConnectionError(err)) throw unavailable();
    throw err;
  }
  const rec = new Map((await ctx.dataSource.getRepository(PayoutReconciliation).find()).map((r) => [r.payoutId, r]));
  return payouts.map((p) => ({ id: p.id, amountCents: p.amount, currency: p.currency, status: p.status, arrivalDate: new Date(p.arrival_date * 1000).toISOString().slice(0, 10), created: new Date(p.created * 1000).toISOString(), reconciledAt: rec.get(p.id)?.reconciledAt.toISOString() ?? null, reconciledById: rec.get(p.id)?.reconciledById ?? null }));
}

/** A payout's balance transactions (listed by the SDK) matched to Panwise's payments and refunds. */
export async function payoutDetail(ctx: AppContext, payoutId: string) {
  let payout: Stripe.Payout;
  let txns: Stripe.BalanceTransaction[];
  try {
    payout = await ctx.stripe.payouts.retrieve(payoutId);
    txns = await ctx.stripe.balanceTransactions.list({ payout: payoutId, limit: 100 }).autoPagingToArray({ limit: 10000 });
  } catch (err) {
    if (isConnectionError(err)) throw unavailable();
    if ((err as { code?: string }).code === "resource_missing") throw notFound("That payout");
    throw err;
  }
  const chargeIds = txns.filter((t) => t.type === "charge" || t.type === "payment").map((t) => String(t.source));
  const refundIds = txns.filter((t) => t.type === "refund").map((t) => String(t.source));
  const payments = chargeIds.length ? await ctx.dataSource.getRepository(Payment).findBy({ stripeChargeId: In(chargeIds) }) : [];
  const refunds = refundIds.length ? await ctx.dataSource.getRepository(Refund).findBy({ stripeRefundId: In(refundIds) }) : [];
  const invoiceIds = [...new Set([...payments.map((p) => p.invoiceId), ...refunds.map((r) => r.invoiceId)])];
  const invoices = new Map((invoiceIds.length ? await ctx.dataSource.getRepository(Invoice).findBy({ id: In(invoiceIds) }) : []).map((i) => [i.id, i]));
  const rows = txns.filter((t) => t.type !== "payout").map((t) => {
    const p = payments.find((x) => x.stripeChargeId === t.source);
    const r = refunds.find((x) => x.stripeRefundId === t.source);
    const invoiceId = p?.invoiceId ?? r?.invoiceId ?? null;
    const inv = invoiceId ? invoices.get(invoiceId) : undefined;
    const amountMatches = p ? p.amountCents === t.amount : r ? -r.amountCents === t.amount : false;
    return {
      balanceTransactionId: t.id, type: t.type, source: String(t.source), amountCents: t.amount, feeCents: t.fee, netCents: t.net,
      invoiceId, invoiceNumber: inv?.number ?? null, paymentId: p?.id ?? null, refundId: r?.id ?? null,
      matched: !!inv && amountMatches, problem: !inv ? "No Panwise payment or refund for this transaction." : !amountMatches ? "The amount differs from what Panwise recorded." : null,
    };
  });
  const sum = (f: (r: (typeof rows)[number]) => number) => rows.reduce((s, r) => s + f(r), 0);
  const rec = await ctx.dataSource.getRepository(PayoutReconciliation).findOneBy({ payoutId });
  const net = sum((r) => r.netCents);
  return {
    payout: { id: payout.id, amountCents: payout.amount, currency: payout.currency, status: payout.status, arrivalDate: new Date(payout.arrival_date * 1000).toISOString().slice(0, 10) },
    grossCents: sum((r) => (r.type === "refund" ? 0 : r.amountCents)), feesCents: sum((r) => r.feeCents), refundsCents: sum((r) => (r.type === "refund" ? -r.amountCents : 0)), netCents: net,
    netMatchesPayout: net === payout.amount,
    transactions: rows,
    unmatched: rows.filter((r) => !r.matched).length,
    reconciled: rec ? { at: rec.reconciledAt.toISOString(), byId: rec.reconciledById, note: rec.note } : null,
  };
}

export async function reconcilePayout(ctx: AppContext, actor: SessionUser, payoutId: string, note: string, force: boolean) {
  const detail = await payoutDetail(ctx, payoutId);
  if ((detail.unmatched > 0 || !detail.netMatchesPayout) && !force) {
    throw conflict("payout_unmatched", `${detail.unmatched} transaction(s) do not match${detail.netMatchesPayout ? "" : " and the net differs from the payout"}. Check them, or mark it reconciled anyway with a note.`);
  }
  await ctx.dataSource.getRepository(PayoutReconciliation).save({ payoutId, reconciledById: actor.id, reconciledAt: ctx.clock.now(), note });
  return payoutDetail(ctx, payoutId);
}

// ---- aging and exports -----------------------------------------------------------------------

export async function aging(ctx: AppContext) {
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
  const list = [...rows].map(([accountId, b]) => ({ accountId, accountName: accounts.get(accountId)?.businessName ?? "", onHold: accounts.get(accountId)?.status === "on_hold", ...b })).sort((a, b) => b.total - a.total);
  const totals = Object.fromEntries([...AGING_BUCKETS, "total"].map((k) => [k, list.reduce((s, r) => s + (r as unknown as Record<string, number>)[k], 0)]));
  return { today, buckets: AGING_BUCKETS, accounts: list, totals };
}

/**
 * CSV exports (RFC 4180 through csv-stringify). Column spec, documented in DEVELOPERS.md: amounts are
 * decimal in the currency's units with the ISO 4217 code in its own column; dates YYYY-MM-DD.
 */
export async function exportCsv(ctx: AppContext, kind: "invoices" | "payments" | "payouts"): Promise<string> {
  const accounts = new Map((await ctx.dataSource.getRepository(CustomerAccount).find()).map((a) => [a.id, a.businessName]));
  if (kind === "invoices") {
    const rows = await ctx.dataSource.getRepository(Invoice).find({ order: { id: "ASC" } });
    return stringify([["number", "account", "kind", "status", "issue_date", "due_date", "currency", "subtotal", "tax", "total", "credited", "paid", "refunded", "amount_due"],
      ...rows.map((i) => [i.number, accounts.get(i.accountId) ?? "", i.kind, i.status, i.issueDate, i.dueDate, i.currency, toDecimal(i.subtotalCents, i.currency), toDecimal(i.taxCents, i.currency), toDecimal(i.totalCents, i.currency), toDecimal(i.creditedCents, i.currency), toDecimal(i.paidCents, i.currency), toDecimal(i.refundedCents, i.currency), toDecimal(amountDue(i), i.currency)])]);
  }
  if (kind === "payments") {
    const rows = await ctx.dataSource.getRepository(Payment).find({ order: { id: "ASC" } });
    const invoices = new Map((await ctx.dataSource.getRepository(Invoice).find()).map((i) => [i.id, i]));
    return stringify([["received_on", "invoice", "account", "method", "currency", "amount", "reference", "stripe_payment_intent", "stripe_charge"],
      ...rows.map((p) => { const i = invoices.get(p.invoiceId)!; return [p.receivedOn, i.number, accounts.get(i.accountId) ?? "", p.method, i.currency, toDecimal(p.amountCents, i.currency), p.reference, p.stripePaymentIntentId ?? "", p.stripeChargeId ?? ""]; })]);
  }
  const payouts = await listPayouts(ctx);
  const out: (string | number)[][] = [["payout", "arrival_date", "status", "currency", "amount", "gross", "fees", "refunds", "net", "transactions", "unmatched", "reconciled_at"]];
  for (const p of payouts) {
    const d = await payoutDetail(ctx, p.id);
    const cur = p.currency.toUpperCase();
    out.push([p.id, p.arrivalDate, p.status, cur, toDecimal(p.amountCents, cur), toDecimal(d.grossCents, cur), toDecimal(d.feesCents, cur), toDecimal(d.refundsCents, cur), toDecimal(d.netCents, cur), d.transactions.length, d.unmatched, p.reconciledAt ?? ""]);
  }
  return stringify(out);
}

