import http from "node:http";
import type { AddressInfo } from "node:net";
import { startTestApp, makeAccount, makeBakery, makeUser, tokenFor, type TestApp } from "./helpers/app";

/**
 * Issue 8 item 1: a date range that reaches past 9999-12-31 (luxon then writes "+010000-01-01", which sorts
 * before "9999-12-31" as a string) looped forever and blocked the server. Every endpoint that takes a date or a
 * range must refuse what lies outside 2000-01-01..2099-12-31, reversed ranges, and spans above its documented
 * maximum with a 400 that names the limit, within 100 ms, while /api/health keeps answering.
 * The 100 ms budget is the issue's own figure (about 50 ms of CPU at most per request).
 */
const NOW = "2026-06-10T15:00:00Z"; // Wed 10 Jun 2026, 10:00 in Chicago
const BUDGET_MS = 100;

let t: TestApp;
let server: http.Server;
let base: string;
const tokens: Record<"buyer" | "owner" | "bookkeeper" | "baker", string> = { buyer: "", owner: "", bookkeeper: "", baker: "" };

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Range Bakery" });
  const account = await makeAccount(t.ds);
  tokens.buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: account.id }));
  tokens.owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  tokens.bookkeeper = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
  tokens.baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  server = http.createServer(t.app);
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  // Warm up: the first request of each kind pays for module loading and connection set-up.
  for (let i = 0; i < 3; i++) {
    await call({ role: "owner", method: "GET", path: "/api/orders?from=2026-06-01&to=2026-06-02" });
    await call({ role: "buyer", method: "GET", path: "/api/calendar?from=2026-06-01&to=2026-06-02" });
    await call({ role: "buyer", method: "GET", path: "/api/calendar?from=2026-06-02&to=2026-06-01" });
    await fetch(`${base}/api/health`);
  }
}, 60_000); // migrations on a busy shared machine can take longer than Jest's default 5 s
afterAll(async () => {
  await new Promise<void>((r) => { server.closeAllConnections(); server.close(() => r()); });
  await t.close();
});

type Role = keyof typeof tokens;
interface Call { role: Role; method: "GET" | "POST" | "PUT"; path: string; body?: unknown }

async function call(c: Call): Promise<{ status: number; body: { error?: { code: string; message: string; fields?: Record<string, string> } }; ms: number }> {
  const started = performance.now();
  const res = await fetch(base + c.path, {
    method: c.method,
    headers: { Authorization: `Bearer ${tokens[c.role]}`, ...(c.body !== undefined ? { "Content-Type": "application/json" } : {}) },
    body: c.body !== undefined ? JSON.stringify(c.body) : undefined,
  });
  const text = await res.text();
  const ms = performance.now() - started;
  let body = {};
  try { body = JSON.parse(text); } catch { /* a PDF or CSV: no JSON */ }
  return { status: res.status, body, ms };
}

/**
 * The bad request and a health check at the same time: both answer within the budget. Each attempt checks the
 * answer in full; the timing may take up to three attempts, because this machine is shared by several test
 * runs at once. A request that blocks the event loop (seconds, or for ever) misses the budget every time.
 */
async function refusedQuickly(c: Call, limit: RegExp) {
  let timings: number[] = [];
  for (let attempt = 0; attempt < 3; attempt++) {
    const healthStarted = performance.now();
    const [bad, health] = await Promise.all([
      call(c),
      fetch(`${base}/api/health`).then(async (r) => ({ status: r.status, ms: (await r.text(), performance.now() - healthStarted) })),
    ]);
    expect({ status: bad.status, code: bad.body.error?.code }).toEqual({ status: 400, code: "validation_failed" });
    expect(bad.body.error!.message).toMatch(limit);
    expect(Object.keys(bad.body.error!.fields ?? {}).length).toBeGreaterThan(0);
    expect(Object.values(bad.body.error!.fields!).some((m) => limit.test(m))).toBe(true);
    expect(health.status).toBe(200);
    timings = [bad.ms, health.ms];
    if (Math.max(...timings) < BUDGET_MS) break;
  }
  expect(timings[0]).toBeLessThan(BUDGET_MS); // the refused request
  expect(timings[1]).toBeLessThan(BUDGET_MS); // /api/health alongside it
}

