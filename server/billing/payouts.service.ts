import type Stripe from "stripe";
import { In } from "typeorm";
import type { AppContext } from "../http/context";
import { conflict, notFound } from "../http/errors";
import { Invoice } from "./invoice.entity";
import { Payment } from "./payment.entity";
import { PayoutReconciliationEvent } from "./payout-reconciliation-event.entity";
import { PayoutReconciliation } from "./payout-reconciliation.entity";
import { Refund } from "./refund.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { getBakery } from "../bakery/bakery.service";
import { isConnectionError, unavailable } from "./stripe-errors";
import { localToday } from "../../shared/calendar";
import type { SessionUser } from "../../shared/schemas/auth";
import type { PayoutDetailDto, PayoutDto } from "../../shared/contracts/billing";

// ---- payouts and reconciliation ------------------------------------------------------------------

export async function listPayouts(ctx: AppContext): Promise<PayoutDto[]> {
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
export async function payoutDetail(ctx: AppContext, payoutId: string): Promise<PayoutDetailDto> {
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
    history: await reconciliationHistory(ctx, payoutId),
  };
}

async function reconciliationHistory(ctx: AppContext, payoutId: string): Promise<PayoutDetailDto["history"]> {
  const events = await ctx.dataSource.getRepository(PayoutReconciliationEvent).find({ where: { payoutId }, order: { id: "ASC" } });
  const names = new Map((events.length ? await ctx.dataSource.getRepository(User).findBy({ id: In(events.map((e) => e.byId)) }) : []).map((u) => [u.id, u.name]));
  return events.map((e) => ({ action: e.action, at: e.at.toISOString(), byId: e.byId, byName: names.get(e.byId) ?? null, note: e.note }));
}

/** Take a reconciliation back (a payout marked reconciled by mistake), with the reason kept in its history. */
export async function undoReconcile(ctx: AppContext, actor: SessionUser, payoutId: string, reason: string): Promise<PayoutDetailDto> {
  await ctx.dataSource.transaction(async (m) => {
    const rec = await m.getRepository(PayoutReconciliation).findOneBy({ payoutId });
    if (!rec) throw conflict("not_reconciled", "This payout is not reconciled, so there is nothing to undo.");
    await m.getRepository(PayoutReconciliation).delete({ payoutId });
    await m.getRepository(PayoutReconciliationEvent).insert({ payoutId, action: "undone", byId: actor.id, at: ctx.clock.now(), note: reason });
  });
  ctx.logger.info({ payoutId, by: actor.id }, "payout reconciliation undone");
  return payoutDetail(ctx, payoutId);
}

export async function reconcilePayout(ctx: AppContext, actor: SessionUser, payoutId: string, note: string, force: boolean): Promise<PayoutDetailDto> {
  const detail = await payoutDetail(ctx, payoutId);
  if ((detail.unmatched > 0 || !detail.netMatchesPayout) && !force) {
    throw conflict("payout_unmatched", `${detail.unmatched} transaction(s) do not match${detail.netMatchesPayout ? "" : " and the net differs from the payout"}. Check them, or mark it reconciled anyway with a note.`);
  }
  await ctx.dataSource.transaction(async (m) => {
    await m.getRepository(PayoutReconciliation).save({ payoutId, reconciledById: actor.id, reconciledAt: ctx.clock.now(), note });
    await m.getRepository(PayoutReconciliationEvent).insert({ payoutId, action: "reconciled", byId: actor.id, at: ctx.clock.now(), note });
  });
  return payoutDetail(ctx, payoutId);
}
