import type Stripe from "stripe";
import { stringify } from "csv-stringify/sync";
import { In, IsNull, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, conflict, notFound } from "../http/errors";
import { CheckoutSessionRecord } from "./checkout-session.entity";
import { CreditNote } from "./credit-note.entity";
import { Invoice } from "./invoice.entity";
import { Payment } from "./payment.entity";
import { PayoutReconciliation } from "./payout-reconciliation.entity";
import { Refund } from "./refund.entity";
import { StripeEventRecord } from "./stripe-event.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { createCreditNote, overpaidCents, recordManualPayment, recordPayment, recordRefund } from "./invoices.service";
import { enqueueMail } from "../mail/outbox.service";
import { receiptMail } from "../mail/templates";
import { AGING_BUCKETS, INVOICE_KIND_LABELS, INVOICE_STATUS_LABELS, PAYMENT_METHOD_LABELS, agingBucket, amountDue, payoutStatusLabel, taxCents, type AgingBucket } from "../../shared/billing";
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
      metadata: { invoiceId: String(inv.id), invoiceNumber: inv.number, payee: (await getBakery(ctx)).name }, // payee: the name the payment page shows
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

// ---- Stripe events: one code path for webhooks and the catch-up job ------------------------------

/**
 * Stripe's tolerance for webhook timestamps: 5 minutes (Stripe docs, "Verify webhook signatures": the
 * SDKs' default tolerance of 300 s between the signed timestamp and now protects against replay).
 */
export const WEBHOOK_TOLERANCE_SEC = 300;

/** An event that does not match what Panwise created and what Stripe answers: recorded as rejected, never applied. */
class Rejection extends Error {}
const reject = (message: string) => new Rejection(message);

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => !!v && typeof v === "object" && !Array.isArray(v);
const text = (o: Obj, k: string): string | undefined => (typeof o[k] === "string" ? (o[k] as string) : undefined);
const idOf = (v: unknown): string | undefined => (typeof v === "string" ? v : isObj(v) && typeof v.id === "string" ? v.id : undefined);
const num = (o: Obj, k: string): number | undefined => (typeof o[k] === "number" ? (o[k] as number) : undefined);
/** An invoice id as an event may name it: a whole number that fits the column, or nothing. */
const invoiceIdFrom = (v: unknown): number | null => {
  const n = typeof v === "string" && /^\d{1,10}$/.test(v) ? Number(v) : typeof v === "number" ? v : NaN;
  return Number.isInteger(n) && n > 0 && n <= 2147483647 ? n : null;
};
const claimedInvoice = (o: Obj): number | null => invoiceIdFrom(isObj(o.metadata) ? o.metadata.invoiceId : undefined) ?? invoiceIdFrom(o.client_reference_id);
const money = (cents: number, currency: string) => `${toDecimal(cents, currency.toUpperCase())} ${currency.toUpperCase()}`;
const isMissing = (err: unknown) => (err as { code?: string; statusCode?: number })?.code === "resource_missing" || (err as { statusCode?: number })?.statusCode === 404;

/** The `t=` of a Stripe-Signature header (`t=<unix>,v1=<hex>`), when there is exactly one. */
function signedAt(header: string): number | null {
  const ts = header.split(",").map((kv) => kv.trim().split("=")).filter(([k]) => k === "t");
  if (ts.length !== 1 || !/^\d{1,12}$/.test(ts[0][1] ?? "")) return null;
  return Number(ts[0][1]);
}

/**
 * The signature on the raw body (the SDK's constructEvent), the timestamp within the tolerance both ways
 * (the SDK checks only that it is not too old; a timestamp a year ahead passed), and the shape of an event.
 */
