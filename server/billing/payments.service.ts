import type Stripe from "stripe";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, conflict, notFound } from "../http/errors";
import { Invoice } from "./invoice.entity";
import { Payment } from "./payment.entity";
import { overpaidCents, recordPayment, recordRefund } from "./ledger.service";
import { expireStaleSessions } from "./checkout.service";
import { isConnectionError } from "./stripe-errors";
import { amountDue } from "../../shared/billing";
import { retryOnDeadlock } from "../db/retry";
import type { SessionUser } from "../../shared/schemas/auth";
import type { PaymentInput } from "../../shared/schemas/billing";
import type { OverpaymentRefundResult, RecordedPaymentDto } from "../../shared/contracts/billing";

// ---- manual payments ------------------------------------------------------------------------------

/** A payment received by transfer, check, cash or otherwise, recorded by the office: at most what is still owed. */
export async function recordManualPayment(ctx: AppContext, actor: SessionUser, invoiceId: number, input: PaymentInput): Promise<RecordedPaymentDto> {
  const payment = await ctx.dataSource.transaction(async (m) => {
    // Locked before the check, so two payments recorded at once cannot both pass it.
    const inv = await m.getRepository(Invoice).createQueryBuilder("i").setLock("pessimistic_write").where("i.id = :id", { id: invoiceId }).getOne();
    if (!inv) throw notFound("That invoice");
    if (inv.status === "void") throw conflict("invoice_void", "This invoice is void.");
    const due = amountDue(inv);
    if (input.amountCents > due) throw badRequest(`That is more than the ${due / 100} still owed.`, { amountCents: `At most ${(due / 100).toFixed(2)}.` });
    return recordPayment(ctx, m, { invoiceId, amountCents: input.amountCents, method: input.method, reference: input.reference, receivedOn: input.receivedOn, recordedById: actor.id });
  });
  // recordPayment answers null only for a payment intent recorded before; a manual payment has none.
  if (!payment) throw new Error("a manual payment was not recorded");
  return recordedPaymentDto(payment);
}

/** The stored row, as the API has always answered it. */
function recordedPaymentDto(p: Payment): RecordedPaymentDto {
  return {
    id: p.id, invoiceId: p.invoiceId, method: p.method, amountCents: p.amountCents, reference: p.reference, stripePaymentIntentId: p.stripePaymentIntentId,
    stripeChargeId: p.stripeChargeId, receivedOn: p.receivedOn, recordedById: p.recordedById, createdAt: p.createdAt.toISOString(),
  };
}

/** A manual payment (transfer, check, cash), then any open card page that no longer matches what is owed is expired. */
export async function recordManualPaymentAndExpire(ctx: AppContext, actor: SessionUser, invoiceId: number, input: PaymentInput): Promise<RecordedPaymentDto> {
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
export async function refundOverpayment(ctx: AppContext, invoiceId: number): Promise<OverpaymentRefundResult> {
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
