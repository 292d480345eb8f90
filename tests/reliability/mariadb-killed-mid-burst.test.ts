import http from "node:http";
import type { AddressInfo } from "node:net";
import crypto from "node:crypto";
import { Writable } from "node:stream";
import pino from "pino";
import mysql from "mysql2/promise";
import type { DataSource } from "typeorm";
import { PrivateMariadb, sleep, until } from "./helpers/private-mariadb";
import { createDataSource } from "../../server/db/data-source";
import { loadConfig } from "../../server/config";
import { buildContext } from "../../server/context";
import { createApp } from "../../server/app";
import { FixedClock } from "../../server/clock";
import { createSmtpMailer } from "../../server/mail/mailer";
import { createLogger } from "../../server/logger";
import { makeAccount, makeBakery, makeProduct, makeUser, TEST_PASSWORD } from "../server/helpers/app";

/**
 * The fault the issue found: MariaDB SIGKILLed in the middle of an order burst. Buyers keep sending, each order
 * with its own Idempotency-Key and the same key on every retry (what the web client does when the buyer presses
 * the button again). Checked: no acknowledged order lost, none twice, 503 + Retry-After (never 500) while the
 * database is away, and the server's pool serving again by itself once MariaDB is back — no server restart.
 * Every loop is bounded in count and time.
 */

const NOW = "2026-06-10T15:00:00Z"; // Wed 10 Jun 2026 10:00 CDT; the dates below are still before their cut-offs.
const BUYERS = 24;
const OUTAGE_MS = 3000;
const DEADLINE_MS = 120_000;

let db: PrivateMariadb;
let ds: DataSource;
let server: http.Server;
let base: string;
const logLines: string[] = [];

beforeAll(async () => {
  db = await PrivateMariadb.start();
  const settings = { ...loadConfig().db, host: "127.0.0.1", port: db.port, user: "panwise", password: "panwise-local", database: db.database };
  ds = createDataSource(settings);
  await ds.initialize();
  await ds.runMigrations({ transaction: "each" });
  const config = { ...loadConfig(), db: settings, publicUrl: "http://panwise.test", logLevel: "error" };
  const ctx = buildContext({ config, dataSource: ds, clock: new FixedClock(NOW), mailer: createSmtpMailer("smtp://127.0.0.1:9", "orders@bakery.test", createLogger("silent")) });
  // Keep the server's error log: a 500 in this test prints why.
  ctx.logger = pino({ level: "warn" }, new Writable({ write(chunk, _enc, cb) { logLines.push(String(chunk)); cb(); } })) as typeof ctx.logger;
  const app = createApp(ctx);
  server = http.createServer(app);
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
}, 180_000);

afterAll(async () => {
  await new Promise<void>((r) => { server?.closeAllConnections(); server ? server.close(() => r()) : r(); });
  await ds?.destroy().catch(() => undefined);
  await db?.stop();
}, 90_000);

interface Attempt { status: number; retryAfter: string | null; code?: string; message?: string }