export function verifyWebhook(ctx: AppContext, raw: Buffer, signature: string | undefined): Stripe.Event {
  let parsed: unknown;
  try {
    parsed = ctx.stripe.webhooks.constructEvent(raw, signature ?? "", ctx.config.stripe.webhookSecret, WEBHOOK_TOLERANCE_SEC);
  } catch (err) {
    if ((err as { type?: string }).type === "StripeSignatureVerificationError") throw badRequest("The webhook signature did not verify.");
    throw badRequest("The webhook payload is not a Stripe event: it is not JSON."); // signed, but not JSON
  }
  // The signature is over the sender's wall-clock time, so it is compared with this machine's, not the business clock.
  const t = signedAt(signature ?? "");
  if (t === null || t - Math.floor(Date.now() / 1000) > WEBHOOK_TOLERANCE_SEC) {
    throw badRequest(`The webhook signature's timestamp is more than ${WEBHOOK_TOLERANCE_SEC} seconds in the future.`);
  }
  const e = parsed as Obj;
  const ok = isObj(e) && typeof e.id === "string" && e.id.length > 0 && e.id.length <= 80 && typeof e.type === "string" && e.type.length > 0 && e.type.length <= 60 && isObj(e.data) && isObj((e.data as Obj).object);
  if (!ok) throw badRequest("The webhook payload is not a Stripe event (an object with an id, a type and data.object).");
  return parsed as Stripe.Event;
}

export interface EventResult {
  /** False when the event had been seen before (by id). */
  handled: boolean;
  outcome?: "applied" | "rejected";
  reason?: string;
}

/**
 * Verify the signature, then handle the event once. 2xx for every authentic event, rejected ones included:
 * Stripe treats anything else as a failed delivery and retries it for up to three days (Stripe docs,
 * "Webhooks": return a 2xx quickly; non-2xx are retried), and a rejection is final, so a retry would only
 * repeat it. 400 for a bad signature or a payload that is not an event; 503 when Stripe itself cannot be
 * asked (then the retry is wanted).
 */
export async function handleWebhook(ctx: AppContext, raw: Buffer, signature: string | undefined): Promise<EventResult> {
  return handleEvent(ctx, verifyWebhook(ctx, raw, signature), "webhook");
}

interface Plan {
  invoiceId: number | null;
  apply(m: EntityManager): Promise<void>;
  /** After the commit: calls to Stripe that follow from the change (expiring pages that no longer match). */
  after?(): Promise<void>;
}
const noop = (invoiceId: number | null): Plan => ({ invoiceId, apply: async () => undefined });

/**
 * The one code path for an event, whether a webhook delivered it or the catch-up job found it: what it
 * claims is checked against Panwise's own records and what Stripe answers when asked, outside any
 * transaction; then the event id and its effect are written in one transaction (a replay changes nothing).
 */
export async function handleEvent(ctx: AppContext, event: Stripe.Event, source: "webhook" | "catch-up"): Promise<EventResult> {
  const events = ctx.dataSource.getRepository(StripeEventRecord);
  if (await events.existsBy({ id: event.id })) return { handled: false };
  const object = event.data.object as unknown as Obj;
  const record = { id: event.id, type: event.type, source, stripeCreated: Number.isInteger(event.created) && event.created > 0 && event.created < 2 ** 31 ? event.created : null };
  let plan: Plan;
  try {
    plan = await planEvent(ctx, event.type, object);
  } catch (err) {
    if (!(err instanceof Rejection)) {
      if (isConnectionError(err)) throw unavailable();
      throw err;
    }
    const invoiceId = claimedInvoice(object);
    const reason = err.message.slice(0, 300);
    ctx.logger.warn({ eventId: event.id, type: event.type, invoiceId, source, reason }, "Stripe event rejected: not applied");
    try {
      await events.insert({ ...record, outcome: "rejected", reason, invoiceId: invoiceId && (await ctx.dataSource.getRepository(Invoice).existsBy({ id: invoiceId })) ? invoiceId : null });
    } catch (e) {
      if ((e as { driverError?: { errno?: number } }).driverError?.errno === 1062) return { handled: false };
      throw e;
    }
    return { handled: true, outcome: "rejected", reason };
  }
  const result = await retryOnDeadlock(() => ctx.dataSource.transaction(async (m): Promise<EventResult> => {
    try {
      await m.getRepository(StripeEventRecord).insert({ ...record, outcome: "applied", reason: "", invoiceId: plan.invoiceId });
    } catch (err) {
      if ((err as { driverError?: { errno?: number } }).driverError?.errno === 1062) return { handled: false };
      throw err;
    }
    await plan.apply(m);
    return { handled: true, outcome: "applied" };
  }));
  if (result.handled) await plan.after?.();
  return result;
}