const YEARS = /2000-01-01 to 2099-12-31/;
const NOT_A_DATE = /not a calendar date \(use YYYY-MM-DD\)/;
const REVERSED = /end date must not be before the start/;

/** Ranges as from/to: the worst cases, a date past 9999, and a reversed range. */
const RANGE_CASES: [string, string, string, RegExp][] = [
  ["to 9999-12-31", "2026-12-01", "9999-12-31", YEARS],
  ["1900 to 2400", "1900-01-01", "2400-12-31", YEARS],
  ["to 10000-01-01", "2026-12-01", "10000-01-01", NOT_A_DATE],
  ["from 10000-01-01", "10000-01-01", "10000-01-31", NOT_A_DATE],
  ["reversed", "2026-12-10", "2026-12-01", REVERSED],
];
const RANGE_ENDPOINTS: [string, Role][] = [
  ["/api/calendar", "buyer"],
  ["/api/orders", "owner"],
  ["/api/invoices", "bookkeeper"],
];

describe.each(RANGE_ENDPOINTS)("GET %s?from=&to=", (path, role) => {
  it.each(RANGE_CASES)("%s → 400 naming the limit, fast, health responsive", async (_name, from, to, limit) => {
    await refusedQuickly({ role, method: "GET", path: `${path}?from=${from}&to=${to}` }, limit);
  });
});

describe("documented maximum spans", () => {
  it("the calendar answers at most 120 days and the order list at most 366, both counted inclusively", async () => {
    await refusedQuickly({ role: "buyer", method: "GET", path: "/api/calendar?from=2026-06-01&to=2026-09-29" }, /at most 120 days/);
    const ok = await call({ role: "buyer", method: "GET", path: "/api/calendar?from=2026-06-01&to=2026-09-28" });
    expect(ok.status).toBe(200);
    expect((ok.body as { days: unknown[] }).days).toHaveLength(120);
    await refusedQuickly({ role: "owner", method: "GET", path: "/api/orders?from=2026-01-01&to=2027-01-02" }, /at most 366 days of orders/);
    expect((await call({ role: "owner", method: "GET", path: "/api/orders?from=2026-01-01&to=2027-01-01" })).status).toBe(200);
  });

  it("names the span it was given", async () => {
    const res = await call({ role: "buyer", method: "GET", path: "/api/calendar?from=2026-06-01&to=2099-12-31" });
    expect(res.status).toBe(400);
    expect(res.body.error!.fields!.to).toBe("Ask for at most 120 days at a time; this range is 26,877 days.");
  });
});

/** One date: in the query, in the path, or in a body. */
const DATE_CASES: [string, RegExp][] = [
  ["9999-12-31", YEARS],
  ["1900-01-01", YEARS],
  ["2400-12-31", YEARS],
  ["10000-01-01", NOT_A_DATE],
];
const DATE_ENDPOINTS: [string, (d: string) => Call][] = [
  ["GET /api/orders/board?date=", (d) => ({ role: "owner", method: "GET", path: `/api/orders/board?date=${d}` })],
  ["GET /api/orders/board.csv?date=", (d) => ({ role: "baker", method: "GET", path: `/api/orders/board.csv?date=${d}` })],
  ["GET /api/production/plan?date=", (d) => ({ role: "baker", method: "GET", path: `/api/production/plan?date=${d}` })],
  ["GET /api/production/plan.pdf?date=", (d) => ({ role: "baker", method: "GET", path: `/api/production/plan.pdf?date=${d}` })],
  ["POST /api/production/plan/recalculate?date=", (d) => ({ role: "baker", method: "POST", path: `/api/production/plan/recalculate?date=${d}` })],
  ["GET /api/production/forecast?from=", (d) => ({ role: "baker", method: "GET", path: `/api/production/forecast?from=${d}` })],
  ["PUT /api/production/bake-days/:date", (d) => ({ role: "baker", method: "PUT", path: `/api/production/bake-days/${d}`, body: { extraPans: {}, roomC: 22, flourC: 20, pasteC: 25 } })],
  ["POST /api/production/bake-days/:date/progress", (d) => ({ role: "baker", method: "POST", path: `/api/production/bake-days/${d}/progress`, body: { kind: "mix", key: "1", done: true } })],
  ["POST /api/deliveries/:date/confirm", (d) => ({ role: "owner", method: "POST", path: `/api/deliveries/${d}/confirm`, body: { adjustments: [] } })],
  ["POST /api/orders (deliveryDate)", (d) => ({ role: "buyer", method: "POST", path: "/api/orders", body: { deliveryDate: d, lines: [{ productId: 1, quantity: 1 }] } })],
  ["POST /api/invoices/statements (through)", (d) => ({ role: "bookkeeper", method: "POST", path: "/api/invoices/statements", body: { through: d } })],
  ["POST /api/invoices/:id/payments (receivedOn)", (d) => ({ role: "bookkeeper", method: "POST", path: "/api/invoices/999999/payments", body: { amountCents: 100, method: "cheque", reference: "1001", receivedOn: d } })],
  ["PUT /api/settings/calendar (closures)", (d) => ({ role: "owner", method: "PUT", path: "/api/settings/calendar", body: { timeZone: "America/Chicago", deliveryWeekdays: [2, 3], cutoffTime: "14:00", leadDays: 1, horizonDays: 28, closures: [{ date: d, note: "" }] } })],
];

