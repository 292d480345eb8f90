import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, type TestApp } from "./app";
import { Order } from "../../../server/orders/order.entity";
import { OrderLine } from "../../../server/orders/order-line.entity";
import { Invoice } from "../../../server/billing/invoice.entity";
import { confirmDispatch } from "../../../server/billing/dispatch.service";
import { taxCents } from "../../../shared/billing";

/** The clock every card-billing test file runs at: Wed 10 Jun 2026, 10:00 in Chicago. */
export const CARD_NOW = "2026-06-10T15:00:00Z";
const TAX_BP = 875;
const PRICE = 1800;

export interface CardBilling {
  t: TestApp;
  buyer: string;
  books: string;
  accountId: number;
  rolls: { id: number };
  /** A locked one-off order of `qty` trays on its own date, dispatched, and the invoice that dispatch issued. */
  invoiceFor(qty: number, opts?: { issueDate?: string }): Promise<Invoice>;
}

/** A bakery with 8.75 % sales tax, a card-paying café with its buyer, a bookkeeper and one $18.00 product. */
export async function startCardBilling(opts: { bakery: string; invoicePrefix: string; stripe?: boolean }): Promise<CardBilling> {
  const t = await startTestApp({ now: CARD_NOW, stripe: opts.stripe ?? true });
  await makeBakery(t.ds, { name: opts.bakery, salesTaxRateBp: TAX_BP, invoicePrefix: opts.invoicePrefix });
  const accountId = (await makeAccount(t.ds, { businessName: "Card Café", paymentTerms: "card" })).id;
  const buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId }));
  const books = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
  const rolls = await makeProduct(t.ds, { priceCents: PRICE });
  let day = 1;
  async function invoiceFor(qty: number, find: { issueDate?: string } = {}) {
    const date = `2026-06-${String(day++).padStart(2, "0")}`;
    const orders = t.ds.getRepository(Order);
    const o = await orders.save(orders.create({ accountId, deliveryDate: date, status: "locked", totalCents: qty * PRICE, source: "one_off", editedByHand: false, createdById: null, poNumber: null, note: null }));
    await t.ds.getRepository(OrderLine).insert({ orderId: o.id, productId: rolls.id, productName: "Rolls", saleUnit: "tray", quantity: qty, unitPriceCents: PRICE, lineTotalCents: qty * PRICE });
    await confirmDispatch(t.ctx, date, []);
    return t.ds.getRepository(Invoice).findOneByOrFail({ accountId, ...find, totalCents: qty * PRICE + taxCents(qty * PRICE, TAX_BP) });
  }
  return { t, buyer, books, accountId, rolls, invoiceFor };
}

/** Fill in the fake's hosted payment page as a person would, with a card number. */
export function payOnHostedPage(url: string, card = "4242 4242 4242 4242") {
  const body = new URLSearchParams({ email: "pay@cardcafe.test", card_number: card, expiry: "12/30", cvc: "123", name: "Card Café" });
  return fetch(url, { method: "POST", body, redirect: "manual", headers: { "content-type": "application/x-www-form-urlencoded" } });
}

/** Deliver the fake's pending webhooks until the invoice is paid (2 s at most). */
export async function waitPaid(t: TestApp, id: number): Promise<Invoice> {
  for (let i = 0; i < 100; i++) {
    await t.stripe!.flushWebhooks();
    const inv = await t.ds.getRepository(Invoice).findOneByOrFail({ id });
    if (inv.status === "paid") return inv;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error("invoice not paid");
}