async function planEvent(ctx: AppContext, type: string, o: Obj): Promise<Plan> {
  switch (type) {
    case "checkout.session.completed":
      return planSessionPayment(ctx, o, { sessionId: text(o, "id"), paymentIntentId: idOf(o.payment_intent), invoiceId: claimedInvoice(o), amount: num(o, "amount_total"), currency: text(o, "currency") });
    case "payment_intent.succeeded":
      return planIntentPayment(ctx, o);
    case "charge.refunded":
      return planRefunds(ctx, o);
    case "checkout.session.expired": {
      const id = text(o, "id");
      const rec = id ? await ctx.dataSource.getRepository(CheckoutSessionRecord).findOneBy({ id }) : null;
      if (!rec || rec.status !== "open") return noop(rec?.invoiceId ?? null);
      const s = await ctx.stripe.checkout.sessions.retrieve(rec.id).catch((err) => { if (isMissing(err)) throw reject(`Stripe has no checkout session ${rec.id}.`); throw err; });
      return { invoiceId: rec.invoiceId, apply: async (m) => { if (s.status === "expired") await m.getRepository(CheckoutSessionRecord).update({ id: rec.id }, { status: "expired" }); } };
    }
    default:
      return noop(null); // payment_intent.payment_failed, payout.paid and others: recorded, nothing to change here
  }
}

interface PaymentClaim { sessionId?: string; paymentIntentId?: string; invoiceId: number | null; amount?: number; currency?: string }

/** A payment Panwise already recorded: the event may repeat it, but not say something else about it. */
async function checkAgainstKnown(ctx: AppContext, known: Payment, claim: PaymentClaim): Promise<Plan> {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneByOrFail({ id: known.invoiceId });
  if (claim.invoiceId && claim.invoiceId !== known.invoiceId) throw reject(`The event names invoice ${claim.invoiceId}, but this payment belongs to another invoice (${inv.number}).`);
  if (claim.amount !== undefined && claim.amount !== known.amountCents) throw reject(`The event's amount (${claim.amount}) differs from the payment Stripe took (${money(known.amountCents, inv.currency)}).`);
  if (claim.currency !== undefined && claim.currency.toUpperCase() !== inv.currency) throw reject(`The event's currency (${claim.currency}) is not the invoice's (${inv.currency}).`);
  return noop(known.invoiceId);
}

/**
 * checkout.session.completed (or a session the catch-up found paid): the session must be one Panwise created
 * for this invoice, and Stripe must say it is paid, in the invoice's currency, for exactly the amount Panwise
 * asked. The payment recorded is that amount, never the event's.
 */