async function call(method: string, path: string, token: string | null, body?: unknown, key?: string): Promise<{ status: number; body: any; retryAfter: string | null }> {
  const headers: Record<string, string> = { Accept: "application/json" };
  if (token) headers.Authorization = `Bearer ${token}`;
  if (body !== undefined) headers["Content-Type"] = "application/json";
  if (key) headers["Idempotency-Key"] = key;
  const res = await fetch(`${base}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(30_000) });
  const text = await res.text();
  let parsed: unknown = undefined;
  try { parsed = text ? JSON.parse(text) : undefined; } catch { parsed = text; }
  return { status: res.status, body: parsed, retryAfter: res.headers.get("retry-after") };
}

it("loses no acknowledged order, doubles none, and answers 503 (not 500) while MariaDB is down", async () => {
  await makeBakery(ds);
  const products = [await makeProduct(ds, { name: "Dinner rolls" }), await makeProduct(ds, { name: "Slider buns" })];
  const buyers: { token: string; accountId: number }[] = [];
  for (let i = 0; i < BUYERS; i++) {
    const account = await makeAccount(ds);
    const user = await makeUser(ds, "buyer", { accountId: account.id });
    const signIn = await call("POST", "/api/auth/sign-in", null, { email: user.email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(200);
    buyers.push({ token: signIn.body.token, accountId: account.id });
  }
  const cal = await call("GET", "/api/calendar?from=2026-06-11&to=2026-06-20", buyers[0].token);
  expect(cal.status).toBe(200);
  const dates: string[] = cal.body.days.filter((d: { orderable: boolean }) => d.orderable).map((d: { date: string }) => d.date).slice(0, 5);
  expect(dates.length).toBeGreaterThanOrEqual(3);

  const attempts: Attempt[] = [];
  const acknowledged = new Map<string, { orderId: number; accountId: number; date: string; quantity: number }>();
  let outage: { killedAt: number; backAt: number | null } | null = null;
  const started = Date.now();

  /** One order: sent until answered 201 (or found already there), same key every time; bounded. */
  async function placeOrder(b: { token: string; accountId: number }, date: string, n: number) {
    const key = crypto.randomUUID();
    const quantity = 1 + (n % 5);
    const body = { deliveryDate: date, lines: [{ productId: products[n % 2].id, quantity }] };
    for (let i = 0; i < 400 && Date.now() - started < DEADLINE_MS; i++) {
      let res;
      try {
        res = await call("POST", "/api/orders", b.token, body, key);
      } catch {
        await sleep(100);
        continue;
      }
      attempts.push({ status: res.status, retryAfter: res.retryAfter, code: res.body?.error?.code, message: res.body?.error?.message });
      if (res.status === 201) {
        acknowledged.set(key, { orderId: res.body.order.id, accountId: b.accountId, date, quantity });
        return;
      }
      if (res.status === 409 && res.body?.error?.code === "order_exists") {
        // The first try was committed but its answer was lost with the connection: the order is there, once.
        acknowledged.set(key, { orderId: res.body.error.orderId, accountId: b.accountId, date, quantity });
        return;
      }
      if (res.status !== 503) return; // a 500 or anything else: counted below, and the test fails
      await sleep(150 + Math.random() * 150);
    }
  }

  /** The fault: once a quarter of the orders are in, SIGKILL mariadbd, keep it down OUTAGE_MS, start it again. */
  const fault = (async () => {
    const total = BUYERS * dates.length;
    await until(() => acknowledged.size >= total / 4, 60_000, 20);
    db.kill();
    outage = { killedAt: Date.now(), backAt: null };
    await sleep(OUTAGE_MS);
    await db.restart();
    outage.backAt = Date.now();
  })();

  await Promise.all(buyers.map(async (b, i) => {
    for (const [j, date] of dates.entries()) {
      await placeOrder(b, date, i + j);
      await sleep(40);
    }
  }));
  await fault;

  const failures = attempts.filter((a) => a.status !== 201 && a.status !== 503 && !(a.status === 409 && a.code === "order_exists"));
  if (failures.length) console.error(failures.slice(0, 5), logLines.slice(0, 5).join("\n"));
  expect(failures).toEqual([]);
  expect(outage).not.toBeNull();
  // The outage was seen, as 503 service_unavailable with Retry-After and the buyer's words.
  const unavailable = attempts.filter((a) => a.status === 503);
  expect(unavailable.length).toBeGreaterThan(0);
  for (const a of unavailable) {
    expect(a).toMatchObject({ retryAfter: "5", code: "service_unavailable", message: "Ordering is briefly unavailable; nothing was saved; try again in a moment." });
  }
  const o = outage as unknown as { killedAt: number; backAt: number };
  console.log(`burst: ${attempts.length} requests, ${acknowledged.size} orders, ${unavailable.length} answered 503 during a ${((o.backAt - o.killedAt) / 1000).toFixed(1)} s outage`);
  // Every order went through in the end, through the same pool the outage broke.
  expect(acknowledged.size).toBe(BUYERS * dates.length);

  const check = await mysql.createConnection({ host: "127.0.0.1", port: db.port, user: "panwise", password: "panwise-local", database: db.database, dateStrings: true });
  try {
    const [orders] = await check.query<mysql.RowDataPacket[]>("SELECT id, accountId, deliveryDate, status FROM customer_order ORDER BY id");
    const [lines] = await check.query<mysql.RowDataPacket[]>("SELECT orderId, COUNT(*) AS n, SUM(quantity) AS q FROM order_line GROUP BY orderId");
    const byId = new Map(orders.map((o) => [Number(o.id), o]));
    const linesOf = new Map(lines.map((l) => [Number(l.orderId), { n: Number(l.n), q: Number(l.q) }]));
    // Not one lost: every acknowledged order is there, for its account and date, with its one line.
    for (const a of acknowledged.values()) {
      const o = byId.get(a.orderId);
      expect(o).toBeDefined();
      expect(Number(o!.accountId)).toBe(a.accountId);
      expect(String(o!.deliveryDate).slice(0, 10)).toBe(a.date);
      expect(linesOf.get(a.orderId)).toEqual({ n: 1, q: a.quantity });
    }
    // Not one twice: one order per account and date, and no order nobody asked for.
    const pairs = orders.map((o) => `${o.accountId}/${String(o.deliveryDate).slice(0, 10)}`);
    expect(new Set(pairs).size).toBe(pairs.length);
    expect(orders).toHaveLength(BUYERS * dates.length);
  } finally {
    await check.end();
  }
}, 240_000);
