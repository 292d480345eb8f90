import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import express from "express";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "../../fakes/stripe/stripe-fake";
import { DECLINING_TEST_CARDS, cardBrand, luhnValid } from "../../fakes/stripe/luhn";
import { DECLINE_WORDS, declineWords } from "../../fakes/stripe/pages";

/**
 * The Stripe fake driven by the official `stripe` SDK, the hosted payment page driven with fetch,
 * and webhooks received by a local express server and verified with `stripe.webhooks.constructEvent`.
 */

const SECRET = "whsec_panwise_test_secret";
const KEY = "sk_test_panwise";

interface Evt {
  id: string;
  type: string;
  created: number;
  data: { object: { id: string; [k: string]: unknown } };
}
interface Received {
  raw: string;
  signature: string;
  event: Evt;
  attempt: number;
  status: number;
}

/** A webhook endpoint; `respond` decides the status per event and attempt. */
async function startReceiver(port = 0) {
  const received: Received[] = [];
  const attempts = new Map<string, number>();
  const receiver = {
    received,
    respond: (_e: Evt, _attempt: number) => 200,
    url: "",
    server: null as unknown as http.Server,
    close: () => new Promise<void>((resolve) => (receiver.server.closeAllConnections(), receiver.server.close(() => resolve()))),
    of: (type: string) => received.filter((r) => r.event.type === type && r.status === 200),
  };
  const app = express();
  app.post("/hook", express.raw({ type: "*/*" }), (req, res) => {
    const raw = (req.body as Buffer).toString("utf8");
    const event = JSON.parse(raw) as Evt;
    const attempt = (attempts.get(event.id) ?? 0) + 1;
    attempts.set(event.id, attempt);
    const status = receiver.respond(event, attempt);
    received.push({ raw, signature: String(req.headers["stripe-signature"]), event, attempt, status });
    res.status(status).send(status < 300 ? "ok" : "failing on purpose");
  });
  receiver.server = http.createServer(app);
  await new Promise<void>((resolve) => receiver.server.listen(port, "127.0.0.1", () => resolve()));
  receiver.url = `http://127.0.0.1:${(receiver.server.address() as AddressInfo).port}/hook`;
  return receiver;
}

const client = (fake: StripeFake, key = KEY) => new Stripe(key, { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0 });

const LINE_ITEMS = [
  { price_data: { currency: "usd", unit_amount: 1800, product_data: { name: "Milk bread rolls, tray of 24" } }, quantity: 2 },
  { price_data: { currency: "usd", unit_amount: 650, product_data: { name: "Brioche loaf" } }, quantity: 1 },
];
const TOTAL = 1800 * 2 + 650;
const SUCCESS_URL = "http://panwise.test/pay/done?session={CHECKOUT_SESSION_ID}";
const CANCEL_URL = "http://panwise.test/invoices/5";

/** A published Stripe test card, formatted the way people type it. */
const CARD = { ok: "4242 4242 4242 4242", generic: "4000 0000 0000 0002", funds: "4000 0000 0000 9995" };

let dir: string;
let stateFile: string;
let receiver: Awaited<ReturnType<typeof startReceiver>>;
let fake: StripeFake;
let stripe: Stripe;

const start = () =>
  startStripeFake({ port: 0, stateFile, webhookUrl: receiver.url, webhookSecret: SECRET, webhookRetry: { attempts: 4, baseMs: 50, maxMs: 100 } });

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "stripe-fake-"));
  stateFile = path.join(dir, "stripe-fake.json");
  receiver = await startReceiver();
  fake = await start();
  stripe = client(fake);
});
afterAll(async () => {
  await fake?.close();
  await receiver?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

function newSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}, options?: Stripe.RequestOptions) {
  return stripe.checkout.sessions.create(
    {
      mode: "payment",
      line_items: LINE_ITEMS,
      success_url: SUCCESS_URL,
      cancel_url: CANCEL_URL,
      customer_email: "buyer@cafe.test",
      metadata: { invoiceId: "5" },
      payment_intent_data: { metadata: { invoiceId: "5", accountId: "12" } },
      client_reference_id: "invoice-5",
      ...extra,
    },
    options,
  );
}

async function pay(session: { id: string }, card: string, extra: Record<string, string> = {}) {
  const res = await fetch(`${fake.url}/pay/${session.id}`, {
    method: "POST",
    redirect: "manual",
    body: new URLSearchParams({ card_number: card, expiry: "12/34", cvc: "123", name: "Ann Baker", ...extra }),
  });
  return { status: res.status, location: res.headers.get("location"), html: await res.text() };
}

async function paidSession() {
  const session = await newSession();
  const r = await pay(session, CARD.ok);
  expect(r.status).toBe(303);
  const s = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent"] });
  const pi = s.payment_intent as Stripe.PaymentIntent;
  const charge = await stripe.charges.retrieve(pi.latest_charge as string);
  return { session: s, pi, charge };
}

