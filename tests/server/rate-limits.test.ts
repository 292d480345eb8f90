import express from "express";
import request from "supertest";
import { startTestApp, makeBakery, makeAccount, makeUser, tokenFor, auth, linkToken, waitForMail, type TestApp } from "./helpers/app";
import { rateLimits, purgeRateLimits, RATE_LIMIT_TABLE } from "../../server/http/rate-limits";
import { errorHandler } from "../../server/http/errors";
import { createApp } from "../../server/app";

/**
 * Issue 11: limits beyond sign-in through rate-limiter-flexible's MySQL store — reset and invitation link checks,
 * calendar-feed fetches (per address and per token), card-payment pages (per user) — each a 429 `rate_limited`
 * with Retry-After in the one error shape, counted in MariaDB (rate_limit_points), not in the process.
 * Small limits here (server/config.ts reads RATE_LIMIT_<NAME>="points/seconds"), so the tests run fast.
 */
process.env.TRUST_PROXY = "1";
process.env.RATE_LIMIT_TOKEN_CHECK = "3/600";
process.env.RATE_LIMIT_FEED_TOKEN = "2/600";
process.env.RATE_LIMIT_FEED_ADDRESS = "5/600";
process.env.RATE_LIMIT_CHECKOUT = "2/600";

let t: TestApp;
let owner: string;
let accountId: number;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds, { name: "Limit Bakery" });
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  accountId = (await makeAccount(t.ds)).id;
}, 60_000);
afterAll(() => t.close());

let addressSeq = 0;
/** A fresh client address (TEST-NET-2, RFC 5737) for each call. */
const nextAddress = () => `198.51.100.${++addressSeq}`;

function expectRateLimited(res: request.Response) {
  expect(res.status).toBe(429);
  const retryAfter = Number(res.headers["retry-after"]);
  expect(retryAfter).toBeGreaterThan(0);
  expect(retryAfter).toBeLessThanOrEqual(600);
  expect(res.body.error).toMatchObject({ code: "rate_limited", retryAfterSeconds: retryAfter, requestId: res.headers["x-request-id"] });
  expect(res.body.error.message).toMatch(/Try again in \d+ minutes?\.$/);
}

describe("reset and invitation link checks (per address)", () => {
  it("GET /api/auth/invitations/:token, POST …/accept and POST …/password-reset/confirm share one limit", async () => {
    const ip = nextAddress();
    const peek = await t.http().get("/api/auth/invitations/not-a-token").set("X-Forwarded-For", ip);
    const accept = await t.http().post("/api/auth/invitations/accept").set("X-Forwarded-For", ip).send({ token: "nope", password: "a long enough password", name: "N" });
    const confirm = await t.http().post("/api/auth/password-reset/confirm").set("X-Forwarded-For", ip).send({ token: "nope", password: "a long enough password" });
    expect([peek.status, accept.status, confirm.status]).toEqual([400, 400, 400]);
    // The fourth from that address is refused, whichever of the three it is.
    const blocked = await t.http().get("/api/auth/invitations/not-a-token-either").set("X-Forwarded-For", ip);
    expectRateLimited(blocked);
    // Another address is not affected.
    expect((await t.http().get("/api/auth/invitations/not-a-token").set("X-Forwarded-For", nextAddress())).status).toBe(400);
  });

  it("a real invitation link works until the limit, then is refused like any other", async () => {
    await t.http().post("/api/invitations").set(auth(owner)).send({ email: "limit.ok@staff.test", role: "baker" });
    const token = linkToken((await waitForMail(t, "limit.ok@staff.test")).text);
    const ip = nextAddress();
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await t.http().get(`/api/auth/invitations/${encodeURIComponent(token)}`).set("X-Forwarded-For", ip)).status);
    expect(statuses).toEqual([200, 200, 200, 429]);
  });
});

