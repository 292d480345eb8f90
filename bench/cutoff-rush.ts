/**
 * Cut-off rush: 300 simulated buyers on loopback place and edit orders for one delivery date during
 * the last minute before its cut-off, then keep trying after it. Reports p50/p99 latency and throughput
 * of order writes, checks that no accepted order is lost or duplicated and none is accepted after the
 * cut-off, and runs a bare Express + mysql2 one-row insert under the same load as the baseline.
 *
 *   node --import tsx bench/cutoff-rush.ts [--buyers 300] [--window 60]
 * Needs the private MariaDB running (npm start, npm run db, or npm test's).
 */
import "reflect-metadata";
import express from "express";
import mysql from "mysql2/promise";
import { DateTime } from "luxon";
import bcrypt from "bcryptjs";
import { createDataSource } from "../server/db/data-source";
import { loadConfig } from "../server/config";
import { spawn } from "node:child_process";
import { ROOT, freePort, sleep, startServer, stop, summarise, waitHttp } from "./lib";

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const BUYERS = arg("buyers", 300);
const WINDOW_S = arg("window", 60);
const AFTER_S = 8;
const ZONE = "America/Chicago";

interface Sample { ms: number; status: number; startedAt: number }

async function setupDatabase(dbName: string, cutoffLocal: DateTime) {
  const base = loadConfig().db;
  const admin = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password });
  await admin.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
  await admin.query(`CREATE DATABASE \`${dbName}\``);
  await admin.end();
  const ds = createDataSource({ ...base, database: dbName });
  await ds.initialize();
  await ds.runMigrations();
  // Cut-off today at HH:mm, delivery tomorrow (lead 1 day), every weekday a delivery day.
  await ds.query("INSERT INTO bakery (name, timeZone, currency, email, phone, address, deliveryWeekdays, cutoffTime, leadDays, horizonDays) VALUES (?,?,?,?,?,?,?,?,?,?)",
    ["Bench Bakery", ZONE, "USD", "bench@bakery.test", "", "", "1,2,3,4,5,6,7", cutoffLocal.toFormat("HH:mm"), 1, 28]);
  for (let p = 1; p <= 6; p++) {
    await ds.query("INSERT INTO product (name, description, saleUnit, piecesPerUnit, pieceGrams, panName, panLengthMm, panWidthMm, unitsPerPan, priceCents, minQuantity, maxQuantity, allergens, mayContain, active, sortOrder) VALUES (?, '', 'tray', 15, 67, '9×13 in pan', 330, 229, 1, ?, 1, 40, 'gluten,wheat,milk', '', 1, ?)", [`Product ${p}`, 1500 + p * 100, p]);
  }
  const hash = bcrypt.hashSync("bench-password-1", 4);
  const values: unknown[] = [];
  for (let i = 1; i <= BUYERS; i++) values.push(`Bench Café ${i}`, "1 Bench St", `billing${i}@bench.test`);
  await ds.query(`INSERT INTO customer_account (businessName, deliveryAddress, billingEmail, notes) VALUES ${Array.from({ length: BUYERS }, () => "(?, ?, ?, '')").join(",")}`, values);
  const accounts: { id: number }[] = await ds.query("SELECT id FROM customer_account ORDER BY id");
  await ds.query(`INSERT INTO user (email, passwordHash, role, name, accountId) VALUES ${accounts.map(() => "(?, ?, 'buyer', ?, ?)").join(",")}`,
    accounts.flatMap((a, i) => [`buyer${i + 1}@bench.test`, hash, `Buyer ${i + 1}`, a.id]));
  return ds;
}