describe("authentication and errors", () => {
  it("refuses /v1 without a test secret key, with Stripe's error body", async () => {
    const none = await fetch(`${fake.url}/v1/customers`);
    expect(none.status).toBe(401);
    expect((await none.json()).error).toMatchObject({ type: "invalid_request_error", message: expect.stringContaining("did not provide an API key") });
    await expect(client(fake, "sk_live_nope").customers.list()).rejects.toMatchObject({ type: "StripeAuthenticationError", statusCode: 401 });
    await expect(client(fake, "pk_test_123").customers.list()).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });

  it("answers unknown ids, unknown parameters and unknown routes with 4xx errors the SDK throws", async () => {
    await expect(stripe.customers.retrieve("cus_doesnotexist")).rejects.toMatchObject({
      type: "StripeInvalidRequestError", statusCode: 404, code: "resource_missing", param: "id", message: "No such customer: 'cus_doesnotexist'",
    });
    await expect(stripe.customers.create({ emial: "x@y.test" } as Stripe.CustomerCreateParams)).rejects.toMatchObject({ statusCode: 400, code: "parameter_unknown", param: "emial" });
    // A refused request changes nothing: the bad expand is caught before the customer is created.
    await expect(stripe.customers.create({ email: "expand@cafe.test", expand: ["subscriptions.nope"] })).rejects.toMatchObject({ param: "expand" });
    expect((await stripe.customers.list({ email: "expand@cafe.test" })).data).toEqual([]);
    const res = await fetch(`${fake.url}/v1/subscriptions`, { headers: { Authorization: `Bearer ${KEY}` } });
    expect(res.status).toBe(404);
    expect((await res.json()).error.message).toMatch(/Unrecognized request URL/);
  });
});

describe("customers", () => {
  it("creates, retrieves and lists customers with email, name and metadata", async () => {
    const c = await stripe.customers.create({ email: "cafe@example.test", name: "Corner Café", metadata: { accountId: "12" } });
    expect(c).toMatchObject({ object: "customer", email: "cafe@example.test", name: "Corner Café", metadata: { accountId: "12" }, livemode: false });
    expect(c.id).toMatch(/^cus_/);
    expect(Math.abs(c.created - Date.now() / 1000)).toBeLessThan(5);
    expect(await stripe.customers.retrieve(c.id)).toEqual(expect.objectContaining({ id: c.id, email: c.email }));
    const list = await stripe.customers.list({ email: "cafe@example.test" });
    expect(list.data.map((x) => x.id)).toEqual([c.id]);
  });
});

describe("checkout sessions", () => {
  it("creates a session with the total, metadata and the fake's hosted page URL", async () => {
    const s = await newSession();
    expect(s.id).toMatch(/^cs_test_/);
    expect(s).toMatchObject({
      object: "checkout.session", mode: "payment", amount_total: TOTAL, amount_subtotal: TOTAL, currency: "usd", status: "open", payment_status: "unpaid",
      payment_intent: null, metadata: { invoiceId: "5" }, client_reference_id: "invoice-5", customer_email: "buyer@cafe.test", url: `${fake.url}/pay/${s.id}`,
    });
    expect(s.expires_at - s.created).toBe(24 * 3600);
    const withItems = await stripe.checkout.sessions.retrieve(s.id, { expand: ["line_items"] });
    expect(withItems.line_items?.data.map((li) => [li.description, li.quantity, li.amount_total])).toEqual([
      ["Milk bread rolls, tray of 24", 2, 3600],
      ["Brioche loaf", 1, 650],
    ]);
  });

  it("validates parameters as Stripe does", async () => {
    await expect(stripe.checkout.sessions.create({ line_items: LINE_ITEMS } as Stripe.Checkout.SessionCreateParams)).rejects.toMatchObject({ statusCode: 400, param: "mode" });
    await expect(newSession({ line_items: [{ price_data: { currency: "usd", unit_amount: 100, product_data: { name: "Roll" } } }] })).rejects.toMatchObject({
      param: "line_items[0][quantity]", message: "Missing required param: line_items[0][quantity].",
    });
    const c = await stripe.customers.create({ email: "x@cafe.test" });
    await expect(newSession({ customer: c.id })).rejects.toMatchObject({ message: "You may only specify one of these parameters: customer, customer_email." });
    await expect(newSession({ customer_email: undefined, customer: "cus_missing" })).rejects.toMatchObject({ code: "resource_missing", param: "customer" });
    await expect(newSession({ success_url: "not a url" })).rejects.toMatchObject({ param: "success_url" });
  });

  it("expires a session on request, and refuses to expire it twice", async () => {
    const s = await newSession();
    const expired = await stripe.checkout.sessions.expire(s.id);
    expect(expired).toMatchObject({ status: "expired", url: null });
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({ statusCode: 400 });
    const page = await fetch(`${fake.url}/pay/${s.id}`);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain("expired");
    const events = await stripe.events.list({ type: "checkout.session.expired" });
    expect(events.data[0]?.data.object).toMatchObject({ id: s.id, status: "expired" });
  });
});

