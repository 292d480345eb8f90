import Stripe from "stripe";
import { startStripeFake } from "../../fakes/stripe/stripe-fake";
import { startCardBilling, payOnHostedPage, waitPaid, type CardBilling } from "./helpers/card-billing";
import { makeAccount, auth, type TestApp } from "./helpers/app";
import { Order } from "../../server/orders/order.entity";
import { OrderLine } from "../../server/orders/order-line.entity";
import { Invoice } from "../../server/billing/invoice.entity";
import { Payment } from "../../server/billing/payment.entity";
import { StripeEventRecord } from "../../server/billing/stripe-event.entity";
import { confirmDispatch } from "../../server/billing/dispatch.service";
import { Bakery } from "../../server/bakery/bakery.entity";
import { CSV_HEADER_STYLE, csvTable } from "../../server/billing/reports.service";
import { parse as parseCsv } from "csv-parse/sync";
import { INVOICE_KIND_LABELS, INVOICE_STATUS_LABELS, PAYMENT_METHOD_LABELS, PAYOUT_STATUS_LABELS } from "../../shared/billing";
import { formatMoney, minorUnitExponent } from "../../shared/money";

let t: TestApp;
let buyer: string;
let books: string;
let accountId: number;
let rolls: { id: number };
let cb: CardBilling;
beforeAll(async () => {
  cb = await startCardBilling({ bakery: "Pay Bakery", invoicePrefix: "PB" });
  ({ t, buyer, books, accountId, rolls } = cb);
});
afterAll(() => t.close());

const invoiceFor = (qty: number) => cb.invoiceFor(qty, { issueDate: "2026-06-10" });