async function rush(base: string, deliveryDate: string, cutoffMs: number) {
  const tokens: string[] = [];
  for (let i = 1; i <= BUYERS; i += 25) {
    const batch = await Promise.all(Array.from({ length: Math.min(25, BUYERS - i + 1) }, (_, k) =>
      fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: `buyer${i + k}@bench.test`, password: "bench-password-1" }) }).then((r) => r.json() as Promise<{ token: string }>)));
    tokens.push(...batch.map((b) => b.token));
  }
  const samples: Sample[] = [];
  const accepted = new Map<number, { orderId: number; lastQty: number; lastAcceptedStart: number }>();
  const start = Date.now();
  const endAt = cutoffMs + AFTER_S * 1000;
  const call = async (method: string, url: string, token: string, body: unknown, key?: string) => {
    const t0 = Date.now();
    const res = await fetch(`${base}${url}`, { method, headers: { "content-type": "application/json", authorization: `Bearer ${token}`, ...(key ? { "idempotency-key": key } : {}) }, body: JSON.stringify(body) });
    const json = (await res.json()) as { order?: { id: number }; error?: { code: string; orderId?: number } };
    samples.push({ ms: Date.now() - t0, status: res.status, startedAt: t0 });
    return { status: res.status, json, t0 };
  };
  await Promise.all(tokens.map(async (token, i) => {
    // Each buyer first shows up at a random moment in the window, then edits every 1–4 s.
    await sleep(Math.random() * Math.max(0, cutoffMs - Date.now() - 3000));
    let orderId: number | null = null;
    while (Date.now() < endAt) {
      const qty = 1 + Math.floor(Math.random() * 20);
      const lines = [{ productId: 1 + (i % 6), quantity: qty }];
      if (orderId === null) {
        const r = await call("POST", "/api/orders", token, { deliveryDate, lines }, `rush-${i}`);
        if (r.status === 201) {
          orderId = r.json.order!.id;
          accepted.set(i, { orderId, lastQty: qty, lastAcceptedStart: r.t0 });
        } else if (r.json.error?.code === "order_exists") orderId = r.json.error.orderId ?? null;
      } else {
        const r = await call("PATCH", `/api/orders/${orderId}`, token, { lines });
        if (r.status === 200) accepted.set(i, { orderId, lastQty: qty, lastAcceptedStart: r.t0 });
      }
      await sleep(1000 + Math.random() * 3000);
    }
  }));
  return { samples, accepted, seconds: (Date.now() - start) / 1000 };
}

/** The baseline: a bare Express route inserting one row with mysql2, under the same client load (300 clients, 1–4 s apart). */
async function baseline(dbName: string, runSeconds: number) {
  const cfg = loadConfig().db;
  const pool = mysql.createPool({ host: cfg.host, port: cfg.port, user: cfg.user, password: cfg.password, database: dbName, connectionLimit: 10 });
  await pool.query("CREATE TABLE bare_insert (id INT AUTO_INCREMENT PRIMARY KEY, accountId INT NOT NULL, qty INT NOT NULL, at DATETIME(3) NOT NULL)");
  const app = express();
  app.use(express.json());
  app.post("/insert", async (req, res) => {
    const [r] = await pool.query("INSERT INTO bare_insert (accountId, qty, at) VALUES (?, ?, NOW(3))", [req.body.accountId, req.body.qty]);
    res.status(201).json({ id: (r as { insertId: number }).insertId });
  });
  const port = await freePort();
  const server = app.listen(port, "127.0.0.1");
  const ms: number[] = [];
  const t0 = Date.now();
  const until = t0 + runSeconds * 1000;
  await Promise.all(Array.from({ length: BUYERS }, async (_, i) => {
    await sleep(Math.random() * 3000);
    for (let k = 0; Date.now() < until; k++) {
      const s = Date.now();
      await fetch(`http://127.0.0.1:${port}/insert`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ accountId: i, qty: k }) });
      ms.push(Date.now() - s);
      await sleep(1000 + Math.random() * 3000);
    }
  }));
  const seconds = (Date.now() - t0) / 1000;
  server.close();
  await pool.end();
  return summarise(ms, seconds);
}

