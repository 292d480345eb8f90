import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import express from "express";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "../../fakes/stripe/stripe-fake";

/**
 * Harness for the Stripe fake tests (stripe-fake*.test.ts): the fake driven by the official `stripe` SDK, the hosted payment page driven with fetch,
 * and webhooks received by a local express server and verified with `stripe.webhooks.constructEvent`.
 */

export const SECRET = "whsec_panwise_test_secret";
export const KEY = "sk_test_panwise";

export interface Evt {
  id: string;
  type: string;
  created: number;
  data: { object: { id: string; [k: string]: unknown } };
}
export interface Received {
  raw: string;
  signature: string;
  event: Evt;
  attempt: number;
  status: number;
}

/** A webhook endpoint; `respond` decides the status per event and attempt. */
export async function startReceiver(port = 0) {
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

export const client = (fake: StripeFake, key = KEY) => new Stripe(key, { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0 });

export const LINE_ITEMS = [
  { price_data: { currency: "usd", unit_amount: 1800, product_data: { name: "Milk bread rolls, tray of 24" } }, quantity: 2 },
  { price_data: { currency: "usd", unit_amount: 650, product_data: { name: "Brioche loaf" } }, quantity: 1 },
];
export const TOTAL = 1800 * 2 + 650;
export const SUCCESS_URL = "http://panwise.test/pay/done?session={CHECKOUT_SESSION_ID}";
export const CANCEL_URL = "http://panwise.test/invoices/5";

/** A published Stripe test card, formatted the way people type it. */
export const CARD = { ok: "4242 4242 4242 4242", generic: "4000 0000 0000 0002", funds: "4000 0000 0000 9995" };

// Live bindings: the test files read these after beforeAll has set them.
export let dir: string;
export let stateFile: string;
export let receiver: Awaited<ReturnType<typeof startReceiver>>;
export let fake: StripeFake;
export let stripe: Stripe;

export const start = () =>
  startStripeFake({ port: 0, stateFile, webhookUrl: receiver.url, webhookSecret: SECRET, webhookRetry: { attempts: 4, baseMs: 50, maxMs: 100 } });

/** Starts a webhook receiver and a fake on a fresh state file for the calling test file; stops them after. */
export function useStripeFake(): void {
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
}

/** Stop the fake and start it again on the same state file (a restart). */
export async function restart(): Promise<void> {
  await fake.close();
  fake = await start();
  stripe = client(fake);
}

export function newSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}, options?: Stripe.RequestOptions) {
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

export async function pay(session: { id: string }, card: string, extra: Record<string, string> = {}) {
  const res = await fetch(`${fake.url}/pay/${session.id}`, {
    method: "POST",
    redirect: "manual",
    body: new URLSearchParams({ card_number: card, expiry: "12/34", cvc: "123", name: "Ann Baker", ...extra }),
  });
  return { status: res.status, location: res.headers.get("location"), html: await res.text() };
}

export async function paidSession() {
  const session = await newSession();
  const r = await pay(session, CARD.ok);
  expect(r.status).toBe(303);
  const s = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent"] });
  const pi = s.payment_intent as Stripe.PaymentIntent;
  const charge = await stripe.charges.retrieve(pi.latest_charge as string);
  return { session: s, pi, charge };
}

