import { startTestApp, makeBakery, makeUser, tokenFor, waitForMail, linkToken, TEST_PASSWORD, type TestApp } from "./helpers/app";
import { User } from "../../server/users/user.entity";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds, { name: "Test Bakery" });
});
afterAll(() => t.close());

describe("POST /api/auth/sign-in", () => {
  it("returns a token and the user for each role", async () => {
    for (const role of ["owner", "baker", "bookkeeper", "buyer"] as const) {
      const u = await makeUser(t.ds, role);
      const res = await t.http().post("/api/auth/sign-in").send({ email: u.email.toUpperCase(), password: TEST_PASSWORD });
      expect(res.status).toBe(200);
      expect(res.body.user).toEqual({ id: u.id, email: u.email, name: u.name, role, accountId: u.accountId });
      expect(typeof res.body.token).toBe("string");
      const me = await t.http().get("/api/auth/me").set("Authorization", `Bearer ${res.body.token}`);
      expect(me.status).toBe(200);
      expect(me.body.user.role).toBe(role);
    }
  });

  it("records the last sign-in", async () => {
    const u = await makeUser(t.ds, "baker");
    await tokenFor(t, u);
    const row = await t.ds.getRepository(User).findOneByOrFail({ id: u.id });
    expect(row.lastSignInAt?.toISOString()).toBe(t.clock.now().toISOString());
  });

  it("answers a wrong e-mail and a wrong password with the same 401 message", async () => {
    const u = await makeUser(t.ds, "owner");
    const wrongPw = await t.http().post("/api/auth/sign-in").send({ email: u.email, password: "not the password" });
    const wrongEmail = await t.http().post("/api/auth/sign-in").send({ email: "nobody@nowhere.test", password: TEST_PASSWORD });
    expect(wrongPw.status).toBe(401);
    expect(wrongEmail.status).toBe(401);
    expect(wrongPw.body.error.code).toBe("invalid_credentials");
    expect(wrongPw.body.error.message).toBe(wrongEmail.body.error.message);
  });

  it("gives per-field messages for missing input", async () => {
    const res = await t.http().post("/api/auth/sign-in").send({ email: "not-an-email" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    expect(res.body.error.fields.email).toMatch(/valid e-mail/);
    expect(res.body.error.fields.password).toMatch(/password/i);
  });

  it("refuses with 429 and Retry-After after more than 10 failures for one e-mail in 15 minutes", async () => {
    t.clock.advance(16 * 60 * 1000); // a fresh window: earlier tests failed from this IP too
    const u = await makeUser(t.ds, "buyer");
    for (let i = 0; i < 10; i++) {
      const r = await t.http().post("/api/auth/sign-in").set("X-Test", String(i)).send({ email: u.email, password: "wrong-password-x" });
      expect(r.status).toBe(401);
    }
    const blocked = await t.http().post("/api/auth/sign-in").send({ email: u.email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe("too_many_attempts");
    const retry = Number(blocked.headers["retry-after"]);
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(15 * 60);
    // After the window has passed the right password works again.
    t.clock.advance(15 * 60 * 1000 + 1000);
    const ok = await t.http().post("/api/auth/sign-in").send({ email: u.email, password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
  });

  it("limits one IP across many e-mails too", async () => {
    // supertest always comes from 127.0.0.1; spread the failures over different e-mails.
    t.clock.advance(16 * 60 * 1000);
    for (let i = 0; i < 10; i++) {
      await t.http().post("/api/auth/sign-in").send({ email: `spray${i}@nowhere.test`, password: "wrong-password-x" });
    }
    const res = await t.http().post("/api/auth/sign-in").send({ email: "spray-last@nowhere.test", password: "wrong-password-x" });
    expect(res.status).toBe(429);
    expect(res.headers["retry-after"]).toBeDefined();
    t.clock.advance(16 * 60 * 1000);
  });
});

describe("sessions", () => {
  it("stops a disabled user's existing token at once", async () => {
    const owner = await makeUser(t.ds, "owner");
    const baker = await makeUser(t.ds, "baker");
    const bakerToken = await tokenFor(t, baker);
    expect((await t.http().get("/api/auth/me").set("Authorization", `Bearer ${bakerToken}`)).status).toBe(200);
    const ownerToken = await tokenFor(t, owner);
    const off = await t.http().patch(`/api/users/${baker.id}`).set("Authorization", `Bearer ${ownerToken}`).send({ disabled: true });
    expect(off.status).toBe(200);
    const after = await t.http().get("/api/auth/me").set("Authorization", `Bearer ${bakerToken}`);
    expect(after.status).toBe(401);
    const signIn = await t.http().post("/api/auth/sign-in").send({ email: baker.email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(403);
    expect(signIn.body.error.code).toBe("user_disabled");
  });

  it("expires tokens after 12 hours", async () => {
    const u = await makeUser(t.ds, "baker");
    const token = await tokenFor(t, u);
    t.clock.advance(12 * 3600 * 1000 - 5000);
    expect((await t.http().get("/api/auth/me").set("Authorization", `Bearer ${token}`)).status).toBe(200);
    t.clock.advance(10000);
    const res = await t.http().get("/api/auth/me").set("Authorization", `Bearer ${token}`);
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/expired/);
  });

  it("rejects a forged token", async () => {
    const res = await t.http().get("/api/auth/me").set("Authorization", "Bearer abc.def.ghi");
    expect(res.status).toBe(401);
  });
});

describe("password reset", () => {
  it("answers 202 whether or not the e-mail exists, and mails only a real user", async () => {
    const u = await makeUser(t.ds, "bookkeeper");
    const unknown = await t.http().post("/api/auth/password-reset").send({ email: "ghost@nowhere.test" });
    const known = await t.http().post("/api/auth/password-reset").send({ email: u.email });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    const mail = await waitForMail(t, u.email);
    expect(t.mail.messages.some((m) => m.to.includes("ghost@nowhere.test"))).toBe(false);
    expect(mail.from).toContain("Test Bakery");
    expect(mail.html).toContain("set-password?kind=reset");
    expect(mail.text).toContain("set-password?kind=reset");
  });

  it("sets a new password once; the link then stops working", async () => {
    const u = await makeUser(t.ds, "baker");
    await t.http().post("/api/auth/password-reset").send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    const short = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "short" });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe("Use at least 10 characters.");
    const ok = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "a brand new password" });
    expect(ok.status).toBe(200);
    expect(ok.body.user.email).toBe(u.email);
    const again = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "another new password" });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe("token_used");
    expect((await t.http().post("/api/auth/sign-in").send({ email: u.email, password: "a brand new password" })).status).toBe(200);
  });

  it("expires a reset link after 1 hour", async () => {
    const u = await makeUser(t.ds, "baker");
    t.mail.clear();
    await t.http().post("/api/auth/password-reset").send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    t.clock.advance(60 * 60 * 1000 + 1);
    const res = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "a brand new password" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("token_expired");
  });

  it("stores only a hash of the token", async () => {
    const u = await makeUser(t.ds, "baker");
    t.mail.clear();
    await t.http().post("/api/auth/password-reset").send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    const rows: { tokenHash: string }[] = await t.ds.query("SELECT tokenHash FROM auth_token");
    expect(rows.some((r) => r.tokenHash === token)).toBe(false);
    expect(rows.every((r) => /^[0-9a-f]{64}$/.test(r.tokenHash))).toBe(true);
  });
});
