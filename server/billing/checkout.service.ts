import type Stripe from "stripe";
import type { AppContext } from "../http/context";
import { conflict, notFound } from "../http/errors";
import { CheckoutSessionRecord } from "./checkout-session.entity";
import { Invoice } from "./invoice.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { isConnectionError, unavailable } from "./stripe-errors";
import { amountDue } from "../../shared/billing";
import type { SessionUser } from "../../shared/schemas/auth";
import type { CheckoutDto } from "../../shared/contracts/billing";

// ---- checkout --------------------------------------------------------------------------------

/**
 * A hosted checkout session for what is due on an invoice. Stripe is called first; only a session it
 * created is stored, so an outage leaves nothing half-made.
 */
export async function createCheckout(ctx: AppContext, actor: SessionUser, invoiceId: number): Promise<CheckoutDto> {
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
