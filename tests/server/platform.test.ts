import { startTestApp, makeBakery, makeUser, tokenFor, type TestApp } from "./helpers/app";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds, { name: "Clock Bakery", timeZone: "America/Chicago" });
});
afterAll(() => t.close());

describe("API conventions", () => {
  it("GET /api/health says ok with the database up", async () => {
    const res = await t.http().get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok", db: "up" });
  });

  it("unknown API routes get a 404 in the one error shape", async () => {
    const res = await t.http().get("/api/no-such-thing");
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: "route_not_found", message: expect.stringContaining("/api/no-such-thing"), requestId: expect.any(String) } });
  });

  it("malformed JSON is a 400, a huge body a 413, never a stack trace", async () => {
    const bad = await t.http().post("/api/auth/sign-in").set("Content-Type", "application/json").send('{"email": ');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe("validation_failed");
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts:\d+/);
    const huge = await t.http().post("/api/auth/sign-in").set("Content-Type", "application/json").send(JSON.stringify({ email: "a@b.test", password: "x".repeat(300_000) }));
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe("payload_too_large");
  });

  it("sets security headers (helmet)", async () => {
    const res = await t.http().get("/api/health");
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["content-security-policy"]).toContain("default-src 'self'");
    expect(res.headers["x-powered-by"]).toBeUndefined();
  });

  it("tells every role the bakery's own date from the server clock (IANA zone through luxon)", async () => {
    const token = await tokenFor(t, await makeUser(t.ds, "baker"));
    // 2026-06-10T03:30Z is still 9 June at 22:30 in Chicago (CDT, UTC−5).
    t.clock.set("2026-06-10T03:30:00Z");
    const res = await t.http().get("/api/bakery").set("Authorization", `Bearer ${token}`);
    expect(res.status).toBe(200);
    expect(res.body.bakery).toMatchObject({ name: "Clock Bakery", timeZone: "America/Chicago", today: "2026-06-09" });
    expect(res.body.bakery.now).toBe("2026-06-09T22:30:00.000-05:00");
    t.clock.set("2026-06-10T15:00:00Z");
  });

  it("office summary counts users and accounts", async () => {
    const token = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
    const res = await t.http().get("/api/office/summary").set("Authorization", `Bearer ${token}`);
    expect(res.status).toBe(200);
    expect(res.body.summary.users.total).toBeGreaterThanOrEqual(2);
    expect(res.body.summary.accounts).toEqual({ total: 0, active: 0, onHold: 0, paused: 0, creditHold: 0, closed: 0 });
  });

  it("GET /api/health answers 503 db down when the database is unreachable", async () => {
    await t.ds.destroy();
    const res = await t.http().get("/api/health");
    expect(res.status).toBe(503);
    expect(res.body.db).toBe("down");
  });
});