describe("hosted payment page", () => {
  it("shows an accessible form with the amount, the line items and a way back", async () => {
    const s = await newSession();
    const res = await fetch(s.url!);
    expect(res.status).toBe(200);
    const html = await res.text();
    for (const [id, label] of [["f-card_number", "Card number"], ["f-expiry", "Expiry date"], ["f-cvc", "Security code (CVC)"], ["f-name", "Name on card"]]) {
      expect(html).toMatch(new RegExp(`<label for="${id}">${label.replace(/[()]/g, "\\$&")}`));
      expect(html).toContain(`id="${id}"`);
    }
    expect(html).toContain('lang="en"');
    expect(html).toContain("$42.50");
    expect(html).toContain("Milk bread rolls, tray of 24");
    expect(html).toContain(`href="${CANCEL_URL}">Cancel and go back</a>`);
    // Issue 10 item 1: a banner that says it is Panwise's local test page and that no money moves; no placeholders.
    expect(html).toContain("Panwise local test payment page — no money moves.");
    expect(html).not.toContain("placeholder=");
    expect(html).not.toMatch(/checkout session/i);
    expect(html).toContain('<h1 id="pay-heading">2 items</h1>'); // two line items, no payee sent
    expect(html).toMatch(/<button type="submit">Pay \$42\.50<\/button>/);
  });

  it("names what is paid and to whom from the line item and metadata.payee, as Panwise sends them", async () => {
    const s = await newSession({
      line_items: [{ price_data: { currency: "usd", unit_amount: 12850, product_data: { name: "Invoice HB-2026-00042" } }, quantity: 1 }],
      metadata: { invoiceId: "42", invoiceNumber: "HB-2026-00042", payee: "Hollowbrook Bakehouse" },
    });
    const html = await (await fetch(s.url!)).text();
    expect(html).toContain('<h1 id="pay-heading">Invoice HB-2026-00042 — Hollowbrook Bakehouse</h1>');
    expect(html).toContain("<title>Pay Invoice HB-2026-00042 — Hollowbrook Bakehouse (test)</title>");
    expect(html).toContain("$128.50");
    // The API keeps the metadata as sent (the SDK contract).
    expect((await stripe.checkout.sessions.retrieve(s.id)).metadata).toEqual({ invoiceId: "42", invoiceNumber: "HB-2026-00042", payee: "Hollowbrook Bakehouse" });
  });

  it("pays with 4242…: 303 to success_url, session complete, payment intent, charge and balance transaction", async () => {
    const s = await newSession();
    const r = await pay(s, CARD.ok);
    expect(r.status).toBe(303);
    expect(r.location).toBe(`http://panwise.test/pay/done?session=${s.id}`);

    const done = await stripe.checkout.sessions.retrieve(s.id, { expand: ["payment_intent"] });
    expect(done).toMatchObject({ status: "complete", payment_status: "paid", url: null, customer_details: { email: "buyer@cafe.test", name: "Ann Baker" } });
    const pi = done.payment_intent as Stripe.PaymentIntent;
    expect(pi.id).toMatch(/^pi_/);
    // Stripe copies payment_intent_data.metadata onto the payment intent, not the session's metadata.
    expect(pi).toMatchObject({ object: "payment_intent", amount: TOTAL, amount_received: TOTAL, currency: "usd", status: "succeeded", metadata: { invoiceId: "5", accountId: "12" } });

    const charges = await stripe.charges.list({ payment_intent: pi.id });
    expect(charges.data).toHaveLength(1);
    const charge = charges.data[0]!;
    expect(charge.id).toBe(pi.latest_charge);
    expect(charge).toMatchObject({ amount: TOTAL, amount_refunded: 0, refunded: false, paid: true, status: "succeeded", payment_intent: pi.id });
    expect(charge.payment_method_details?.card).toMatchObject({ brand: "visa", last4: "4242", exp_month: 12, exp_year: 2034 });

    const txn = await stripe.balanceTransactions.retrieve(charge.balance_transaction as string);
    const fee = Math.round(TOTAL * 0.029) + 30;
    expect(fee).toBe(153);
    expect(txn).toMatchObject({ object: "balance_transaction", type: "charge", reporting_category: "charge", amount: TOTAL, fee, net: TOTAL - fee, status: "available", source: charge.id, currency: "usd" });
    expect(txn.fee_details).toEqual([expect.objectContaining({ amount: fee, type: "stripe_fee" })]);

    // Paid once: the page says so, and a second submission charges nothing.
    const again = await fetch(`${fake.url}/pay/${s.id}`);
    expect(await again.text()).toContain("Already paid");
    expect((await pay(s, CARD.ok)).status).toBe(409);
    expect((await stripe.charges.list({ payment_intent: pi.id })).data).toHaveLength(1);
  });

  it("shows the issuer's decline for 0002 and 9995 (402), records payment_intent.payment_failed, and a later good card pays", async () => {
    const s = await newSession();
    const generic = await pay(s, CARD.generic);
    expect(generic.status).toBe(402);
    // The page speaks Panwise's words, chosen by decline code; the API keeps Stripe's message (below).
    expect(generic.html).toContain(DECLINE_WORDS.generic_decline!.replace(/'/g, "&#39;"));
    expect(generic.html).toContain("The payment did not go through");
    expect(generic.html).not.toContain("Your card was declined.");
    expect(generic.html).toContain('value="Ann Baker"');
    const funds = await pay(s, CARD.funds);
    expect(funds.status).toBe(402);
    expect(funds.html).toContain("there is not enough money or credit on the card for this amount");
    expect(funds.html).not.toContain("Your card has insufficient funds.");

    const open = await stripe.checkout.sessions.retrieve(s.id);
    expect(open).toMatchObject({ status: "open", payment_status: "unpaid", payment_intent: null });

    const failed = (await stripe.events.list({ type: "payment_intent.payment_failed", limit: 2 })).data.map((e) => e.data.object as Stripe.PaymentIntent);
    expect(failed.map((p) => p.last_payment_error?.decline_code)).toEqual(["insufficient_funds", "generic_decline"]);
    expect(failed[0]).toMatchObject({
      status: "requires_payment_method",
      last_payment_error: { type: "card_error", code: "card_declined", message: "Your card has insufficient funds." },
    });
    const piId = failed[0]!.id;

    expect((await pay(s, CARD.ok)).status).toBe(303);
    const paid = await stripe.checkout.sessions.retrieve(s.id);
    expect(paid.payment_intent).toBe(piId); // the same payment intent, as Checkout retries on it
    const charges = await stripe.charges.list({ payment_intent: piId });
    expect(charges.data.map((c) => [c.status, c.failure_code, c.outcome?.reason])).toEqual([
      ["succeeded", null, null],
      ["failed", "card_declined", "insufficient_funds"],
      ["failed", "card_declined", "generic_decline"],
    ]);
  });

  it("checks the card number (Luhn), the expiry and the CVC, shows the errors (400) and keeps the entered values", async () => {
    const s = await newSession();
    const chargesBefore = Object.keys(fake.state.charges).length;
    const bad = await pay(s, "4242 4242 4242 4241", { expiry: "01/20", cvc: "12" });
    expect(bad.status).toBe(400);
    expect(bad.html).toContain("That card number does not add up — a digit may be mistyped or two swapped.");
    expect(bad.html).toContain("This card ran out at the end of 01/2020 — use a card that is still valid.");
    expect(bad.html).toContain("The security code is 3 or 4 digits — check it on the card.");
    expect(bad.html).not.toMatch(/Your card/);
    expect(bad.html).toContain('value="4242 4242 4242 4241"');
    expect(bad.html).toContain('value="01/20"');
    expect(bad.html).toMatch(/id="f-card_number"[^>]*aria-describedby="f-card_number-hint f-card_number-error"[^>]*aria-invalid="true"/);
    const short = await pay(s, "4242 4242", { name: "" });
    expect(short.html).toContain("The card number is too short — check the digits.");
    expect(short.html).toContain("Enter the name as it is printed on the card.");
    const odd = await pay(s, "4242 4242 4242 424x", { expiry: "13/30", cvc: "" });
    expect(odd.html).toContain("The card number is digits only — take out any letters or signs.");
    expect(odd.html).toContain("The month of the expiry date goes from 01 to 12.");
    expect(odd.html).toContain("Enter the security code (3 or 4 digits on the card).");
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe("open");
    expect(Object.keys(fake.state.charges)).toHaveLength(chargesBefore);
  });

  it("asks for an e-mail when the session has none, and creates a customer when customer_creation=always", async () => {
    const s = await newSession({ customer_email: undefined, customer_creation: "always" });
    expect((await fetch(s.url!).then((r) => r.text())).includes('id="f-email"')).toBe(true);
    expect((await pay(s, CARD.ok, { email: "nope" })).html).toContain("That e-mail address looks incomplete — it needs a name, an @ and a domain, like name@example.com.");
    expect((await pay(s, CARD.ok, { email: "new@cafe.test" })).status).toBe(303);
    const done = await stripe.checkout.sessions.retrieve(s.id, { expand: ["customer"] });
    expect(done.customer).toMatchObject({ object: "customer", email: "new@cafe.test", name: "Ann Baker" });
  });
});

describe("decline words on the payment page", () => {
  // Codes from Stripe's docs ("Error codes", "Decline codes"); the words shown are Panwise's own, never Stripe's sentence.
  it("has Panwise's own sentence for every declining test card, chosen by decline code, and a general one for unknown codes", () => {
    for (const d of Object.values(DECLINING_TEST_CARDS)) {
      const words = declineWords(d);
      expect(words).toBe(DECLINE_WORDS[d.declineCode ?? d.code]);
      expect(words).not.toBe(d.message);
      expect(words).toContain("Nothing was taken.");
    }
    expect(declineWords({ code: "card_declined", declineCode: "do_not_honor", message: "x" })).toBe(DECLINE_WORDS.generic_decline);
    expect(declineWords({ code: "something_new", message: "x" })).toBe(DECLINE_WORDS.generic_decline);
    expect(new Set([DECLINE_WORDS.insufficient_funds, DECLINE_WORDS.expired_card, DECLINE_WORDS.incorrect_cvc, DECLINE_WORDS.processing_error, DECLINE_WORDS.generic_decline]).size).toBe(5);
  });
});

describe("Luhn check (ISO/IEC 7812-1 Annex B)", () => {
  // Stripe's published test card numbers, https://docs.stripe.com/testing ("Cards by brand", "Declined payments").
  const published: [string, string][] = [
    ["4242424242424242", "visa"],
    ["4000056655665556", "visa"],
    ["5555555555554444", "mastercard"],
    ["2223003122003222", "mastercard"],
    ["378282246310005", "amex"],
    ["6011111111111117", "discover"],
    ["3056930009020004", "diners"],
    ["36227206271667", "diners"],
    ["3566002020360505", "jcb"],
    ["6200000000000005", "unionpay"],
    ["4000000000000002", "visa"],
    ["4000000000009995", "visa"],
  ];

  it.each(published)("accepts %s (%s) and refuses it with one digit changed", (number, brand) => {
    expect(luhnValid(number)).toBe(true);
    expect(cardBrand(number)).toBe(brand);
    for (let i = 0; i < number.length; i++) {
      const changed = number.slice(0, i) + ((Number(number[i]) + 1) % 10) + number.slice(i + 1);
      expect(luhnValid(changed)).toBe(false);
    }
  });

  it("refuses non-digits and empty input", () => {
    expect(luhnValid("")).toBe(false);
    expect(luhnValid("4242-4242-4242-4242")).toBe(false);
  });
});

describe("refunds", () => {
  it("refunds part, then the rest; refuses more than was charged", async () => {
    const { charge, pi } = await paidSession();
    const part = await stripe.refunds.create({ charge: charge.id, amount: 500, reason: "requested_by_customer", metadata: { note: "two rolls short" } });
    expect(part).toMatchObject({ object: "refund", amount: 500, charge: charge.id, payment_intent: pi.id, status: "succeeded", reason: "requested_by_customer" });
    expect(part.id).toMatch(/^re_/);
    expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ amount_refunded: 500, refunded: false });
    const txn = await stripe.balanceTransactions.retrieve(part.balance_transaction as string);
    expect(txn).toMatchObject({ type: "refund", reporting_category: "refund", amount: -500, fee: 0, net: -500, source: part.id });

    await expect(stripe.refunds.create({ charge: charge.id, amount: TOTAL })).rejects.toMatchObject({ type: "StripeInvalidRequestError", statusCode: 400, code: "amount_too_large", param: "amount" });
    const rest = await stripe.refunds.create({ payment_intent: pi.id });
    expect(rest.amount).toBe(TOTAL - 500);
    expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ amount_refunded: TOTAL, refunded: true });
    await expect(stripe.refunds.create({ charge: charge.id, amount: 1 })).rejects.toMatchObject({ statusCode: 400, code: "charge_already_refunded" });

    expect((await stripe.refunds.list({ charge: charge.id })).data.map((r) => r.amount)).toEqual([TOTAL - 500, 500]);
    const refunded = (await stripe.events.list({ type: "charge.refunded", limit: 2 })).data;
    expect(refunded.map((e) => (e.data.object as Stripe.Charge).amount_refunded)).toEqual([TOTAL, 500]);
    expect(refunded[1]!.data.previous_attributes).toEqual({ amount_refunded: 0, refunded: false });
  });
});