describe("calendar-feed fetches", () => {
  it("limits one feed token, from any address", async () => {
    const created = await t.http().post(`/api/calendar-feed?accountId=${accountId}`).set(auth(owner));
    expect(created.status).toBe(201);
    const path = new URL(created.body.url).pathname;
    const first = await t.http().get(path).set("X-Forwarded-For", nextAddress());
    const second = await t.http().get(path).set("X-Forwarded-For", nextAddress());
    expect([first.status, second.status]).toEqual([200, 200]);
    expect(first.text).toContain("BEGIN:VCALENDAR");
    const third = await t.http().get(path).set("X-Forwarded-For", nextAddress());
    expectRateLimited(third);
    expect(third.body.error.message).toBe(`This calendar feed was fetched too often. Try again in 10 minutes.`);
  });

  it("limits one address trying many tokens", async () => {
    const ip = nextAddress();
    const statuses = [];
    for (let i = 0; i < 6; i++) statuses.push((await t.http().get(`/api/feeds/guess${i}.ics`).set("X-Forwarded-For", ip)).status);
    expect(statuses).toEqual([404, 404, 404, 404, 404, 429]);
  });

  it("a burst of concurrent fetches of one new token lets exactly the limit through, and never a 500", async () => {
    const created = await t.http().post(`/api/calendar-feed?accountId=${(await makeAccount(t.ds)).id}`).set(auth(owner));
    const path = new URL(created.body.url).pathname;
    const answers = await Promise.all(Array.from({ length: 20 }, () => t.http().get(path).set("X-Forwarded-For", nextAddress())));
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 200, ...Array(18).fill(429)]);
  });

  it("keeps the counts in MariaDB, keyed by hashes only", async () => {
    const rows: { key: string; points: number; expire: string }[] = await t.ds.query(`SELECT \`key\`, points, expire FROM ${RATE_LIMIT_TABLE}`);
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) expect(r.key).toMatch(/^(tokenCheck|feedToken|feedAddress|checkout):[0-9a-f]{64}$/);
    expect(rows.some((r) => r.key.includes("198.51.100"))).toBe(false);
    // A second app with a context of its own on the same database (another instance) sees the same counts.
    const ip = nextAddress();
    for (let i = 0; i < 5; i++) expect((await t.http().get(`/api/feeds/other${i}.ics`).set("X-Forwarded-For", ip)).status).toBe(404);
    const other = request(createApp({ ...t.ctx }));
    expect((await other.get("/api/feeds/other5.ics").set("X-Forwarded-For", ip)).status).toBe(429);
  });

  it("the purge drops ended windows only", async () => {
    await t.ds.query(`INSERT INTO ${RATE_LIMIT_TABLE} VALUES ('feedToken:old', 9, ?)`, [Date.now() - 1000]);
    const before = Number((await t.ds.query(`SELECT COUNT(*) AS n FROM ${RATE_LIMIT_TABLE}`))[0].n);
    await purgeRateLimits(t.ctx);
    const after: { key: string }[] = await t.ds.query(`SELECT \`key\` FROM ${RATE_LIMIT_TABLE}`);
    expect(after.length).toBe(before - 1);
    expect(after.map((r) => r.key)).not.toContain("feedToken:old");
  });
});

describe("card-payment page creation (per user)", () => {
  // The middleware the checkout route mounts after allow(...): `r.post("/:id/checkout", allow(...), limits.checkout, …)`.
  function checkoutApp(userId: number) {
    const app = express();
    app.use((req, _res, next) => {
      req.user = { id: userId, email: `u${userId}@people.test`, name: "U", role: "buyer", accountId: 1, tokenVersion: 0 } as unknown as typeof req.user;
      next();
    });
    app.post("/api/invoices/:id/checkout", rateLimits(t.ctx).checkout, (_req, res) => void res.status(201).json({ url: "https://pay.test/" }));
    app.use(errorHandler);
    return app;
  }

  it("answers 429 rate_limited with Retry-After once a user asked for too many pages", async () => {
    const mine = checkoutApp(901);
    const statuses = [];
    for (let i = 1; i <= 2; i++) statuses.push((await request(mine).post(`/api/invoices/${i}/checkout`)).status);
    expect(statuses).toEqual([201, 201]);
    const blocked = await request(mine).post("/api/invoices/3/checkout");
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers["retry-after"])).toBeGreaterThan(0);
    expect(blocked.body.error).toMatchObject({ code: "rate_limited", message: "Too many payment pages were opened. Try again in 10 minutes." });
    // Another user has a limit of their own.
    expect((await request(checkoutApp(902)).post("/api/invoices/1/checkout")).status).toBe(201);
  });

  it("is mounted on the real checkout route, after the role check and before the invoice is looked up", async () => {
    const bookkeeper = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await t.http().post("/api/invoices/999999/checkout").set(auth(bookkeeper))).status);
    // Two pages allowed (RATE_LIMIT_CHECKOUT = 2/600): the unknown invoice answers 404 twice, then the limit answers.
    expect(statuses).toEqual([404, 404, 429]);
    // Signed out never reaches the limiter: allow(...) answers first.
    expect((await t.http().post("/api/invoices/999999/checkout")).status).toBe(401);
  });
});
