/**
 * Billing under load: two server processes against one database, card payments through the Stripe fake.
 *  1. 200 invoices issued at once (dispatch confirmations spread over both processes): numbers must be
 *     unique and gapless; reports invoices issued per second.
 *  2. Real card payments: a checkout session for each invoice through the API (POST
 *     /api/invoices/:id/checkout, both processes), each paid on the fake's hosted page. The fake sends its
 *     signed events to a receiver here, which keeps them; then every payment event (checkout.session.completed
 *     and payment_intent.succeeded, the two that can pay an invoice) is delivered three times, shuffled, split
 *     over both processes at 50 in flight: reports p50/p99 handling time and checks every invoice is paid once,
 *     with one payment, none overpaid, no event rejected.
 *   node --import tsx bench/billing.ts      (needs the private MariaDB running: npm start / npm run db)
 * Not a test: it prints a JSON report, and exits 1 when a check fails.
 */
import "reflect-metadata";
import crypto from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";
import mysql from "mysql2/promise";
import bcrypt from "bcryptjs";
import { createDataSource } from "../server/db/data-source";
import { loadConfig } from "../server/config";
import { signPayload, startStripeFake } from "../fakes/stripe/stripe-fake";
import { freePort, startServer, stop, summarise, waitHttp } from "./lib";

const N = 200;
// A random secret and key for this run (the published local defaults would work with the fake too, but a run
// should look like a real set-up).
const SECRET = `whsec_${crypto.randomBytes(24).toString("hex")}`;
const KEY = `sk_test_${crypto.randomBytes(12).toString("hex")}`;
const PAYMENT_EVENTS = ["checkout.session.completed", "payment_intent.succeeded"];

interface Captured { id: string; type: string; payload: string; signature: string }

/** Runs `fn` over `items`, `width` at a time; returns each call's time in ms. */
async function pool<T>(items: T[], width: number, fn: (item: T, lane: number) => Promise<void>): Promise<number[]> {
  const ms: number[] = [];
  let next = 0;
  await Promise.all(Array.from({ length: width }, async (_, lane) => {
    while (next < items.length) {
      const item = items[next++];
      const s = performance.now();
      await fn(item, lane);
      ms.push(performance.now() - s);
    }
  }));
  return ms;
}