async function planSessionPayment(ctx: AppContext, o: Obj, claim: PaymentClaim): Promise<Plan> {
  const sessionId = claim.sessionId;
  if (!sessionId) throw reject("The event names no checkout session.");
  const payments = ctx.dataSource.getRepository(Payment);
  const rec = await ctx.dataSource.getRepository(CheckoutSessionRecord).findOneBy({ id: sessionId });
  if (!rec) {
    // Recorded already under this session (the demo seed pays without a page of its own): a repeat, checked.
    const known = await payments.findOneBy({ reference: sessionId, method: "card" });
    if (known && (!claim.paymentIntentId || known.stripePaymentIntentId === claim.paymentIntentId)) return checkAgainstKnown(ctx, known, claim);
    throw reject(`Panwise did not create checkout session ${sessionId}.`);
  }
  const inv = await ctx.dataSource.getRepository(Invoice).findOneByOrFail({ id: rec.invoiceId });
  if (claim.invoiceId && claim.invoiceId !== rec.invoiceId) throw reject(`The event names invoice ${claim.invoiceId}, but checkout session ${sessionId} belongs to another invoice (${inv.number}).`);
  const knownByIntent = claim.paymentIntentId ? await payments.findOneBy({ stripePaymentIntentId: claim.paymentIntentId }) : null;
  if (knownByIntent) {
    if (knownByIntent.invoiceId !== rec.invoiceId) throw reject(`Payment intent ${claim.paymentIntentId} paid another invoice.`);
    const plan = await checkAgainstKnown(ctx, knownByIntent, { ...claim, amount: claim.amount ?? rec.amountCents });
    return { ...plan, apply: async (m) => void (await m.getRepository(CheckoutSessionRecord).update({ id: rec.id, status: "open" }, { status: "complete" })) };
  }
  let s: Stripe.Checkout.Session;
  try {
    s = await ctx.stripe.checkout.sessions.retrieve(sessionId, { expand: ["payment_intent"] });
  } catch (err) {
    if (isMissing(err)) throw reject(`Stripe has no checkout session ${sessionId}.`);
    throw err;
  }
  const pi = isObj(s.payment_intent) ? (s.payment_intent as Stripe.PaymentIntent) : null;
  if (s.metadata?.invoiceId !== String(rec.invoiceId) || (s.client_reference_id && s.client_reference_id !== String(rec.invoiceId))) throw reject(`Stripe says checkout session ${sessionId} belongs to another invoice.`);
  if (s.status !== "complete" || s.payment_status !== "paid" || !pi || pi.status !== "succeeded") throw reject(`Stripe says checkout session ${sessionId} is not paid (status ${s.status}, ${s.payment_status}).`);
  if (claim.paymentIntentId && claim.paymentIntentId !== pi.id) throw reject(`The event's payment intent (${claim.paymentIntentId}) is not the session's (${pi.id}).`);
  const cur = inv.currency;
  if ((s.currency ?? "").toUpperCase() !== cur || pi.currency.toUpperCase() !== cur) throw reject(`Stripe's currency (${s.currency}) is not the invoice's (${cur}).`);
  if (claim.currency !== undefined && claim.currency.toUpperCase() !== cur) throw reject(`The event's currency (${claim.currency}) is not the invoice's (${cur}).`);
  if (!(rec.amountCents > 0)) throw reject(`Checkout session ${sessionId} was made for no amount.`);
  if (s.amount_total !== rec.amountCents || pi.amount_received !== rec.amountCents) throw reject(`The amount Stripe took (${money(pi.amount_received, cur)}) differs from the ${money(rec.amountCents, cur)} Panwise asked for.`);
  if (claim.amount !== undefined && claim.amount !== rec.amountCents) throw reject(`The event's amount (${claim.amount}) differs from the ${money(rec.amountCents, cur)} of checkout session ${sessionId}.`);
  const charge = typeof pi.latest_charge === "string" ? pi.latest_charge : pi.latest_charge?.id ?? null;
  return {
    invoiceId: rec.invoiceId,
    async apply(m) {
      await m.getRepository(CheckoutSessionRecord).update({ id: rec.id }, { status: "complete" });
      const p = await recordPayment(ctx, m, { invoiceId: rec.invoiceId, amountCents: rec.amountCents, method: "card", reference: rec.id, stripePaymentIntentId: pi.id, stripeChargeId: charge });
      if (p) await queueReceipt(ctx, m, rec.invoiceId, p.amountCents, "card");
    },
    // What is owed changed: any other open page for this invoice no longer matches it.
    after: () => expireStaleSessions(ctx, rec.invoiceId).then(() => undefined),
  };
}