async function main() {
  const dbName = `panwise_bench_${Date.now().toString(36)}`;
  const now = DateTime.now().setZone(ZONE);
  // The cut-off: the first whole minute at least WINDOW_S seconds away.
  const cutoff = now.plus({ seconds: WINDOW_S + 60 }).startOf("minute");
  const deliveryDate = cutoff.plus({ days: 1 }).toISODate()!;
  console.log(`bench: ${BUYERS} buyers, cut-off ${cutoff.toISO()} for delivery ${deliveryDate}`);
  const ds = await setupDatabase(dbName, cutoff);
  // The mail fake runs in its own process, as an SMTP server would: parsing 3,000 mails must not slow the simulated buyers.
  const [smtpPort, mailHttpPort] = [await freePort(), await freePort()];
  const mail = spawn("node", ["--import", "tsx", "fakes/mail/main.ts"], { cwd: ROOT, env: { ...process.env, MAIL_SMTP_PORT: String(smtpPort), MAIL_HTTP_PORT: String(mailHttpPort) }, stdio: "ignore" });
  await waitHttp(`http://127.0.0.1:${mailHttpPort}/api/messages`);
  const port = await freePort();
  const smtp = process.argv.includes("--no-mail") ? `smtp://127.0.0.1:${await freePort()}` : `smtp://127.0.0.1:${smtpPort}`;
  const server = startServer({ PORT: String(port), DB_NAME: dbName, SMTP_URL: smtp, LOG_LEVEL: "warn", DB_POOL_SIZE: "20" });
  try {
    await waitHttp(`http://127.0.0.1:${port}/api/health`);
    // Start the rush so that the window before the cut-off is WINDOW_S seconds.
    await sleep(Math.max(0, cutoff.toMillis() - WINDOW_S * 1000 - Date.now()));
    const { samples, accepted, seconds } = await rush(`http://127.0.0.1:${port}`, deliveryDate, cutoff.toMillis());
    const writes = summarise(samples.map((s) => s.ms), seconds);
    const ok = samples.filter((s) => s.status < 300);
    const afterCutoffAccepted = ok.filter((s) => s.startedAt >= cutoff.toMillis()).length;
    const refusedAfter = samples.filter((s) => s.startedAt >= cutoff.toMillis() && s.status === 409).length;
    const errors5xx = samples.filter((s) => s.status >= 500).length;

    // Lost or duplicated: every buyer's last accepted quantity must be what the database holds.
    const rows: { accountId: number; n: string }[] = await ds.query("SELECT accountId, COUNT(*) AS n FROM customer_order WHERE deliveryDate = ? GROUP BY accountId", [deliveryDate]);
    const duplicates = rows.filter((r) => Number(r.n) > 1).length;
    const lines: { orderId: number; quantity: number }[] = await ds.query("SELECT l.orderId, l.quantity FROM order_line l JOIN customer_order o ON o.id = l.orderId WHERE o.deliveryDate = ?", [deliveryDate]);
    const qtyByOrder = new Map(lines.map((l) => [Number(l.orderId), l.quantity]));
    let lost = 0;
    for (const a of accepted.values()) if (qtyByOrder.get(a.orderId) !== a.lastQty) lost++;
    const lockedCount: { n: string }[] = await ds.query("SELECT COUNT(*) AS n FROM customer_order WHERE deliveryDate = ? AND status = 'locked'", [deliveryDate]);

    const base = await baseline(dbName, Math.min(60, WINDOW_S));
    const report = {
      buyers: BUYERS,
      windowSeconds: WINDOW_S,
      orderWrites: { ...writes, accepted: ok.length, refusedAfterCutoff: refusedAfter, errors5xx },
      checks: { ordersPlaced: accepted.size, lost, duplicates, acceptedAfterCutoff: afterCutoffAccepted, lockedAfterCutoff: Number(lockedCount[0].n) },
      baselineBareInsert: base,
      ratio: { p50: writes.p50 / base.p50, p99: writes.p99 / base.p99 },
      target: { p99UnderMs: 250, met: writes.p99 < 250 },
    };
    console.log(JSON.stringify(report, null, 2));
    if (lost || duplicates || afterCutoffAccepted) process.exitCode = 1;
  } finally {
    await stop(server);
    await stop(mail);
    await ds.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