/** Fisher–Yates shuffle (Knuth, TAOCP vol. 2, Algorithm P); sort(() => Math.random() - 0.5) is biased. */
function shuffle<T>(a: T[]): T[] {
  for (let i = a.length - 1; i > 0; i--) {
    const j = crypto.randomInt(i + 1);
    [a[i], a[j]] = [a[j], a[i]];
  }
  return a;
}
async function main() {
  const dbName = `panwise_bench_bill_${Date.now().toString(36)}`;
  const base = loadConfig().db;
  const admin = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password });
  await admin.query(`CREATE DATABASE \`${dbName}\``);
  await admin.end();
  const ds = createDataSource({ ...base, database: dbName });
  await ds.initialize();
  await ds.runMigrations();
  await ds.query("INSERT INTO bakery (name, timeZone, currency, salesTaxRateBp, invoicePrefix) VALUES ('Bench Bakery', 'America/Chicago', 'USD', 875, 'BB')");
  await ds.query("INSERT INTO product (name, description, saleUnit, piecesPerUnit, pieceGrams, panName, panLengthMm, panWidthMm, unitsPerPan, priceCents, allergens, mayContain) VALUES ('Rolls', '', 'tray', 15, 67, 'pan', 330, 229, 1, 1800, '', '')");
  const dates = Array.from({ length: 20 }, (_, i) => `2026-05-${String(i + 1).padStart(2, "0")}`);
  for (let i = 0; i < N; i++) {
    await ds.query("INSERT INTO customer_account (businessName, deliveryAddress, billingEmail, notes, paymentTerms) VALUES (?, '1 St', ?, '', 'card')", [`Bench ${i}`, `b${i}@bench.test`]);
    const [{ id }] = await ds.query("SELECT LAST_INSERT_ID() AS id");
    await ds.query("INSERT INTO customer_order (accountId, deliveryDate, status, totalCents) VALUES (?, ?, 'locked', 3600)", [id, dates[i % dates.length]]);
    const [{ id: oid }] = await ds.query("SELECT LAST_INSERT_ID() AS id");
    await ds.query("INSERT INTO order_line (orderId, productId, productName, saleUnit, quantity, unitPriceCents, lineTotalCents) VALUES (?, 1, 'Rolls', 'tray', 2, 1800, 3600)", [oid]);
  }
  await ds.query("INSERT INTO user (email, passwordHash, role, name) VALUES ('owner@bench.test', ?, 'owner', 'Owner')", [bcrypt.hashSync("bench-password-1", 4)]);

  // The fake's webhooks go to this receiver, which keeps each signed delivery to replay it later.
  const captured: Captured[] = [];
  const receiver = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      const payload = Buffer.concat(chunks).toString("utf8");
      const event = JSON.parse(payload) as { id: string; type: string };
      captured.push({ id: event.id, type: event.type, payload, signature: String(req.headers["stripe-signature"] ?? "") });
      res.writeHead(200, { "content-type": "application/json" }).end("{}");
    });
  });
  await new Promise<void>((resolve) => receiver.listen(0, "127.0.0.1", resolve));
  const fake = await startStripeFake({ port: 0, webhookUrl: `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/`, webhookSecret: SECRET, webhookEvents: PAYMENT_EVENTS });

  const ports = [await freePort(), await freePort()];
  const env = {
    DB_NAME: dbName, SMTP_URL: `smtp://127.0.0.1:${await freePort()}`, LOG_LEVEL: "warn", PANWISE_NO_JOBS: "1",
    STRIPE_API_HOST: "127.0.0.1", STRIPE_API_PORT: String(fake.port), STRIPE_API_PROTOCOL: "http", STRIPE_SECRET_KEY: KEY, STRIPE_WEBHOOK_SECRET: SECRET,
    // One buyer opens a payment page for each of the 200 invoices: above the per-user page limit of a real buyer.
    RATE_LIMIT_CHECKOUT: "1000/600",
  };
  const servers = ports.map((p) => startServer({ ...env, PORT: String(p), PUBLIC_URL: `http://127.0.0.1:${p}` }));
  try {
    await Promise.all(ports.map((p) => waitHttp(`http://127.0.0.1:${p}/api/health`)));
    const sign = await fetch(`http://127.0.0.1:${ports[0]}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: "owner@bench.test", password: "bench-password-1" }) });
    const { token } = (await sign.json()) as { token: string };

    const t0 = Date.now();
    await Promise.all(dates.map((d, i) => fetch(`http://127.0.0.1:${ports[i % 2]}/api/deliveries/${d}/confirm`, { method: "POST", headers: { "content-type": "application/json", authorization: `Bearer ${token}` }, body: JSON.stringify({ adjustments: [] }) }).then((r) => { if (!r.ok) throw new Error(`confirm ${d}: ${r.status}`); })));
    const seconds = (Date.now() - t0) / 1000;
    const rows: { seq: number }[] = await ds.query("SELECT seq FROM invoice ORDER BY seq");
    const seqs = rows.map((r) => Number(r.seq));
    const gapless = seqs.length === N && seqs.every((s, i) => s === i + 1);

    // Checkout sessions through the API, over both processes, 50 in flight.
    const invoices: { id: number }[] = await ds.query("SELECT id FROM invoice ORDER BY id");
    const urls = new Map<number, string>();
    const c0 = Date.now();
    const checkoutMs = await pool(invoices, 50, async (inv, lane) => {
      const r = await fetch(`http://127.0.0.1:${ports[lane % 2]}/api/invoices/${inv.id}/checkout`, { method: "POST", headers: { authorization: `Bearer ${token}` } });
      const body = (await r.json()) as { url?: string };
      if (r.status !== 201 || !body.url) throw new Error(`checkout for invoice ${inv.id}: ${r.status} ${JSON.stringify(body)}`);
      urls.set(inv.id, body.url);
    });
    const checkouts = summarise(checkoutMs, (Date.now() - c0) / 1000);

    // Pay each page as a person would (the fake's hosted form; a Luhn-valid card that succeeds), 10 at a time.
    await pool([...urls.values()], 10, async (url) => {
      const form = new URLSearchParams({ email: "pay@bench.test", card_number: "4242 4242 4242 4242", expiry: "12/30", cvc: "123", name: "Bench Café" });
      const r = await fetch(url, { method: "POST", body: form, redirect: "manual", headers: { "content-type": "application/x-www-form-urlencoded" } });
      await r.text();
      if (r.status !== 303) throw new Error(`paying ${url}: ${r.status}`);
    });
    await fake.flushWebhooks();
    const failed = fake.deliveries.filter((d) => d.state !== "delivered").length;
    if (failed || captured.length !== N * PAYMENT_EVENTS.length) throw new Error(`the fake sent ${captured.length} events (${failed} failed); expected ${N * PAYMENT_EVENTS.length}`);
    const [{ paidBefore }] = await ds.query("SELECT COUNT(*) AS paidBefore FROM invoice WHERE status = 'paid'");
    if (Number(paidBefore) !== 0) throw new Error(`${paidBefore} invoices were paid before any webhook arrived`);

    // Each captured event delivered three times, shuffled, over both processes, 50 in flight. Stripe signs each
    // delivery attempt afresh, so each replay carries the fake's exact payload signed now (the first of each uses
    // the fake's own header when it is still within the 300 s tolerance).
    const deliveries = shuffle(captured.flatMap((e) => [e, e, e]));
    const firstUse = new Set<string>();
    const outcomes = new Map<string, number>();
    const w0 = Date.now();
    const ms = await pool(deliveries, 50, async (e, lane) => {
      const signature = firstUse.has(e.id) ? signPayload(e.payload, SECRET, Math.floor(Date.now() / 1000)) : e.signature;
      firstUse.add(e.id);
      const r = await fetch(`http://127.0.0.1:${ports[lane % 2]}/api/webhooks/stripe`, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": signature }, body: e.payload });
      const text = await r.text();
      if (!r.ok) throw new Error(`webhook ${e.type} ${e.id}: ${r.status} ${text}`);
      outcomes.set(String(r.status), (outcomes.get(String(r.status)) ?? 0) + 1);
    });
    const hooks = summarise(ms, (Date.now() - w0) / 1000);
    const [{ paid }] = await ds.query("SELECT COUNT(*) AS paid FROM invoice WHERE status = 'paid' AND paidCents = totalCents");
    const [{ payments }] = await ds.query("SELECT COUNT(*) AS payments FROM payment");
    const [{ overpaid }] = await ds.query("SELECT COUNT(*) AS overpaid FROM invoice WHERE paidCents > totalCents");
    const [{ twice }] = await ds.query("SELECT COUNT(*) AS twice FROM (SELECT invoiceId FROM payment GROUP BY invoiceId HAVING COUNT(*) > 1) t");
    const byOutcome: { outcome: string; n: number }[] = await ds.query("SELECT outcome, COUNT(*) AS n FROM stripe_event GROUP BY outcome");
    const events = Object.fromEntries(byOutcome.map((r) => [r.outcome, Number(r.n)]));
    const [{ complete }] = await ds.query("SELECT COUNT(*) AS complete FROM checkout_session WHERE status = 'complete'");
    const report = {
      invoices: { issued: seqs.length, seconds, perSecond: seqs.length / seconds, unique: new Set(seqs).size === seqs.length, gapless },
      checkouts: { sessions: urls.size, ...checkouts },
      webhooks: {
        events: captured.length, eventTypes: PAYMENT_EVENTS, deliveries: ms.length, httpStatus: Object.fromEntries(outcomes), ...hooks,
        invoicesPaid: Number(paid), paymentsRecorded: Number(payments), paidTwice: Number(twice), overpaid: Number(overpaid),
        eventsApplied: events.applied ?? 0, eventsRejected: events.rejected ?? 0, sessionsComplete: Number(complete),
      },
    };
    console.log(JSON.stringify(report, null, 2));
    const ok = gapless && Number(paid) === N && Number(payments) === N && Number(twice) === 0 && Number(overpaid) === 0 && !events.rejected && Number(complete) === N;
    if (!ok) process.exitCode = 1;
  } finally {
    await Promise.all(servers.map(stop));
    await fake.close();
    await new Promise<void>((resolve) => receiver.close(() => resolve()));
    await ds.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