describe("card payments through Stripe's hosted checkout (the local fake, real SDK)", () => {
  it("the buyer pays with 4242 4242 4242 4242; the signed webhook marks the invoice paid, once", async () => {
    const inv = await invoiceFor(2);
    const res = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    expect(res.status).toBe(201);
    expect(res.body.url).toMatch(/\/pay\/cs_test_/);
    const paid = await payOnHostedPage(res.body.url, "4242 4242 4242 4242");
    expect(paid.status).toBe(303);
    expect(paid.headers.get("location")).toContain(`/pay/return?invoice=${inv.id}&session_id=cs_test_`);
    const after = await waitPaid(t, inv.id);
    expect(after.paidCents).toBe(inv.totalCents);
    const payments = await t.ds.getRepository(Payment).findBy({ invoiceId: inv.id });
    expect(payments).toHaveLength(1);
    expect(payments[0]).toMatchObject({ method: "card", amountCents: inv.totalCents });
    expect(payments[0].stripeChargeId).toMatch(/^ch_/);
    // Stripe's checkout.session.completed and payment_intent.succeeded both arrived: one payment.
    expect(await t.ds.getRepository(StripeEventRecord).count()).toBeGreaterThanOrEqual(2);
  });

  it("a declined card shows the bank's answer in our words and leaves the invoice open", async () => {
    const inv = await invoiceFor(1);
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    const declined = await payOnHostedPage(body.url, "4000 0000 0000 0002");
    expect(declined.status).toBe(402);
    const declinedPage = await declined.text();
    expect(declinedPage).toContain("The card&#39;s bank turned this payment down without saying why.");
    // The page names what is paid and to whom: the invoice number and the bakery (sent as metadata.payee).
    expect(declinedPage).toContain(`Invoice ${inv.number} — ${(await t.ds.getRepository(Bakery).find({ order: { id: "ASC" }, take: 1 }))[0]!.name}`);
    const broke = await payOnHostedPage(body.url, "4000 0000 0000 9995");
    expect(await broke.text()).toContain("there is not enough money or credit on the card for this amount");
    await t.stripe!.flushWebhooks();
    expect((await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).status).toBe("open");
    const ok = await payOnHostedPage(body.url, "4242424242424242");
    expect(ok.status).toBe(303);
    await waitPaid(t, inv.id);
  });

  it("a webhook delivered three times and out of order pays the invoice once", async () => {
    // A second fake that sends no webhooks: its genuine events are delivered here by hand, in the wrong order and repeated.
    const quiet = await startStripeFake({ port: 0 });
    const real = t.ctx.stripe;
    t.ctx.stripe = new Stripe("sk_test_quiet", { host: "127.0.0.1", port: quiet.port, protocol: "http", maxNetworkRetries: 0 });
    try {
      const inv = await invoiceFor(3);
      const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
      expect((await payOnHostedPage(body.url, "4242 4242 4242 4242")).status).toBe(303);
      const events = Object.values(quiet.state.events);
      const succeeded = JSON.stringify(events.find((e) => e.type === "payment_intent.succeeded"));
      const completed = JSON.stringify(events.find((e) => e.type === "checkout.session.completed"));
      const secret = t.ctx.config.stripe.webhookSecret;
      const send = (payload: string) => t.http().post("/api/webhooks/stripe").set("Content-Type", "application/json").set("Stripe-Signature", Stripe.webhooks.generateTestHeaderString({ payload, secret })).send(payload);
      for (const p of [succeeded, completed, succeeded, completed, succeeded]) expect((await send(p)).status).toBe(200);
      const again = await send(succeeded);
      expect(again.body).toEqual({ received: true, duplicate: true, rejected: false });
      const row = await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id });
      expect(row).toMatchObject({ status: "paid", paidCents: inv.totalCents });
      expect(await t.ds.getRepository(Payment).countBy({ invoiceId: inv.id })).toBe(1);
      expect(await t.ds.query("SELECT outcome FROM stripe_event WHERE id IN (?, ?)", [JSON.parse(succeeded).id, JSON.parse(completed).id])).toEqual([{ outcome: "applied" }, { outcome: "applied" }]);
    } finally {
      t.ctx.stripe = real;
      await quiet.close();
    }
  });

  it("a bad signature gets 400 and changes nothing; the official SDK verifies the fake's signatures", async () => {
    const payload = JSON.stringify({ id: "evt_forged", object: "event", type: "payment_intent.succeeded", data: { object: { id: "pi_forged", amount: 100, metadata: { invoiceId: "1" } } } });
    const bad = await t.http().post("/api/webhooks/stripe").set("Content-Type", "application/json").set("Stripe-Signature", Stripe.webhooks.generateTestHeaderString({ payload, secret: "whsec_wrong" })).send(payload);
    expect(bad.status).toBe(400);
    const tampered = await t.http().post("/api/webhooks/stripe").set("Content-Type", "application/json").set("Stripe-Signature", Stripe.webhooks.generateTestHeaderString({ payload, secret: t.ctx.config.stripe.webhookSecret })).send(payload.replace("100", "999"));
    expect(tampered.status).toBe(400);
    const old = await t.http().post("/api/webhooks/stripe").set("Content-Type", "application/json").set("Stripe-Signature", Stripe.webhooks.generateTestHeaderString({ payload, secret: t.ctx.config.stripe.webhookSecret, timestamp: Math.floor(Date.now() / 1000) - 3600 })).send(payload);
    expect(old.status).toBe(400);
    expect(await t.ds.getRepository(StripeEventRecord).existsBy({ id: "evt_forged" })).toBe(false);
    // Every event the fake signed and sent earlier was accepted by constructEvent in the handler (2xx).
    const delivered = t.stripe!.deliveries.filter((d) => d.state === "delivered");
    expect(delivered.length).toBeGreaterThan(0);
    expect(t.stripe!.deliveries.filter((d) => d.state === "failed")).toEqual([]);
  });

  it("a credit note on a card-paid invoice is refunded through Stripe", async () => {
    const inv = await invoiceFor(4);
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    await payOnHostedPage(body.url, "4242 4242 4242 4242");
    await waitPaid(t, inv.id);
    const cn = await t.http().post(`/api/invoices/${inv.id}/credit-notes`).set(auth(books)).send({ reason: "One tray squashed", lines: [{ description: "Rolls (tray)", quantity: 1, unitPriceCents: 1800 }] });
    expect(cn.status).toBe(201);
    expect(cn.body.creditNote).toMatchObject({ disposition: "refund", totalCents: 1800 + 158 });
    await t.stripe!.flushWebhooks();
    const after = await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id });
    expect(after).toMatchObject({ status: "partially_refunded", refundedCents: 1958 });
    const detail = await t.http().get(`/api/invoices/${inv.id}`).set(auth(buyer));
    expect(detail.body.refunds).toHaveLength(1); // our own call and the charge.refunded event: one refund
    expect(detail.body.invoice.amountDueCents).toBe(0); // the refunded credit is not owed again
    const again = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    expect(again.status).toBe(409);
  });

  it("a credit larger than the card payment on a part-card invoice is carried, not a failed refund", async () => {
    const inv = await invoiceFor(7); // 12,600 + tax
    await t.http().post(`/api/invoices/${inv.id}/payments`).set(auth(books)).send({ amountCents: inv.totalCents - 2000, method: "cheque", reference: "CHQ 881", receivedOn: "2026-06-10" });
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    await payOnHostedPage(body.url, "4242 4242 4242 4242");
    await waitPaid(t, inv.id);
    const cn = await t.http().post(`/api/invoices/${inv.id}/credit-notes`).set(auth(books)).send({ reason: "Two trays short", lines: [{ description: "Rolls (tray)", quantity: 2, unitPriceCents: 1800 }] });
    expect(cn.status).toBe(201);
    expect(cn.body.creditNote.disposition).toBe("carry"); // 39.15 > the 20.00 paid by card
  });

  it("offers the same open checkout page again instead of a second one", async () => {
    const inv = await invoiceFor(8);
    const a = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    const b = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    expect(b.body.url).toBe(a.body.url);
  });

  it("the bookkeeper reconciles a payout against the invoices it settles, and exports CSV", async () => {
    const payout = t.stripe!.runPayout();
    expect(payout).not.toBeNull();
    const list = await t.http().get("/api/payouts").set(auth(books));
    expect(list.body.payouts.map((p: { id: string }) => p.id)).toContain(payout!.id);
    const detail = await t.http().get(`/api/payouts/${payout!.id}`).set(auth(books));
    expect(detail.status).toBe(200);
    expect(detail.body.unmatched).toBe(0);
    expect(detail.body.netMatchesPayout).toBe(true);
    // Every card payment made on the hosted page of this fake is in the payout (the replay test paid on a second fake).
    const cardPayments = (await t.ds.getRepository(Payment).countBy({ method: "card" })) - 1;
    expect(detail.body.transactions.filter((x: { type: string }) => x.type === "charge").length).toBe(cardPayments);
    for (const x of detail.body.transactions) expect(x.invoiceNumber).toMatch(/^PB-2026-/);
    // Each transaction names the account and the day, and carries the card payment's reference (its payment intent).
    const byCharge = new Map((await t.ds.getRepository(Payment).findBy({ method: "card" })).map((p) => [p.stripeChargeId, p]));
    for (const x of detail.body.transactions.filter((y: { type: string }) => y.type === "charge")) {
      const p = byCharge.get(x.source)!;
      expect(x).toMatchObject({ accountName: "Card Café", date: p.receivedOn, cardPaymentRef: p.stripePaymentIntentId });
      expect(x.cardPaymentRef).toMatch(/^pi_/);
    }
    // Fees: 2.9 % + 30 ¢ per charge (the fake's configured fee, Stripe's US card price).
    const charge = detail.body.transactions.find((x: { type: string }) => x.type === "charge");
    expect(charge.feeCents).toBe(Math.round(charge.amountCents * 0.029) + 30);
    const rec = await t.http().post(`/api/payouts/${payout!.id}/reconcile`).set(auth(books)).send({ note: "Matches the bank statement" });
    expect(rec.body.reconciled).toMatchObject({ note: "Matches the bank statement" });

    // Undo (issue 12): a reason is needed; the buyer may not; the history keeps both steps with who and why.
    const noReason = await t.http().post(`/api/payouts/${payout!.id}/undo-reconcile`).set(auth(books)).send({ reason: " " });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBe("Say why the reconciliation is undone (at least 3 characters).");
    const undone = await t.http().post(`/api/payouts/${payout!.id}/undo-reconcile`).set(auth(books)).send({ reason: "Wrong bank line" });
    expect(undone.status).toBe(200);
    expect(undone.body.reconciled).toBeNull();
    expect(undone.body.history.map((h: { action: string; note: string }) => [h.action, h.note])).toEqual([["reconciled", "Matches the bank statement"], ["undone", "Wrong bank line"]]);
    expect((await t.http().post(`/api/payouts/${payout!.id}/undo-reconcile`).set(auth(books)).send({ reason: "Again" })).body.error.code).toBe("not_reconciled");
    const again = await t.http().post(`/api/payouts/${payout!.id}/reconcile`).set(auth(books)).send({ note: "Right bank line" });
    expect(again.body.reconciled).toMatchObject({ note: "Right bank line" });
    expect(again.body.history).toHaveLength(3);

    const inv = parseCsv((await t.http().get("/api/reports/exports/invoices.csv").set(auth(books))).text, { columns: true }) as Record<string, string>[];
    expect(inv[0]).toMatchObject({ Currency: "USD" });
    expect(inv.every((r) => /^\d+\.\d{2}$/.test(r.Total))).toBe(true); // ISO 4217: USD has 2 decimals
    const pays = parseCsv((await t.http().get("/api/reports/exports/payments.csv").set(auth(books))).text, { columns: true }) as Record<string, string>[];
    // A date range (issue 12): both ends kept, by the day issued / received; a reversed range is refused.
    const first = inv[0]["Issue Date"];
    const ranged = await t.http().get(`/api/reports/exports/invoices.csv?from=${first}&to=${first}`).set(auth(books));
    expect(ranged.headers["content-disposition"]).toContain(`invoices-${first}-to-${first}.csv`);
    const rangedRows = parseCsv(ranged.text, { columns: true }) as Record<string, string>[];
    expect(rangedRows.length).toBe(inv.filter((r) => r["Issue Date"] === first).length);
    expect(rangedRows.every((r) => r["Issue Date"] === first)).toBe(true);
    expect(parseCsv((await t.http().get("/api/reports/exports/payments.csv?from=2099-01-01").set(auth(books))).text, { columns: true })).toEqual([]);
    const reversed = await t.http().get("/api/reports/exports/payouts.csv?from=2026-06-10&to=2026-06-01").set(auth(books));
    expect(reversed.status).toBe(400);
    expect(reversed.body.error.fields.to).toBe("The end date is before the start date.");
    expect(pays.some((p) => p["Card Charge Ref"].startsWith("ch_") && p["Card Payment Ref"].startsWith("pi_"))).toBe(true);
    const outs = parseCsv((await t.http().get("/api/reports/exports/payouts.csv").set(auth(books))).text, { columns: true }) as Record<string, string>[];
    expect(outs.find((p) => p["Bank Payout Ref"] === payout!.id)).toMatchObject({ Unmatched: "0", Net: (payout!.amount / 100).toFixed(2) });
    // Kind, status and method columns hold the words the screens show (shared/billing.ts), never the stored codes
    // ("partially_refunded", "bank_transfer", "in_transit"): issue 10 "No raw codes reach a person"; CSV spec in DEVELOPERS.md.
    expect(inv.map((r) => r.Kind)).toContain(INVOICE_KIND_LABELS.order);
    for (const r of inv) expect(Object.values(INVOICE_STATUS_LABELS)).toContain(r.Status);
    expect(pays.map((r) => r.Method)).toContain(PAYMENT_METHOD_LABELS.card);
    for (const r of pays) expect(Object.values(PAYMENT_METHOD_LABELS)).toContain(r.Method);
    for (const r of outs) expect(Object.values(PAYOUT_STATUS_LABELS)).toContain(r.Status);
    for (const r of [...inv, ...pays, ...outs]) for (const k of ["Kind", "Status", "Method"]) if (k in r) expect(r[k]).not.toMatch(/^[a-z_]+$/);
  });

  it("CSV exports neutralise formulas in text cells (OWASP CSV Injection) and keep amounts numeric, negative ones too", async () => {
    const evil = await makeAccount(t.ds, { businessName: '=HYPERLINK("http://evil.test/x","PO")', paymentTerms: "card" });
    const date = "2026-06-28";
    const o = await t.ds.getRepository(Order).save(t.ds.getRepository(Order).create({ accountId: evil.id, deliveryDate: date, status: "locked", totalCents: 1800, source: "one_off", editedByHand: false, createdById: null, poNumber: null, note: null }));
    await t.ds.getRepository(OrderLine).insert({ orderId: o.id, productId: rolls.id, productName: "Rolls", saleUnit: "tray", quantity: 1, unitPriceCents: 1800, lineTotalCents: 1800 });
    await confirmDispatch(t.ctx, date, []);
    const inv = await t.ds.getRepository(Invoice).findOneByOrFail({ accountId: evil.id });
    const refs = ["-2+3+cmd|' /C calc'!A0", "@SUM(1+1)*cmd|' /C calc'!A0", "\t=1+1", "+1+1"];
    for (const reference of refs) {
      expect((await t.http().post(`/api/invoices/${inv.id}/payments`).set(auth(books)).send({ amountCents: 100, method: "other", reference, receivedOn: "2026-06-10" })).status).toBe(201);
    }
    const invoicesCsv = parseCsv((await t.http().get("/api/reports/exports/invoices.csv").set(auth(books))).text, { columns: true }) as Record<string, string>[];
    const row = invoicesCsv.find((r) => r["Invoice Number"] === inv.number)!;
    expect(row.Account).toBe(`'${evil.businessName}`);
    expect(row.Total).toBe((inv.totalCents / 100).toFixed(2));
    const paymentsCsv = parseCsv((await t.http().get("/api/reports/exports/payments.csv").set(auth(books))).text, { columns: true, relax_quotes: true }) as Record<string, string>[];
    const mine = paymentsCsv.filter((r) => r["Invoice Number"] === inv.number);
    expect(mine.map((r) => r.Reference)).toEqual(refs.map((r) => `'${r.trim()}`));
    expect(mine.every((r) => r.Account === `'${evil.businessName}` && r.Amount === "1.00")).toBe(true);
    // No text cell of any export starts with a formula character; every amount column is a plain decimal.
    const amountCols = new Set(["Subtotal", "Tax", "Total", "Credited", "Paid", "Refunded", "Amount Due", "Amount", "Gross", "Fees", "Refunds", "Net"]);
    const payoutsCsv = parseCsv((await t.http().get("/api/reports/exports/payouts.csv").set(auth(books))).text, { columns: true }) as Record<string, string>[];
    for (const r of [...invoicesCsv, ...paymentsCsv, ...payoutsCsv]) {
      for (const [k, v] of Object.entries(r)) {
        if (amountCols.has(k)) expect({ k, v }).toEqual({ k, v: expect.stringMatching(/^-?\d+\.\d{2}$/) });
        else expect({ k, v }).toEqual({ k, v: expect.not.stringMatching(/^[=+\-@\t\r]/) });
      }
    }
    // A negative amount (a refund, a net below zero) stays a number a spreadsheet can add up; text that merely looks like one is escaped.
    const csv = csvTable(["what", "amount"], [{ currency: "USD", cells: ["-12.50 off", -1250] }, { currency: "JPY", cells: ["refund", -1250] }]);
    expect(parseCsv(csv, { columns: true })).toEqual([{ what: "'-12.50 off", amount: "-12.50" }, { what: "refund", amount: "-1250" }]);
  });

  it("every CSV header is plain words in Title Case, one style across the exports and the orders board", async () => {
    // The rule is the CSV spec in DEVELOPERS.md ("CSV exports"): headers are plain words in Title Case, every word
    // capitalised, acronyms kept (PO); no snake_case and no processor object names. A product column of the orders
    // board is the product's own name and sale unit, so it is left out; the currency code in "Order Total (USD)" is
    // ISO 4217.
    const titleCase = CSV_HEADER_STYLE;
    const headerOf = async (url: string) => (parseCsv((await t.http().get(url).set(auth(books))).text, { to_line: 1 }) as string[][])[0];
    const heads: Record<string, string[]> = {};
    for (const kind of ["invoices", "payments", "payouts"]) heads[kind] = await headerOf(`/api/reports/exports/${kind}.csv`);
    const board = await headerOf("/api/orders/board.csv?date=2026-06-01");
    const productCols = new Set(board.filter((h) => /\(tray/.test(h)));
    expect(productCols.size).toBeGreaterThan(0);
    heads.board = board.filter((h) => !productCols.has(h));
    for (const [kind, cols] of Object.entries(heads)) {
      for (const h of cols) expect({ kind, h }).toEqual({ kind, h: expect.stringMatching(titleCase) });
      expect(cols.join(" ")).not.toMatch(/stripe|_/i);
    }
    expect(heads.payments).toEqual(expect.arrayContaining(["Card Payment Ref", "Card Charge Ref"]));
    expect(heads.board).toEqual(["Delivery Date", "Account", "Status", "PO Number", "Order Total (USD)"]);
    // The rule itself refuses the old styles.
    for (const old of ["stripe_payment_intent", "amount_due", "Delivery date", "PO number"]) expect(old).not.toMatch(titleCase);
  });

  it("uses ISO 4217 minor units when formatting and when sending amounts to Stripe", async () => {
    expect(minorUnitExponent("USD")).toBe(2);
    expect(minorUnitExponent("JPY")).toBe(0);
    expect(formatMoney(196, "USD")).toBe("$1.96");
    const inv = await invoiceFor(5);
    await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    const sessions = await t.ctx.stripe.checkout.sessions.list({ limit: 1 });
    expect(sessions.data[0].amount_total).toBe(inv.totalCents); // cents, not dollars
    expect(sessions.data[0].currency).toBe("usd");
  });

  it("when Stripe is unreachable, checkout answers 503 and nothing half-made is left", async () => {
    const inv = await invoiceFor(6);
    const real = t.ctx.stripe;
    t.ctx.stripe = new Stripe("sk_test_x", { host: "127.0.0.1", port: 9, protocol: "http", maxNetworkRetries: 0 });
    try {
      const res = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe("payments_unavailable");
      expect(await t.ds.query("SELECT COUNT(*) AS n FROM checkout_session WHERE invoiceId = ?", [inv.id])).toEqual([{ n: "0" }]);
    } finally {
      t.ctx.stripe = real;
    }
  });
});