describe("balance and payouts", () => {
  beforeAll(() => fake.reset());

  it("the automatic payout sweeps the available balance; ?payout= lists exactly its transactions", async () => {
    const a = await paidSession();
    const b = await paidSession();
    const refund = await stripe.refunds.create({ charge: b.charge.id, amount: 1000 });
    const net = TOTAL - 153;
    const balance = await stripe.balance.retrieve();
    expect(balance.available).toEqual([expect.objectContaining({ amount: 2 * net - 1000, currency: "usd" })]);

    const res = await fetch(`${fake.url}/_fake/payouts/run`, { method: "POST" });
    const { payout } = (await res.json()) as { payout: Stripe.Payout };
    expect(payout).toMatchObject({ object: "payout", amount: 2 * net - 1000, automatic: true, status: "paid", currency: "usd", reconciliation_status: "completed" });
    expect(payout.id).toMatch(/^po_/);
    expect(await stripe.payouts.retrieve(payout.id)).toMatchObject({ id: payout.id, balance_transaction: payout.balance_transaction });

    const txns = await stripe.balanceTransactions.list({ payout: payout.id, limit: 100 });
    const expected = [a.charge.balance_transaction, b.charge.balance_transaction, refund.balance_transaction, payout.balance_transaction];
    expect(txns.data.map((t) => t.id).sort()).toEqual([...expected].sort());
    expect(txns.data.filter((t) => t.type !== "payout").reduce((s, t) => s + t.net, 0)).toBe(payout.amount);
    expect(txns.data.find((t) => t.type === "payout")).toMatchObject({ amount: -payout.amount, net: -payout.amount, source: payout.id });
    expect((await stripe.balanceTransactions.list({ payout: payout.id, type: "charge" })).data).toHaveLength(2);

    expect((await stripe.balance.retrieve()).available[0]!.amount).toBe(0);
    expect(fake.runPayout()).toBeNull();
    expect((await stripe.events.list({ type: "payout.paid" })).data[0]?.data.object).toMatchObject({ id: payout.id });
  });

  it("a manual payout (POST /v1/payouts) needs the funds and, as on Stripe, cannot be reconciled through ?payout=", async () => {
    await expect(stripe.payouts.create({ amount: 100, currency: "usd" })).rejects.toMatchObject({ statusCode: 400, code: "balance_insufficient" });
    await paidSession();
    const manual = await stripe.payouts.create({ amount: 1000, currency: "usd", description: "Flour supplier" });
    expect(manual).toMatchObject({ amount: 1000, automatic: false, status: "paid", reconciliation_status: "not_applicable" });
    await expect(stripe.balanceTransactions.list({ payout: manual.id })).rejects.toMatchObject({
      statusCode: 400, message: "Balance transaction history can only be filtered on automatic transfers, not manual.",
    });
    expect((await stripe.balance.retrieve()).available[0]!.amount).toBe(TOTAL - 153 - 1000);
  });
});

