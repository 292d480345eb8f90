import fs from "node:fs";
import http from "node:http";
import express from "express";
import Stripe from "stripe";
import { startStripeFake } from "../../fakes/stripe/stripe-fake";
import {
  SECRET, client, LINE_ITEMS, TOTAL, SUCCESS_URL, CARD, dir, stateFile, receiver, fake, stripe, start, restart, newSession, pay, paidSession, startReceiver,
  useStripeFake,
} from "./stripe-fake-harness";

/**
 * The Stripe fake driven by the official `stripe` SDK: refunds, balance and payouts, what the catch-up
 * job asks, pagination, idempotency, webhooks (received by a local express server and verified with
 * `stripe.webhooks.constructEvent`), options, expiry by the clock and the state file.
 */
useStripeFake();

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
    await restart();

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
