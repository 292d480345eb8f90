import Stripe from "stripe";
import { startCardBilling, payOnHostedPage, type CardBilling } from "./helpers/card-billing";
import { auth, type TestApp } from "./helpers/app";
import { CheckoutSessionRecord } from "../../server/billing/checkout-session.entity";
import { Invoice } from "../../server/billing/invoice.entity";
import { Payment } from "../../server/billing/payment.entity";
import { Refund } from "../../server/billing/refund.entity";

/**
 * Issue 8 item 3: one invoice must never be payable twice. An open hosted payment page is expired at
 * Stripe (POST /v1/checkout/sessions/:id/expire, Stripe API reference "Expire a Session") as soon as
 * what is owed changes; a card payment that still arrives for a settled invoice is kept (the money was
 * taken), shown as an overpayment, and refunded in one action.
 */
let t: TestApp;
let buyer: string;
let books: string;
let accountId: number;
let rolls: { id: number };
let cb: CardBilling;
beforeAll(async () => {
  cb = await startCardBilling({ bakery: "Twice Bakery", invoicePrefix: "TB" });
  ({ t, buyer, books, accountId, rolls } = cb);
});
afterAll(() => t.close());

const invoiceFor = (qty: number) => cb.invoiceFor(qty);

const sessionIdOf = (url: string) => /\/pay\/(cs_test_\w+)/.exec(url)![1];

async function until<T>(what: string, fn: () => Promise<T | null | undefined | false>): Promise<T> {
  for (let i = 0; i < 150; i++) {
    await t.stripe!.flushWebhooks();
    const v = await fn();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error(`timed out waiting for ${what}`);
}

describe("no second charge for one invoice", () => {
  it("recording a bank transfer expires the open card payment page, which then refuses the card", async () => {
    const inv = await invoiceFor(2);
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    const sid = sessionIdOf(body.url);
    expect(t.stripe!.state.checkoutSessions[sid].status).toBe("open");
    const pay = await t.http().post(`/api/invoices/${inv.id}/payments`).set(auth(books)).send({ amountCents: inv.totalCents, method: "bank_transfer", reference: "BT-1", receivedOn: "2026-06-10" });
    expect(pay.status).toBe(201);
    expect(t.stripe!.state.checkoutSessions[sid].status).toBe("expired");
    expect((await t.ds.getRepository(CheckoutSessionRecord).findOneByOrFail({ id: sid })).status).toBe("expired");
    const attempt = await payOnHostedPage(body.url);
    expect(attempt.status).toBe(410); // the fake's page for an expired session, as Stripe shows one
    await t.stripe!.flushWebhooks();
    expect(await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).toMatchObject({ status: "paid", paidCents: inv.totalCents });
  });

  it("a credit note that lowers what is owed expires the page for the old amount; the next page asks the new amount", async () => {
    const inv = await invoiceFor(3);
    const first = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    const cn = await t.http().post(`/api/invoices/${inv.id}/credit-notes`).set(auth(books)).send({ reason: "One tray short", lines: [{ description: "Rolls (tray)", quantity: 1, unitPriceCents: 1800 }] });
    expect(cn.status).toBe(201);
    expect(t.stripe!.state.checkoutSessions[sessionIdOf(first.body.url)].status).toBe("expired");
    const second = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    expect(second.body.url).not.toBe(first.body.url);
    expect(t.stripe!.state.checkoutSessions[sessionIdOf(second.body.url)].amount_total).toBe(inv.totalCents - cn.body.creditNote.totalCents);
  });

  it("a card payment that arrives for a settled invoice is an overpayment: flagged to the bookkeeper, refunded in one action", async () => {
    const inv = await invoiceFor(4);
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    // Stripe cannot be reached at the moment the transfer is recorded, so the page stays open at Stripe.
    const real = t.ctx.stripe;
    t.ctx.stripe = new Stripe("sk_test_x", { host: "127.0.0.1", port: 9, protocol: "http", maxNetworkRetries: 0 });
    try {
      const pay = await t.http().post(`/api/invoices/${inv.id}/payments`).set(auth(books)).send({ amountCents: inv.totalCents, method: "bank_transfer", reference: "BT-2", receivedOn: "2026-06-10" });
      expect(pay.status).toBe(201);
    } finally {
      t.ctx.stripe = real;
    }
    expect((await payOnHostedPage(body.url)).status).toBe(303);
    await until("the card payment", async () => (await t.ds.getRepository(Payment).countBy({ invoiceId: inv.id })) === 2);
    expect(await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).toMatchObject({ status: "paid", paidCents: 2 * inv.totalCents });

    const detail = await t.http().get(`/api/invoices/${inv.id}`).set(auth(books));
    expect(detail.body.invoice.overpaidCents).toBe(inv.totalCents);
    expect(detail.body.alerts).toEqual([expect.objectContaining({ kind: "overpayment", amountCents: inv.totalCents, message: expect.stringMatching(/paid more than/i) })]);
    const list = await t.http().get("/api/invoices").set(auth(books));
    expect(list.body.invoices.find((i: { id: number }) => i.id === inv.id)).toMatchObject({ overpaidCents: inv.totalCents });
    expect(list.body.totals.overpaidCount).toBeGreaterThanOrEqual(1);

    expect((await t.http().post(`/api/invoices/${inv.id}/overpayment-refund`).set(auth(buyer))).status).toBe(403);
    const refund = await t.http().post(`/api/invoices/${inv.id}/overpayment-refund`).set(auth(books));
    expect(refund.status).toBe(201);
    expect(refund.body.refund).toMatchObject({ amountCents: inv.totalCents, stripeRefundId: expect.stringMatching(/^re_/) });
    await t.stripe!.flushWebhooks();
    const card = await t.ds.getRepository(Payment).findOneByOrFail({ invoiceId: inv.id, method: "card" });
    expect(t.stripe!.state.charges[card.stripeChargeId!].amount_refunded).toBe(inv.totalCents);
    // The invoice stays paid (the sale was not refunded, only the extra money), and is no longer flagged.
    const after = await t.http().get(`/api/invoices/${inv.id}`).set(auth(books));
    expect(after.body.invoice).toMatchObject({ status: "paid", overpaidCents: 0, refundedCents: inv.totalCents, amountDueCents: 0 });
    expect(after.body.alerts).toEqual([]);
    expect(await t.ds.getRepository(Refund).countBy({ invoiceId: inv.id })).toBe(1); // our call and charge.refunded: one refund
    const again = await t.http().post(`/api/invoices/${inv.id}/overpayment-refund`).set(auth(books));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("nothing_overpaid");
  });
});
