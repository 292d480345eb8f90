import http from "node:http";
import Stripe from "stripe";
import { DECLINING_TEST_CARDS, cardBrand, luhnValid } from "../../fakes/stripe/luhn";
import { DECLINE_WORDS, declineWords } from "../../fakes/stripe/pages";
import {
  KEY, client, LINE_ITEMS, TOTAL, CANCEL_URL, CARD, fake, stripe, newSession, pay,
  useStripeFake,
} from "./stripe-fake-harness";

/**
 * The Stripe fake driven by the official `stripe` SDK: authentication and errors, customers, checkout
 * sessions, the hosted payment page and its decline words, and the Luhn check. Money, webhooks and the
 * state file: stripe-fake-money.test.ts.
 */
useStripeFake();

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
