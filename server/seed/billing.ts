import { DateTime } from "luxon";
import { In } from "typeorm";
import type { AppContext } from "../http/context";
import { FixedClock } from "../clock";
import { CustomerAccount } from "../accounts/account.entity";
import { Bakery } from "../bakery/bakery.entity";
import { Invoice } from "../billing/invoice.entity";
import { Order } from "../orders/order.entity";
import { applyCreditHolds, issueInvoice, issueStatements } from "../billing/invoices.service";
import { recordPayment } from "../billing/ledger.service";
import { getBakery } from "../bakery/bakery.service";
import { amountDue } from "../../shared/billing";
import { DEMO_PAYMENT_INSTRUCTIONS } from "./demo";

/**
 * Pay an invoice the way a buyer would, through the Stripe fake's hosted page with Stripe's 4242 test
 * card, then record the payment from the session (the webhooks that follow find it already recorded).
 * False when Stripe is not reachable.
 */
export async function payByCardThroughStripe(ctx: AppContext, invoiceId: number): Promise<boolean> {
  const inv = await ctx.dataSource.getRepository(Invoice).findOneByOrFail({ id: invoiceId });
  const due = amountDue(inv);
  try {
    const session = await ctx.stripe.checkout.sessions.create({
      mode: "payment",
      line_items: [{ quantity: 1, price_data: { currency: inv.currency.toLowerCase(), unit_amount: due, product_data: { name: `Invoice ${inv.number}` } } }],
      metadata: { invoiceId: String(inv.id), invoiceNumber: inv.number },
      payment_intent_data: { metadata: { invoiceId: String(inv.id), invoiceNumber: inv.number } },
      success_url: `${ctx.config.publicUrl}/pay/return?invoice=${inv.id}&session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${ctx.config.publicUrl}/pay/return?invoice=${inv.id}&cancelled=1`,
    });
    const res = await fetch(session.url!, { method: "POST", redirect: "manual", headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ email: "accounts@tidewater.test", card_number: "4242 4242 4242 4242", expiry: "12/30", cvc: "123", name: "Tidewater Café" }) });
    if (res.status !== 303) return false;
    const paid = await ctx.stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent"] });
    const pi = paid.payment_intent as import("stripe").Stripe.PaymentIntent;
    await ctx.dataSource.transaction((m) => recordPayment(ctx, m, { invoiceId: inv.id, amountCents: due, method: "card", reference: session.id, stripePaymentIntentId: pi.id, stripeChargeId: typeof pi.latest_charge === "string" ? pi.latest_charge : null }));
    return true;
  } catch {
    return false;
  }
}

/**
 * Demo billing: invoices for the past weeks' deliveries as they would have been issued on their days,
 * most of them paid (Tidewater by card through the Stripe fake when it is running, the others by bank
 * transfer), the latest ones open, North Pier Coffee's first statement long overdue (so it is on credit
 * hold), and one Stripe payout. Only runs on a database that has no invoices yet.
 */
export async function seedBilling(ctx: AppContext, payByCard?: (ctx: AppContext, invoiceId: number) => Promise<boolean>): Promise<{ invoices: number; payments: number }> {
  if ((await ctx.dataSource.getRepository(Invoice).count()) > 0) return { invoices: 0, payments: 0 };
  const bakery = await getBakery(ctx);
  await ctx.dataSource.getRepository(Bakery).update({ id: bakery.id }, {
    salesTaxRateBp: bakery.salesTaxRateBp || 875,
    invoicePrefix: bakery.invoicePrefix === "INV" ? "HB" : bakery.invoicePrefix,
    paymentInstructions: bakery.paymentInstructions || DEMO_PAYMENT_INSTRUCTIONS,
  });
  const accounts = ctx.dataSource.getRepository(CustomerAccount);
  const terms: Record<string, CustomerAccount["paymentTerms"]> = { "Tidewater Café": "card", "Juniper Table": "net14", "North Pier Coffee": "net7" };
  for (const [name, t] of Object.entries(terms)) await accounts.update({ businessName: name }, { paymentTerms: t });

  const zone = bakery.timeZone;
  const at = (date: string, hm: string) => {
    const [h, m] = hm.split(":").map(Number);
    return new FixedClock(DateTime.fromISO(date, { zone }).set({ hour: h, minute: m }).toJSDate());
  };
  const withClock = (clock: FixedClock): AppContext => ({ ...ctx, clock });
  const delivered = await ctx.dataSource.getRepository(Order).find({ where: { status: "delivered" }, order: { deliveryDate: "ASC" } });
  const byId = new Map((await accounts.find()).map((a) => [a.id, a]));
  let invoices = 0;
  // Card accounts: an invoice on each delivery day, in the evening.
  for (const o of delivered) {
    const a = byId.get(o.accountId)!;
    if (terms[a.businessName] !== "card") continue;
    const c = withClock(at(o.deliveryDate, "18:00"));
    if (await ctx.dataSource.transaction((m) => issueInvoice(c, m, { ...a, paymentTerms: "card" }, [o.id], "order"))) invoices++;
  }
  // Accounts on terms: a statement each Monday morning for the weeks before.
  const mondays = [...new Set(delivered.map((o) => DateTime.fromISO(o.deliveryDate).startOf("week").plus({ weeks: 1 }).toISODate()!))].sort();
  const today = DateTime.fromJSDate(ctx.clock.now(), { zone }).toISODate()!;
  for (const monday of mondays.filter((d) => d <= today)) invoices += (await issueStatements(withClock(at(monday, "09:00")))).length;

  // Payments: everything older than a week is paid, except North Pier's first statement.
  const all = await ctx.dataSource.getRepository(Invoice).find({ order: { id: "ASC" } });
  const northPier = [...byId.values()].find((a) => a.businessName === "North Pier Coffee");
  const firstNorthPier = all.find((i) => i.accountId === northPier?.id);
  let payments = 0;
  for (const inv of all) {
    if (inv === firstNorthPier) continue;
    if (DateTime.fromISO(inv.issueDate) > DateTime.fromISO(today).minus({ days: 7 })) continue;
    const due = amountDue(inv);
    if (due <= 0) continue;
    const card = terms[byId.get(inv.accountId)!.businessName] === "card";
    if (card && payByCard && (await payByCard(ctx, inv.id))) { payments++; continue; }
    const receivedOn = DateTime.fromISO(inv.issueDate).plus({ days: card ? 1 : 6 }).toISODate()!;
    await ctx.dataSource.transaction((m) => recordPayment(withClock(at(receivedOn, "11:00")), m, { invoiceId: inv.id, amountCents: due, method: "bank_transfer", reference: `BT-${inv.number.slice(-5)}`, receivedOn }));
    payments++;
  }
  await applyCreditHolds(ctx);
  void In;
  return { invoices, payments };
}
