import jwt from "jsonwebtoken";
import { startTestApp, makeBakery, makeUser, tokenFor, waitForMail, linkToken, TEST_PASSWORD, type TestApp } from "./helpers/app";
import { User } from "../../server/users/user.entity";
import { AuthToken } from "../../server/auth/auth-token.entity";
import { OutboxMail } from "../../server/mail/outbox.entity";
import { SIGN_IN_MAX_PER_ADDRESS, SIGN_IN_MAX_PER_PAIR, RESET_MAX_PER_EMAIL, RESET_MAX_PER_ADDRESS, slowdownMs } from "../../server/auth/auth.service";
import { hashScheme } from "../../server/auth/password-hash";
import { PASSWORD_COMMON, PASSWORD_PATTERN } from "../../shared/schemas/common";

// The app reads TRUST_PROXY when it is built: with one proxy trusted, X-Forwarded-For sets the client address,
// which is how the tests below sign in "from" different addresses (Express docs, "Express behind proxies").
process.env.TRUST_PROXY = "1";
// Three hashing slots (27 sign-ins admitted at once), so 20 concurrent attempts meet the rate limit, not the hashing cap.
process.env.HASH_CONCURRENCY = "3";
// Every password-reset answer takes at least 150 ms by design, and the slow-down waits on purpose.
jest.setTimeout(60_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds, { name: "Test Bakery" });
});
afterAll(() => t.close());

let addressSeq = 0;
/** A fresh client address (TEST-NET-3, RFC 5737) for each call. */
const nextAddress = () => `203.0.113.${++addressSeq % 250}`;
const signInFrom = (ip: string, email: string, password: string) => t.http().post("/api/auth/sign-in").set("X-Forwarded-For", ip).send({ email, password });
const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
const askReset = () => t.http().post("/api/auth/password-reset").set("X-Forwarded-For", nextAddress());
const me = (token: string) => t.http().get("/api/auth/me").set(bearer(token));
/** Start a fresh 15-minute window for every sign-in counter. */
const freshWindow = () => t.clock.advance(61 * 60 * 1000);