describe("what Panwise's catch-up job asks (server/jobs/stripe-catch-up.ts)", () => {
  beforeAll(() => fake.reset());

  it("lists events by created[gte] and types[], pages them all, and finds a session by its payment intent", async () => {
    const before = Math.floor(Date.now() / 1000);
    const { session, pi, charge } = await paidSession();
    await stripe.refunds.create({ charge: charge.id, amount: 100 });
    const wanted = ["checkout.session.completed", "payment_intent.succeeded", "charge.refunded"];
    const listed = await stripe.events.list({ created: { gte: before }, types: wanted, limit: 1 }).autoPagingToArray({ limit: 100 });
    expect(listed.map((e) => e.type).sort()).toEqual([...wanted].sort());
    expect(listed.every((e) => e.created >= before)).toBe(true);
    expect(await stripe.events.list({ created: { gte: before + 3600 }, types: wanted })).toMatchObject({ data: [] });
    const found = await stripe.checkout.sessions.list({ payment_intent: pi.id, limit: 1 });
    expect(found.data.map((s) => s.id)).toEqual([session.id]);
    expect((await stripe.checkout.sessions.list({ payment_intent: "pi_not_here" })).data).toEqual([]);
  });
});

describe("list pagination", () => {
  beforeAll(() => fake.reset());

  it("pages newest first with limit, starting_after, ending_before and has_more", async () => {
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push((await stripe.customers.create({ email: `page${i}@cafe.test` })).id);
    const newest = [...ids].reverse();
    const p1 = await stripe.customers.list({ limit: 2 });
    expect(p1).toMatchObject({ object: "list", url: "/v1/customers", has_more: true });
    expect(p1.data.map((c) => c.id)).toEqual(newest.slice(0, 2));
    const p2 = await stripe.customers.list({ limit: 2, starting_after: p1.data[1]!.id });
    expect(p2.data.map((c) => c.id)).toEqual(newest.slice(2, 4));
    expect(p2.has_more).toBe(true);
    const p3 = await stripe.customers.list({ limit: 2, starting_after: p2.data[1]!.id });
    expect(p3.data.map((c) => c.id)).toEqual(newest.slice(4));
    expect(p3.has_more).toBe(false);
    const back = await stripe.customers.list({ limit: 2, ending_before: p3.data[0]!.id });
    expect(back.data.map((c) => c.id)).toEqual(newest.slice(2, 4));
    expect(back.has_more).toBe(true);
    expect((await stripe.customers.list({ limit: 2 }).autoPagingToArray({ limit: 100 })).map((c) => c.id)).toEqual(newest);
    await expect(stripe.customers.list({ limit: 101 })).rejects.toMatchObject({ param: "limit" });
  });
});