/** payment_intent.succeeded: found through its checkout session (Stripe's list by payment_intent), then as above. */
async function planIntentPayment(ctx: AppContext, o: Obj): Promise<Plan> {
  const piId = text(o, "id");
  const claim: PaymentClaim = { paymentIntentId: piId, invoiceId: claimedInvoice(o), amount: num(o, "amount_received") ?? num(o, "amount"), currency: text(o, "currency") };
  if (!piId) throw reject("The event names no payment intent.");
  const known = await ctx.dataSource.getRepository(Payment).findOneBy({ stripePaymentIntentId: piId });
  if (known) return checkAgainstKnown(ctx, known, claim);
  const sessions = await ctx.stripe.checkout.sessions.list({ payment_intent: piId, limit: 1 });
  const session = sessions.data[0];
  if (!session) throw reject(`Payment intent ${piId} was not paid through a checkout session Panwise created.`);
  return planSessionPayment(ctx, o, { ...claim, sessionId: session.id });
}

/**
 * charge.refunded: the refunds are read from Stripe (never from the event), each recorded once by id. A
 * refund of a payment not recorded yet records that payment first, checked as a session payment.
 */
async function planRefunds(ctx: AppContext, o: Obj): Promise<Plan> {
  const chargeId = text(o, "id");
  if (!chargeId) throw reject("The event names no charge.");
  let charge: Stripe.Charge;
  try {
    charge = await ctx.stripe.charges.retrieve(chargeId);
  } catch (err) {
    if (isMissing(err)) throw reject(`Stripe has no charge ${chargeId}.`);
    throw err;
  }
  const piId = idOf(charge.payment_intent);
  const repo = ctx.dataSource.getRepository(Payment);
  const payment = (await repo.findOneBy({ stripeChargeId: chargeId })) ?? (piId ? await repo.findOneBy({ stripePaymentIntentId: piId }) : null);
  let first: Plan | null = null;
  let invoiceId: number;
  let paidCents: number;
  if (payment) {
    invoiceId = payment.invoiceId;
    paidCents = payment.amountCents;
  } else {
    const session = piId ? (await ctx.stripe.checkout.sessions.list({ payment_intent: piId, limit: 1 })).data[0] : undefined;
    if (!session) throw reject(`Charge ${chargeId} is not a payment Panwise took.`);
    first = await planSessionPayment(ctx, {}, { sessionId: session.id, paymentIntentId: piId, invoiceId: null });
    invoiceId = first.invoiceId!;
    paidCents = charge.amount;
  }
  const inv = await ctx.dataSource.getRepository(Invoice).findOneByOrFail({ id: invoiceId });
  const claimedRefunded = num(o, "amount_refunded");
  // Refunds only grow: an earlier event may show less than Stripe does now, never more.
  if (claimedRefunded !== undefined && claimedRefunded > charge.amount_refunded) throw reject(`The event says ${claimedRefunded} was refunded on charge ${chargeId}; Stripe shows ${money(charge.amount_refunded, charge.currency)}.`);
  if (charge.currency.toUpperCase() !== inv.currency) throw reject(`Charge ${chargeId} is not in the invoice's currency (${inv.currency}).`);
  const refunds = (await ctx.stripe.refunds.list({ charge: chargeId, limit: 100 }).autoPagingToArray({ limit: 1000 }))
    .filter((r) => r.status !== "failed" && r.status !== "canceled");
  if (refunds.some((r) => !(r.amount > 0) || r.currency.toUpperCase() !== inv.currency)) throw reject(`A refund on charge ${chargeId} has an amount or currency Panwise cannot take.`);
  if (refunds.reduce((s, r) => s + r.amount, 0) > paidCents) throw reject(`The refunds on charge ${chargeId} are more than the payment.`);
  return {
    invoiceId,
    async apply(m) {
      if (first) await first.apply(m);
      await m.getRepository(Payment).update({ stripePaymentIntentId: piId ?? "", stripeChargeId: IsNull() }, { stripeChargeId: chargeId });
      // Oldest first, so the invoice's figures grow in the order Stripe made them.
      for (const r of [...refunds].reverse()) await recordRefund(ctx, m, { invoiceId, stripeRefundId: r.id, stripeChargeId: chargeId, amountCents: r.amount, overpayment: r.metadata?.purpose === "overpayment" });
    },
    // A refund can change what is owed too: no open page may ask for the old amount.
    after: () => expireStaleSessions(ctx, invoiceId).then(() => undefined),
  };
}