describe("POST /api/auth/sign-in", () => {
  it("returns a token and the user for each role", async () => {
    for (const role of ["owner", "baker", "bookkeeper", "buyer"] as const) {
      const u = await makeUser(t.ds, role);
      const res = await t.http().post("/api/auth/sign-in").send({ email: u.email.toUpperCase(), password: TEST_PASSWORD });
      expect(res.status).toBe(200);
      expect(res.body.user).toEqual({ id: u.id, email: u.email, name: u.name, role, accountId: u.accountId });
      expect(typeof res.body.token).toBe("string");
      const check = await me(res.body.token);
      expect(check.status).toBe(200);
      expect(check.body.user.role).toBe(role);
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

  it("stores new passwords as scrypt and counts every character (no 72-byte bcrypt truncation)", async () => {
    // OWASP ASVS 4.0.3 V2.1.3: no truncation. bcrypt ignored everything after byte 72, so these two were one password.
    const u = await makeUser(t.ds, "baker");
    const long = `${"rye and caraway, ".repeat(5)}first`; // 90 characters
    const other = `${"rye and caraway, ".repeat(5)}other`; // the same first 85 characters
    await askReset().send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    expect((await t.http().post("/api/auth/password-reset/confirm").send({ token, password: long })).status).toBe(200);
    const row = await t.ds.getRepository(User).findOneByOrFail({ id: u.id });
    expect(hashScheme(row.passwordHash)).toBe("scrypt");
    expect(row.passwordHash).toMatch(/^\$scrypt\$ln=\d+,r=8,p=1\$/);
    expect((await signInFrom(nextAddress(), u.email, other)).status).toBe(401);
    expect((await signInFrom(nextAddress(), u.email, long)).status).toBe(200);
  });
});

describe("sign-in limits", () => {
  it("refuses with 429 and Retry-After after 10 failures for one e-mail from one address in 15 minutes", async () => {
    freshWindow();
    const u = await makeUser(t.ds, "buyer");
    const ip = nextAddress();
    for (let i = 0; i < SIGN_IN_MAX_PER_PAIR; i++) {
      const r = await signInFrom(ip, u.email, "wrong-password-x");
      expect(r.status).toBe(401);
    }
    const blocked = await signInFrom(ip, u.email, TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe("too_many_attempts");
    const retry = Number(blocked.headers["retry-after"]);
    expect(retry).toBeGreaterThan(0);
    expect(retry).toBeLessThanOrEqual(15 * 60);
    // After the window has passed the right password works again.
    t.clock.advance(15 * 60 * 1000 + 1000);
    const ok = await signInFrom(ip, u.email, TEST_PASSWORD);
    expect(ok.status).toBe(200);
  });

  it("limits one address across many e-mails too", async () => {
    freshWindow();
    const ip = nextAddress();
    for (let i = 0; i < SIGN_IN_MAX_PER_ADDRESS; i++) {
      expect((await signInFrom(ip, `spray${i}@nowhere.test`, "wrong-password-x")).status).toBe(401);
    }
    const res = await signInFrom(ip, "spray-last@nowhere.test", "wrong-password-x");
    expect(res.status).toBe(429);
    expect(res.headers["retry-after"]).toBeDefined();
    // Another address is not affected.
    expect((await signInFrom(nextAddress(), "spray-last@nowhere.test", "wrong-password-x")).status).toBe(401);
  });

  it("evaluates exactly the limit when 20 wrong attempts arrive at once", async () => {
    freshWindow();
    const u = await makeUser(t.ds, "baker");
    const ip = nextAddress();
    const answers = await Promise.all(Array.from({ length: 20 }, () => signInFrom(ip, u.email, "wrong-password-x")));
    const statuses = answers.map((r) => r.status);
    // A 401 means the password was checked; a 429 means it was refused before.
    expect(statuses.filter((s) => s === 401)).toHaveLength(SIGN_IN_MAX_PER_PAIR);
    expect(statuses.filter((s) => s === 429)).toHaveLength(20 - SIGN_IN_MAX_PER_PAIR);
    // The refused ones were not counted: once the window ends, one more try is evaluated again.
    t.clock.advance(15 * 60 * 1000 + 1000);
    expect((await signInFrom(ip, u.email, TEST_PASSWORD)).status).toBe(200);
  });

  it("an attacker at one address cannot lock the owner out at another; many failures only slow the e-mail down", async () => {
    freshWindow();
    const owner = await makeUser(t.ds, "owner");
    const attacker = nextAddress();
    for (let i = 0; i < SIGN_IN_MAX_PER_PAIR + 2; i++) await signInFrom(attacker, owner.email, `guess-number-${i}`);
    // The attacker's address is locked for this e-mail, even with the right password…
    expect((await signInFrom(attacker, owner.email, TEST_PASSWORD)).status).toBe(429);
    // …and a second attacking address adds failures for the e-mail as a whole.
    const second = nextAddress();
    for (let i = 0; i < 2; i++) expect((await signInFrom(second, owner.email, `other-guess-${i}`)).status).toBe(401);
    // The owner, elsewhere, gets in with the right password — after the slow-down for 12 failures.
    const wait = slowdownMs(SIGN_IN_MAX_PER_PAIR + 2);
    expect(wait).toBeGreaterThan(0);
    const started = Date.now();
    const res = await signInFrom(nextAddress(), owner.email, TEST_PASSWORD);
    const took = Date.now() - started;
    expect(res.status).toBe(200);
    expect(took).toBeGreaterThanOrEqual(wait - 20);
    expect(took).toBeLessThan(wait + 3000);
  });
});

describe("sessions", () => {
  it("stops a disabled user's existing token at once, and re-enabling does not revive it", async () => {
    const owner = await makeUser(t.ds, "owner");
    const baker = await makeUser(t.ds, "baker");
    const bakerToken = await tokenFor(t, baker);
    expect((await me(bakerToken)).status).toBe(200);
    const ownerToken = await tokenFor(t, owner);
    const off = await t.http().patch(`/api/users/${baker.id}`).set(bearer(ownerToken)).send({ disabled: true });
    expect(off.status).toBe(200);
    expect((await me(bakerToken)).status).toBe(401);
    const signIn = await t.http().post("/api/auth/sign-in").send({ email: baker.email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(403);
    expect(signIn.body.error.code).toBe("user_disabled");
    const on = await t.http().patch(`/api/users/${baker.id}`).set(bearer(ownerToken)).send({ disabled: false });
    expect(on.status).toBe(200);
    expect((await me(bakerToken)).status).toBe(401);
    expect((await me(await tokenFor(t, baker))).status).toBe(200);
  });

  it("a password reset ends every session signed in with the old password", async () => {
    const u = await makeUser(t.ds, "bookkeeper");
    const before = await tokenFor(t, u);
    t.mail.clear();
    await askReset().send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    const done = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "fresh loaves at dawn" });
    expect(done.status).toBe(200);
    const old = await me(before);
    expect(old.status).toBe(401);
    expect(old.body.error.message).toMatch(/ended/);
    expect((await me(done.body.token)).status).toBe(200);
  });

  it("a role change ends the person's sessions; a name change does not", async () => {
    const owner = await makeUser(t.ds, "owner");
    const baker = await makeUser(t.ds, "baker");
    const ownerToken = await tokenFor(t, owner);
    const bakerToken = await tokenFor(t, baker);
    expect((await t.http().patch(`/api/users/${baker.id}`).set(bearer(ownerToken)).send({ name: "Tomas L." })).status).toBe(200);
    expect((await me(bakerToken)).status).toBe(200);
    expect((await t.http().patch(`/api/users/${baker.id}`).set(bearer(ownerToken)).send({ role: "bookkeeper" })).status).toBe(200);
    expect((await me(bakerToken)).status).toBe(401);
    const again = await me(await tokenFor(t, baker));
    expect(again.body.user.role).toBe("bookkeeper");
  });

  it("sign-out ends the session on the server", async () => {
    const u = await makeUser(t.ds, "buyer");
    const token = await tokenFor(t, u);
    const out = await t.http().post("/api/auth/sign-out").set(bearer(token));
    expect(out.status).toBe(204);
    expect((await me(token)).status).toBe(401);
    // The token is dead: signing out with it again is refused too.
    expect((await t.http().post("/api/auth/sign-out").set(bearer(token))).status).toBe(401);
    expect((await t.http().post("/api/auth/sign-out")).status).toBe(401);
    expect((await me(await tokenFor(t, u))).status).toBe(200);
  });

  it("refuses a correctly signed token that carries no version or an old one", async () => {
    const u = await makeUser(t.ds, "baker");
    const iat = Math.floor(t.clock.now().getTime() / 1000);
    const noVersion = jwt.sign({ sub: String(u.id), role: u.role, iat }, t.ctx.config.jwtSecret, { algorithm: "HS256", expiresIn: 3600 });
    const oldVersion = jwt.sign({ sub: String(u.id), role: u.role, ver: -1, iat }, t.ctx.config.jwtSecret, { algorithm: "HS256", expiresIn: 3600 });
    const current = jwt.sign({ sub: String(u.id), role: u.role, ver: 0, iat }, t.ctx.config.jwtSecret, { algorithm: "HS256", expiresIn: 3600 });
    expect((await me(noVersion)).status).toBe(401);
    expect((await me(oldVersion)).status).toBe(401);
    expect((await me(current)).status).toBe(200);
  });

  it("expires tokens after 12 hours", async () => {
    const u = await makeUser(t.ds, "baker");
    const token = await tokenFor(t, u);
    t.clock.advance(12 * 3600 * 1000 - 5000);
    expect((await me(token)).status).toBe(200);
    t.clock.advance(10000);
    const res = await me(token);
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
    const unknown = await askReset().send({ email: "ghost@nowhere.test" });
    const known = await askReset().send({ email: u.email });
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
    await askReset().send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    const short = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "short" });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe("Use at least 12 characters.");
    const ok = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "a brand new password" });
    expect(ok.status).toBe(200);
    expect(ok.body.user.email).toBe(u.email);
    const again = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "another new password" });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe("token_used");
    expect((await signInFrom(nextAddress(), u.email, "a brand new password")).status).toBe(200);
  });

  it("refuses weak passwords by OWASP ASVS 4.0.3 V2.1 and keeps the link usable", async () => {
    const u = await makeUser(t.ds, "baker");
    t.mail.clear();
    await askReset().send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    const refused: Array<[string, string]> = [
      ["aaaaaaaaaa", "Use at least 12 characters."], // V2.1.1
      ["1234567890", "Use at least 12 characters."],
      [" ".repeat(10), "Use at least 12 characters."], // runs of spaces count once
      [" ".repeat(20), "Use at least 12 characters."],
      ["aaaaaaaaaaaa", PASSWORD_PATTERN], // NIST SP 800-63B §5.1.1.2: repetitive
      ["abcdefghijklmn", PASSWORD_PATTERN], // sequential
      ["password1234", PASSWORD_COMMON], // V2.1.7: on the common-password list
      ["Password 1234", PASSWORD_COMMON],
      ["qwerty123456", PASSWORD_COMMON],
      ["x".repeat(40) + "y".repeat(89), "Use at most 128 characters."], // V2.1.2
    ];
    for (const [password, message] of refused) {
      const res = await t.http().post("/api/auth/password-reset/confirm").send({ token, password });
      expect({ password, status: res.status, field: res.body.error?.fields?.password }).toEqual({ password, status: 400, field: message });
    }
    // 128 characters of anything (no composition rules, V2.1.9) and Unicode (V2.1.4) are fine.
    const longest = "crumb & crust ".repeat(9) + "rý";
    expect(Array.from(longest).length).toBe(128);
    const ok = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: longest });
    expect(ok.status).toBe(200);
    expect((await signInFrom(nextAddress(), u.email, longest)).status).toBe(200);
  });

  it("expires a reset link after 1 hour", async () => {
    const u = await makeUser(t.ds, "baker");
    t.mail.clear();
    await askReset().send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    t.clock.advance(60 * 60 * 1000 + 1);
    const res = await t.http().post("/api/auth/password-reset/confirm").send({ token, password: "a brand new password" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("token_expired");
  });

  it("stores only a hash of the token", async () => {
    const u = await makeUser(t.ds, "baker");
    t.mail.clear();
    await askReset().send({ email: u.email });
    const token = linkToken((await waitForMail(t, u.email)).text);
    const rows: { tokenHash: string }[] = await t.ds.query("SELECT tokenHash FROM auth_token");
    expect(rows.some((r) => r.tokenHash === token)).toBe(false);
    expect(rows.every((r) => /^[0-9a-f]{64}$/.test(r.tokenHash))).toBe(true);
  });

  it("25 requests for one e-mail send at most 3 mails", async () => {
    freshWindow();
    const u = await makeUser(t.ds, "owner");
    const answers = [];
    // From 25 addresses, so only the per-e-mail limit is at work.
    for (let i = 0; i < 25; i++) answers.push(await t.http().post("/api/auth/password-reset").set("X-Forwarded-For", nextAddress()).send({ email: u.email }));
    expect(answers.filter((r) => r.status === 202)).toHaveLength(RESET_MAX_PER_EMAIL);
    const refused = answers.filter((r) => r.status === 429);
    expect(refused).toHaveLength(25 - RESET_MAX_PER_EMAIL);
    expect(Number(refused[0].headers["retry-after"])).toBeGreaterThan(0);
    expect(await t.ds.getRepository(OutboxMail).countBy({ toAddress: u.email, kind: "password_reset" })).toBe(RESET_MAX_PER_EMAIL);
    // An unknown e-mail is limited the same way: the answers do not tell which e-mails exist.
    const ghost = [];
    for (let i = 0; i < 5; i++) ghost.push((await t.http().post("/api/auth/password-reset").set("X-Forwarded-For", nextAddress()).send({ email: "nobody.here@nowhere.test" })).status);
    expect(ghost).toEqual([202, 202, 202, 429, 429]);
  });

  it("limits one address asking for many e-mails", async () => {
    freshWindow();
    const ip = nextAddress();
    const statuses = [];
    for (let i = 0; i < RESET_MAX_PER_ADDRESS + 1; i++) statuses.push((await t.http().post("/api/auth/password-reset").set("X-Forwarded-For", ip).send({ email: `someone${i}@nowhere.test` })).status);
    expect(statuses.slice(0, RESET_MAX_PER_ADDRESS).every((s) => s === 202)).toBe(true);
    expect(statuses[RESET_MAX_PER_ADDRESS]).toBe(429);
  });

  it("takes the same time and writes the same rows for known and unknown e-mails", async () => {
    freshWindow();
    const known: User[] = [];
    for (let i = 0; i < 20; i++) known.push(await makeUser(t.ds, "baker"));
    const time = async (email: string) => {
      const started = process.hrtime.bigint();
      const res = await t.http().post("/api/auth/password-reset").set("X-Forwarded-For", nextAddress()).send({ email });
      expect(res.status).toBe(202);
      return Number(process.hrtime.bigint() - started) / 1e6;
    };
    await time("warm-up@nowhere.test");
    const knownMs: number[] = [];
    const unknownMs: number[] = [];
    // Interleaved, so a busy moment on the machine hits both sides alike.
    for (let i = 0; i < 20; i++) {
      knownMs.push(await time(known[i].email));
      unknownMs.push(await time(`unknown${i}@nowhere.test`));
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const [k, u] = [median(knownMs), median(unknownMs)];
    // Before the fix the medians differed by 70% (8.2 ms against 4.8 ms). Within 5% now.
    expect(Math.abs(k - u) / Math.max(k, u)).toBeLessThan(0.05);
    // The same database writes: one auth_token row each; only the real one can be used and has a mail.
    const knownRows = await t.ds.getRepository(AuthToken).findBy({ email: known[0].email });
    const unknownRows = await t.ds.getRepository(AuthToken).findBy({ email: "unknown0@nowhere.test" });
    expect(knownRows).toHaveLength(1);
    expect(unknownRows).toHaveLength(1);
    expect(knownRows[0].revokedAt).toBeNull();
    expect(unknownRows[0].revokedAt).not.toBeNull();
    expect(await t.ds.getRepository(OutboxMail).countBy({ toAddress: "unknown0@nowhere.test" })).toBe(0);
  });
});