describe("idempotency", () => {
  it("replays the stored response for the same key and body, without a second effect", async () => {
    const body = { email: "idem@cafe.test", name: "Idem Café" };
    const first = await stripe.customers.create(body, { idempotencyKey: "panwise-cus-1" });
    const second = await stripe.customers.create(body, { idempotencyKey: "panwise-cus-1" });
    expect(second).toEqual(first);
    expect(second.lastResponse.headers["idempotent-replayed"]).toBe("true");
    expect((await stripe.customers.list({ email: "idem@cafe.test" })).data).toHaveLength(1);

    const { charge } = await paidSession();
    const r1 = await stripe.refunds.create({ charge: charge.id, amount: 300 }, { idempotencyKey: "panwise-refund-1" });
    const r2 = await stripe.refunds.create({ charge: charge.id, amount: 300 }, { idempotencyKey: "panwise-refund-1" });
    expect(r2.id).toBe(r1.id);
    expect((await stripe.charges.retrieve(charge.id)).amount_refunded).toBe(300);

    // The replay is the response as first sent, even after the object has changed since.
    const session = await newSession({}, { idempotencyKey: "panwise-session-1" });
    expect((await pay(session, CARD.ok)).status).toBe(303);
    const replay = await newSession({}, { idempotencyKey: "panwise-session-1" });
    expect(replay).toMatchObject({ id: session.id, status: "open", payment_intent: null });
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("complete");
  });

  it("refuses the same key with a different body or endpoint (StripeIdempotencyError); keys are per API key", async () => {
    await stripe.customers.create({ email: "one@cafe.test" }, { idempotencyKey: "panwise-cus-2" });
    await expect(stripe.customers.create({ email: "two@cafe.test" }, { idempotencyKey: "panwise-cus-2" })).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    await expect(newSession({}, { idempotencyKey: "panwise-cus-2" })).rejects.toMatchObject({ type: "StripeIdempotencyError", statusCode: 400 });
    const other = await client(fake, "sk_test_other_key").customers.create({ email: "two@cafe.test" }, { idempotencyKey: "panwise-cus-2" });
    expect(other.email).toBe("two@cafe.test");
  });
});