// ---- open payment pages that no longer match what is owed -------------------------------------------

/**
 * Expire the invoice's open checkout sessions whose amount is not what is owed now (Stripe API: "Expire a
 * Checkout Session", POST /v1/checkout/sessions/:id/expire — an expired session can no longer be paid).
 * Called after anything that changes what is owed. When Stripe cannot be reached the session stays open
 * here and the catch-up job expires it later. Returns how many were expired.
 */
export async function expireStaleSessions(ctx: AppContext, invoiceId: number): Promise<number> {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneBy({ id: invoiceId });
  if (!inv) return 0;
  const due = inv.status === "void" ? 0 : amountDue(inv);
  const open = await ctx.dataSource.getRepository(CheckoutSessionRecord).findBy({ invoiceId, status: "open" });
  let expired = 0;
  for (const s of open) {
    if (due > 0 && s.amountCents === due) continue;
    if (await expireSession(ctx, s)) expired++;
  }
  return expired;
}

async function expireSession(ctx: AppContext, s: CheckoutSessionRecord): Promise<boolean> {
  const repo = ctx.dataSource.getRepository(CheckoutSessionRecord);
  try {
    await ctx.stripe.checkout.sessions.expire(s.id);
    await repo.update({ id: s.id }, { status: "expired" });
    return true;
  } catch (err) {
    if (isConnectionError(err)) {
      ctx.logger.warn({ session: s.id, invoiceId: s.invoiceId }, "could not expire a checkout session (Stripe unreachable); the catch-up job will try again");
      return false;
    }
    // Not open at Stripe any more (paid a moment ago, or expired): keep what Stripe says. A payment arrives by its events.
    const now = await ctx.stripe.checkout.sessions.retrieve(s.id).catch(() => null);
    if (now && now.status && now.status !== "open") await repo.update({ id: s.id, status: "open" }, { status: now.status === "complete" ? "complete" : "expired" });
    else ctx.logger.warn({ err, session: s.id }, "could not expire a checkout session");
    return false;
  }
}

async function queueReceipt(ctx: AppContext, m: EntityManager, invoiceId: number, amountCents: number, method: keyof typeof PAYMENT_METHOD_LABELS) {
  const inv = await m.getRepository(Invoice).findOneByOrFail({ id: invoiceId });
  const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: inv.accountId });
  const bakery = await getBakery(ctx, m);
  const mail = receiptMail({ bakeryName: bakery.name, currency: bakery.currency, locale: bakery.locale, number: inv.number, amountCents, method: PAYMENT_METHOD_LABELS[method].toLowerCase(), url: `${ctx.config.publicUrl}/buyer/invoices/${inv.id}` });
  await enqueueMail(m, ctx, "receipt", { to: account.billingEmail, fromName: bakery.name, ...mail });
}

// ---- credit notes -----------------------------------------------------------------------------

/**
 * A credit note against an invoice for short or damaged goods: applied to what is still owed, refunded
 * through Stripe when it was paid by card, or carried to the account's next invoice.
 */
export async function issueCreditNote(ctx: AppContext, invoiceId: number, input: { reason: string; lines: { description: string; quantity: number; unitPriceCents: number }[]; carry?: boolean }): Promise<CreditNote> {
  const cn = await creditNoteAndRefund(ctx, invoiceId, input);
  // What is owed may have changed: a payment page for the old amount must not stay payable.
  await expireStaleSessions(ctx, invoiceId);
  return cn;
}

