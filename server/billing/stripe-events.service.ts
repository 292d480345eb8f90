import type Stripe from "stripe";
import { IsNull, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest } from "../http/errors";
import { CheckoutSessionRecord } from "./checkout-session.entity";
import { Invoice } from "./invoice.entity";
import { Payment } from "./payment.entity";
import { StripeEventRecord } from "./stripe-event.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { recordPayment, recordRefund } from "./ledger.service";
import { expireStaleSessions } from "./checkout.service";
import { isConnectionError, isMissing, unavailable } from "./stripe-errors";
import { enqueueMail } from "../mail/outbox.service";
import { receiptMail } from "../mail/templates";
import { PAYMENT_METHOD_LABELS } from "../../shared/billing";
import { retryOnDeadlock } from "../db/retry";
import { toDecimal } from "../../shared/money";

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

async function queueReceipt(ctx: AppContext, m: EntityManager, invoiceId: number, amountCents: number, method: keyof typeof PAYMENT_METHOD_LABELS) {
  const inv = await m.getRepository(Invoice).findOneByOrFail({ id: invoiceId });
  const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: inv.accountId });
  const bakery = await getBakery(ctx, m);
  const mail = receiptMail({ bakeryName: bakery.name, currency: bakery.currency, locale: bakery.locale, number: inv.number, amountCents, method: PAYMENT_METHOD_LABELS[method].toLowerCase(), url: `${ctx.config.publicUrl}/buyer/invoices/${inv.id}` });
  await enqueueMail(m, ctx, "receipt", { to: account.billingEmail, fromName: bakery.name, ...mail });
}