describe("webhooks", () => {
  it("posts each event signed so that stripe.webhooks.constructEvent accepts it", async () => {
    const { session } = await paidSession();
    await fake.flushWebhooks();
    const completed = receiver.of("checkout.session.completed").find((r) => r.event.data.object.id === session.id)!;
    expect(completed).toBeDefined();
    const event = stripe.webhooks.constructEvent(completed.raw, completed.signature, SECRET);
    expect(event.type).toBe("checkout.session.completed");
    expect((event.data.object as Stripe.Checkout.Session).payment_status).toBe("paid");
    expect(event.id).toMatch(/^evt_/);
    expect((await stripe.events.retrieve(event.id)).pending_webhooks).toBe(0);
    const pi = (session.payment_intent as Stripe.PaymentIntent).id;
    expect(receiver.of("payment_intent.succeeded").some((r) => r.event.data.object.id === pi)).toBe(true);

    expect(() => stripe.webhooks.constructEvent(completed.raw.replace('"paid"', '"unpaid"'), completed.signature, SECRET)).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(() => stripe.webhooks.constructEvent(completed.raw, completed.signature, "whsec_someone_else")).toThrow(Stripe.errors.StripeSignatureVerificationError);
    // Five minutes and a second later (receivedAt is in ms), the default tolerance of 300 s refuses the same delivery.
    const t = Number(/t=(\d+)/.exec(completed.signature)![1]);
    expect(() => stripe.webhooks.constructEvent(completed.raw, completed.signature, SECRET, 300, undefined, (t + 301) * 1000)).toThrow(/Timestamp outside the tolerance zone/);
  });

  it("retries a failing endpoint with backoff: 500, 500, then 200 is delivered on the third attempt", async () => {
    receiver.respond = (e, attempt) => (e.type === "customer.created" && (e.data.object as { email?: string }).email === "retry@cafe.test" && attempt <= 2 ? 500 : 200);
    const c = await stripe.customers.create({ email: "retry@cafe.test" });
    await fake.flushWebhooks();
    receiver.respond = () => 200;
    const tries = receiver.received.filter((r) => r.event.data.object.id === c.id);
    expect(tries.map((r) => [r.attempt, r.status])).toEqual([[1, 500], [2, 500], [3, 200]]);
    expect(new Set(tries.map((r) => r.event.id)).size).toBe(1);
    const delivery = fake.deliveries.find((d) => d.eventId === tries[0]!.event.id)!;
    expect(delivery).toMatchObject({ state: "delivered" });
    expect(delivery.attempts.map((a) => a.status)).toEqual([500, 500, 200]);
    expect(stripe.webhooks.constructEvent(tries[2]!.raw, tries[2]!.signature, SECRET).id).toBe(tries[0]!.event.id);
  });

  it("does not hold later events behind one that keeps failing, and gives up after the configured attempts", async () => {
    receiver.respond = (e) => ((e.data.object as { email?: string }).email === "down@cafe.test" ? 503 : 200);
    const failing = await stripe.customers.create({ email: "down@cafe.test" });
    const next = await stripe.customers.create({ email: "after@cafe.test" });
    await fake.flushWebhooks();
    receiver.respond = () => 200;
    const idx = (id: string) => receiver.received.map((r, i) => (r.event.data.object.id === id ? i : -1)).filter((i) => i >= 0);
    const failingTries = idx(failing.id);
    expect(failingTries).toHaveLength(4);
    expect(idx(next.id)[0]!).toBeLessThan(failingTries[1]!);
    expect(fake.deliveries.find((d) => d.type === "customer.created" && d.attempts.length === 4 && d.state === "failed")).toBeDefined();
  });

  it("retries after a connection failure", async () => {
    const probe = await startReceiver();
    const port = Number(new URL(probe.url).port);
    await probe.close();
    const local = await startStripeFake({ port: 0, webhookUrl: `http://127.0.0.1:${port}/hook`, webhookSecret: SECRET, webhookRetry: { attempts: 5, baseMs: 60 } });
    let late: Awaited<ReturnType<typeof startReceiver>> | null = null;
    try {
      await client(local).customers.create({ email: "late@cafe.test" });
      await new Promise((r) => setTimeout(r, 20));
      late = await startReceiver(port);
      await local.flushWebhooks();
      const d = local.deliveries[0]!;
      expect(d.state).toBe("delivered");
      expect(d.attempts[0]).toMatchObject({ status: null, error: expect.stringMatching(/ECONNREFUSED/) });
      expect(d.attempts.at(-1)!.status).toBe(200);
      expect(late.received).toHaveLength(1);
    } finally {
      await local.close();
      await late?.close();
    }
  });
});