async function creditNoteAndRefund(ctx: AppContext, invoiceId: number, input: { reason: string; lines: { description: string; quantity: number; unitPriceCents: number }[]; carry?: boolean }): Promise<CreditNote> {
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

/** A manual payment (transfer, check, cash), then any open card page that no longer matches what is owed is expired. */
export async function recordManualPaymentAndExpire(ctx: AppContext, actor: SessionUser, invoiceId: number, input: Parameters<typeof recordManualPayment>[3]) {
  const payment = await recordManualPayment(ctx, actor, invoiceId, input);
  await expireStaleSessions(ctx, invoiceId);
  return payment;
}

// ---- overpayments ---------------------------------------------------------------------------------

/**
 * Give back what was paid beyond what the invoice owes (a card page paid after the invoice was settled
 * another way), to the card it came from, newest card payment first. Stripe refund reason "duplicate"
 * (Stripe API, Refunds: reason is duplicate, fraudulent or requested_by_customer); metadata purpose=overpayment
 * lets the charge.refunded event record it the same way. Retrying after a failure reuses the idempotency
 * key, so Stripe answers with the first refund instead of making a second.
 */
export async function refundOverpayment(ctx: AppContext, invoiceId: number): Promise<{ stripeRefundId: string; amountCents: number; refunds: { stripeRefundId: string; amountCents: number }[] }> {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneBy({ id: invoiceId });
  if (!inv) throw notFound("That invoice");
  const over = overpaidCents(inv);
  if (over <= 0) throw conflict("nothing_overpaid", "This invoice has not been paid more than it owes: there is nothing to refund.");
  const cards = await ctx.dataSource.getRepository(Payment).find({ where: { invoiceId, method: "card" }, order: { id: "DESC" } });
  const done: { stripeRefundId: string; amountCents: number }[] = [];
  let left = over;
  for (const p of cards) {
    if (left <= 0) break;
    if (!p.stripePaymentIntentId) continue;
    const [row] = await ctx.dataSource.query("SELECT COALESCE(SUM(amountCents), 0) AS s FROM refund WHERE invoiceId = ? AND stripeChargeId = ?", [invoiceId, p.stripeChargeId ?? ""]);
    const room = p.amountCents - Number(row.s);
    if (room <= 0) continue;
    const amount = Math.min(left, room);
    let refund: Stripe.Refund;
    try {
      refund = await ctx.stripe.refunds.create(
        { payment_intent: p.stripePaymentIntentId, amount, reason: "duplicate", metadata: { invoiceId: String(inv.id), invoiceNumber: inv.number, purpose: "overpayment" } },
        { idempotencyKey: `overpayment-${inv.id}-${p.id}-${inv.paidCents}-${inv.refundedCents}-${amount}` },
      );
    } catch (err) {
      if (isConnectionError(err)) throw new HttpError(503, "payments_unavailable", "Card payments are not reachable right now. Nothing was refunded; please try again in a minute.");
      throw err;
    }
    await retryOnDeadlock(() => ctx.dataSource.transaction((m) => recordRefund(ctx, m, { invoiceId, stripeRefundId: refund.id, stripeChargeId: typeof refund.charge === "string" ? refund.charge : p.stripeChargeId, amountCents: refund.amount, overpayment: true })));
    done.push({ stripeRefundId: refund.id, amountCents: refund.amount });
    left -= refund.amount;
  }
  if (!done.length) throw conflict("not_refundable_by_card", "The extra money did not come by card, so it cannot go back to a card: pay it back by transfer.");
  ctx.logger.info({ invoiceId, amountCents: over - left }, "overpayment refunded to the card");
  return { stripeRefundId: done[0].stripeRefundId, amountCents: done.reduce((s, r) => s + r.amountCents, 0), refunds: done };
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
  const accountIds = [...new Set([...invoices.values()].map((i) => i.accountId))];
  const accounts = new Map((accountIds.length ? await ctx.dataSource.getRepository(CustomerAccount).findBy({ id: In(accountIds) }) : []).map((a) => [a.id, a.businessName]));
  const { timeZone } = await getBakery(ctx);
  const rows = txns.filter((t) => t.type !== "payout").map((t) => {
    const p = payments.find((x) => x.stripeChargeId === t.source);
    const r = refunds.find((x) => x.stripeRefundId === t.source);
    const invoiceId = p?.invoiceId ?? r?.invoiceId ?? null;
    const inv = invoiceId ? invoices.get(invoiceId) : undefined;
    const amountMatches = p ? p.amountCents === t.amount : r ? -r.amountCents === t.amount : false;
    return {
      balanceTransactionId: t.id, type: t.type, source: String(t.source), amountCents: t.amount, feeCents: t.fee, netCents: t.net,
      invoiceId, invoiceNumber: inv?.number ?? null, paymentId: p?.id ?? null, refundId: r?.id ?? null,
      // What the bookkeeper reads first: whose invoice, and the day the money came in (the payment's received-on
      // date) or went back (the refund's day); otherwise the day the card processor booked it, in the bakery's zone.
      accountName: inv ? (accounts.get(inv.accountId) ?? null) : null,
      date: p?.receivedOn ?? localToday(r?.createdAt ?? new Date(t.created * 1000), timeZone),
      // The card processor's payment reference (its payment intent) when Panwise knows it; the charge otherwise.
      cardPaymentRef: p?.stripePaymentIntentId ?? (t.type === "charge" || t.type === "payment" ? String(t.source) : null),
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
  const list = [...rows].map(([accountId, b]) => ({ accountId, accountName: accounts.get(accountId)?.businessName ?? "", onHold: accounts.get(accountId)?.status === "on_hold", creditHold: accounts.get(accountId)?.status === "on_hold" && !!accounts.get(accountId)?.creditHold, ...b })).sort((a, b) => b.total - a.total);
  const totals = Object.fromEntries([...AGING_BUCKETS, "total"].map((k) => [k, list.reduce((s, r) => s + (r as unknown as Record<string, number>)[k], 0)]));
  return { today, buckets: AGING_BUCKETS, accounts: list, totals };
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
export async function exportCsv(ctx: AppContext, kind: "invoices" | "payments" | "payouts"): Promise<string> {
  const accounts = new Map((await ctx.dataSource.getRepository(CustomerAccount).find()).map((a) => [a.id, a.businessName]));
  if (kind === "invoices") {
    const rows = await ctx.dataSource.getRepository(Invoice).find({ order: { id: "ASC" } });
    return csvTable(INVOICE_CSV_COLUMNS,
      rows.map((i) => ({ currency: i.currency, cells: [i.number, accounts.get(i.accountId) ?? "", INVOICE_KIND_LABELS[i.kind], INVOICE_STATUS_LABELS[i.status], i.issueDate, i.dueDate, i.currency, i.subtotalCents, i.taxCents, i.totalCents, i.creditedCents, i.paidCents, i.refundedCents, amountDue(i)] })));
  }
  if (kind === "payments") {
    const rows = await ctx.dataSource.getRepository(Payment).find({ order: { id: "ASC" } });
    const invoices = new Map((await ctx.dataSource.getRepository(Invoice).find()).map((i) => [i.id, i]));
    return csvTable(PAYMENT_CSV_COLUMNS,
      rows.map((p) => { const i = invoices.get(p.invoiceId)!; return { currency: i.currency, cells: [p.receivedOn, i.number, accounts.get(i.accountId) ?? "", PAYMENT_METHOD_LABELS[p.method], i.currency, p.amountCents, p.reference, p.stripePaymentIntentId ?? "", p.stripeChargeId ?? ""] }; }));
  }
  const payouts = await listPayouts(ctx);
  const out: { currency: string; cells: (string | number | null)[] }[] = [];
  for (const p of payouts) {
    const d = await payoutDetail(ctx, p.id);
    const cur = p.currency.toUpperCase();
    out.push({ currency: cur, cells: [p.id, p.arrivalDate, payoutStatusLabel(p.status), cur, p.amountCents, d.grossCents, d.feesCents, d.refundsCents, d.netCents, String(d.transactions.length), String(d.unmatched), p.reconciledAt ?? ""] });
  }
  return csvTable(PAYOUT_CSV_COLUMNS, out);
}
