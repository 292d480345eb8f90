import type Stripe from "stripe";
import type { AppContext } from "../http/context";
import { badRequest, conflict, notFound } from "../http/errors";
import { CreditNote } from "./credit-note.entity";
import { Invoice } from "./invoice.entity";
import { Payment } from "./payment.entity";
import { Refund } from "./refund.entity";
import { createCreditNote, recordRefund } from "./ledger.service";
import { expireStaleSessions } from "./checkout.service";
import { isConnectionError, unavailable } from "./stripe-errors";
import { amountDue, taxCents } from "../../shared/billing";
import { retryOnDeadlock } from "../db/retry";
import type { CreditNoteInput } from "../../shared/schemas/billing";
import type { CreditNoteResult } from "../../shared/contracts/billing";

// ---- credit notes -----------------------------------------------------------------------------

/**
 * A credit note against an invoice for short or damaged goods: applied to what is still owed, refunded
 * through Stripe when it was paid by card, or carried to the account's next invoice.
 */
export async function issueCreditNote(ctx: AppContext, invoiceId: number, input: CreditNoteInput): Promise<CreditNoteResult> {
  const cn = await creditNoteAndRefund(ctx, invoiceId, input);
  // What is owed may have changed: a payment page for the old amount must not stay payable.
  await expireStaleSessions(ctx, invoiceId);
  return { id: cn.id, number: cn.number, totalCents: cn.totalCents, disposition: cn.disposition };
}

async function creditNoteAndRefund(ctx: AppContext, invoiceId: number, input: CreditNoteInput): Promise<CreditNote> {
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