describe("options", () => {
  it("payoutEveryMs runs the automatic payout on a schedule; webhookEvents limits what is sent; fees are configurable", async () => {
    const own = await startReceiver();
    const local = await startStripeFake({
      port: 0, payoutEveryMs: 40, feePercent: 1.5, feeFixed: 25, webhookUrl: own.url, webhookSecret: SECRET, webhookEvents: ["checkout.session.*", "payout.paid"],
    });
    try {
      const sdk = client(local);
      const s = await sdk.checkout.sessions.create({ mode: "payment", line_items: LINE_ITEMS, success_url: SUCCESS_URL });
      const res = await fetch(`${local.url}/pay/${s.id}`, {
        method: "POST", redirect: "manual", body: new URLSearchParams({ email: "o@cafe.test", card_number: CARD.ok, expiry: "12/34", cvc: "123", name: "O" }),
      });
      expect(res.status).toBe(303);
      const deadline = Date.now() + 2000;
      while (!Object.keys(local.state.payouts).length && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
      const [payout] = (await sdk.payouts.list()).data;
      const fee = Math.round(TOTAL * 0.015) + 25;
      expect(payout).toMatchObject({ automatic: true, amount: TOTAL - fee });
      await local.flushWebhooks();
      expect(own.received.map((r) => r.event.type).sort()).toEqual(["checkout.session.completed", "payout.paid"]);
      expect((await sdk.events.list({ type: "charge.*" })).data.map((e) => e.type)).toEqual(["charge.succeeded"]);
    } finally {
      await local.close();
      await own.close();
    }
  });
});

describe("session expiry by the clock", () => {
  it("expires an unpaid session at expires_at: the API says expired and the page answers 410", async () => {
    let now = Date.now();
    const local = await startStripeFake({ port: 0, now: () => now });
    try {
      const sdk = client(local);
      const s = await sdk.checkout.sessions.create({ mode: "payment", line_items: LINE_ITEMS, success_url: SUCCESS_URL, expires_at: Math.floor(now / 1000) + 3600 });
      await expect(
        sdk.checkout.sessions.create({ mode: "payment", line_items: LINE_ITEMS, success_url: SUCCESS_URL, expires_at: Math.floor(now / 1000) + 60 }),
      ).rejects.toMatchObject({ param: "expires_at" });
      now += 3601_000;
      expect(await sdk.checkout.sessions.retrieve(s.id)).toMatchObject({ status: "expired", url: null });
      expect((await fetch(`${local.url}/pay/${s.id}`)).status).toBe(410);
      expect((await sdk.events.list()).data.map((e) => e.type)).toEqual(["checkout.session.expired"]);
    } finally {
      await local.close();
    }
  });
});

describe("state file", () => {
  it("persists across a restart, never holds a full card number, and reset clears it", async () => {
    const { session, charge } = await paidSession();
    const customer = await stripe.customers.create({ email: "persist@cafe.test" }, { idempotencyKey: "panwise-persist" });
    await fake.flushWebhooks();
    await fake.close();
    fake = await start();
    stripe = client(fake);

    expect(await stripe.checkout.sessions.retrieve(session.id)).toMatchObject({ status: "complete", payment_intent: (session.payment_intent as Stripe.PaymentIntent).id });
    expect((await stripe.charges.retrieve(charge.id)).amount).toBe(TOTAL);
    expect((await stripe.customers.create({ email: "persist@cafe.test" }, { idempotencyKey: "panwise-persist" })).id).toBe(customer.id);

    const text = fs.readFileSync(stateFile, "utf8");
    expect(text).toContain(charge.id);
    for (const number of Object.values(CARD)) {
      expect(text).not.toContain(number.replace(/ /g, ""));
      expect(text).not.toContain(number);
    }
    expect(fs.readdirSync(dir).filter((f) => f.endsWith(".tmp"))).toEqual([]);
    const debug = (await (await fetch(`${fake.url}/_fake/state`)).json()) as { charges: Record<string, unknown> };
    expect(Object.keys(debug.charges)).toContain(charge.id);

    const reset = await fetch(`${fake.url}/_fake/reset`, { method: "POST" });
    expect(reset.status).toBe(200);
    expect((await stripe.customers.list()).data).toEqual([]);
    await expect(stripe.charges.retrieve(charge.id)).rejects.toMatchObject({ statusCode: 404 });
    expect(JSON.parse(fs.readFileSync(stateFile, "utf8")).charges).toEqual({});
  });
});