describe.each(DATE_ENDPOINTS)("%s", (_name, make) => {
  it.each(DATE_CASES)("%s → 400 naming the limit, fast, health responsive", async (date, limit) => {
    await refusedQuickly(make(date), limit);
  });
});

describe("PUT /api/standing-orders: start, end and skipped dates", () => {
  const body = (over: object) => ({ startDate: "2026-06-15", endDate: null, intervalWeeks: 1, skipDates: [], lines: [], ...over });
  const cases: [string, object, RegExp][] = [
    ["end 9999-12-31", { endDate: "9999-12-31" }, YEARS],
    ["1900 to 2400", { startDate: "1900-01-01", endDate: "2400-12-31" }, YEARS],
    ["end 10000-01-01", { endDate: "10000-01-01" }, NOT_A_DATE],
    ["reversed", { startDate: "2026-12-10", endDate: "2026-12-01" }, /end date must be after the start date/],
    ["a skipped date in 9999", { skipDates: ["9999-12-31"] }, YEARS],
  ];
  it.each(cases)("%s → 400 naming the limit, fast, health responsive", async (_name, over, limit) => {
    await refusedQuickly({ role: "buyer", method: "PUT", path: "/api/standing-orders", body: body(over) }, limit);
  });
});

describe("POST /api/invoices/statements", () => {
  it("refuses a statement period that ends after today", async () => {
    await refusedQuickly({ role: "bookkeeper", method: "POST", path: "/api/invoices/statements", body: { through: "2026-06-11" } }, /through today at the latest/);
    expect((await call({ role: "bookkeeper", method: "POST", path: "/api/invoices/statements", body: { through: "2026-06-10" } })).status).toBe(200);
  });
});

describe("standing orders that started long ago", () => {
  it("keep every upcoming date while the stored rule starts within a period of last week", async () => {
    const { ruleStart } = await import("../../server/orders/standing.service");
    const { weeklyRule, expandRule } = await import("../../shared/recurrence");
    const { daysBetween } = await import("../../shared/calendar");
    const today = "2026-06-10";
    for (const [startDate, intervalWeeks] of [["2000-01-03", 1], ["2000-01-03", 2], ["2000-01-06", 2], ["2026-05-01", 2], ["2026-06-09", 1], ["2026-07-01", 2]] as const) {
      const weekdays = [2, 4, 6] as const;
      const start = ruleStart(startDate, intervalWeeks, today);
      // The oracle: the rule as written, expanded by the rrule library itself (RFC 5545 §3.3.10).
      const asWritten = expandRule(weeklyRule({ startDate, endDate: null, intervalWeeks, weekdays: [...weekdays] }), today, "2026-10-08");
      const stored = expandRule(weeklyRule({ startDate: start, endDate: null, intervalWeeks, weekdays: [...weekdays] }), today, "2026-10-08");
      expect(stored).toEqual(asWritten);
      expect(asWritten.length).toBeGreaterThan(10);
      expect(Math.abs(daysBetween(start, startDate) % (7 * intervalWeeks))).toBe(0);
      expect(daysBetween(start, today)).toBeLessThanOrEqual(7 + 7 * intervalWeeks);
    }
  });
});
