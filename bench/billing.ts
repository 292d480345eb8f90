/**
 * Billing under load: two server processes against one database.
 *  1. 200 invoices issued at once (dispatch confirmations spread over both processes): numbers must be
 *     unique and gapless; reports invoices issued per second.
 *  2. Signed Stripe webhooks (payment_intent.succeeded for those invoices), each delivered three times,
 *     split over both processes at 50 in flight: reports p50/p99 handling time and checks every invoice
 *     is paid once with one payment.
 *   node --import tsx bench/billing.ts      (needs the private MariaDB running: npm start / npm run db)
 */
import "reflect-metadata";
import mysql from "mysql2/promise";
import Stripe from "stripe";
import bcrypt from "bcryptjs";
import { createDataSource } from "../server/db/data-source";
import { loadConfig } from "../server/config";
import { freePort, startServer, stop, summarise, waitHttp } from "./lib";

const N = 200;
const SECRET = "whsec_bench_secret";

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

  const ports = [await freePort(), await freePort()];
  const env = { DB_NAME: dbName, SMTP_URL: `smtp://127.0.0.1:${await freePort()}`, LOG_LEVEL: "warn", PANWISE_NO_JOBS: "1", STRIPE_WEBHOOK_SECRET: SECRET };
  const servers = ports.map((p) => startServer({ ...env, PORT: String(p) }));
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

    // Webhooks: three deliveries of each event, shuffled, over both processes, 50 in flight.
    const invoices: { id: number; totalCents: number }[] = await ds.query("SELECT id, totalCents FROM invoice");
    const events = invoices.flatMap((inv) => {
      const payload = JSON.stringify({ id: `evt_bench_${inv.id}`, object: "event", type: "payment_intent.succeeded", created: Math.floor(Date.now() / 1000), livemode: false,
        data: { object: { id: `pi_bench_${inv.id}`, object: "payment_intent", amount: inv.totalCents, amount_received: inv.totalCents, currency: "usd", status: "succeeded", latest_charge: `ch_bench_${inv.id}`, metadata: { invoiceId: String(inv.id) } } } });
      return [payload, payload, payload];
    }).sort(() => Math.random() - 0.5);
    const ms: number[] = [];
    let next = 0;
    const w0 = Date.now();
    await Promise.all(Array.from({ length: 50 }, async (_, k) => {
      while (next < events.length) {
        const payload = events[next++];
        const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET });
        const s = Date.now();
        const r = await fetch(`http://127.0.0.1:${ports[k % 2]}/api/webhooks/stripe`, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": header }, body: payload });
        await r.text();
        if (!r.ok) throw new Error(`webhook ${r.status}`);
        ms.push(Date.now() - s);
      }
    }));
    const hooks = summarise(ms, (Date.now() - w0) / 1000);
    const [{ paid }] = await ds.query("SELECT COUNT(*) AS paid FROM invoice WHERE status = 'paid'");
    const [{ payments }] = await ds.query("SELECT COUNT(*) AS payments FROM payment");
    const [{ overpaid }] = await ds.query("SELECT COUNT(*) AS overpaid FROM invoice WHERE paidCents > totalCents");
    const report = {
      invoices: { issued: seqs.length, seconds, perSecond: seqs.length / seconds, unique: new Set(seqs).size === seqs.length, gapless },
      webhooks: { deliveries: ms.length, ...hooks, invoicesPaid: Number(paid), paymentsRecorded: Number(payments), overpaid: Number(overpaid) },
    };
    console.log(JSON.stringify(report, null, 2));
    if (!gapless || Number(payments) !== N || Number(overpaid) !== 0) process.exitCode = 1;
  } finally {
    await Promise.all(servers.map(stop));
    await ds.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
