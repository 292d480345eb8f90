import { spawn } from "node:child_process";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { monitorEventLoopDelay } from "node:perf_hooks";
import bcrypt from "bcryptjs";
import { startTestApp, makeBakery, makeUser, TEST_PASSWORD, type TestApp } from "./helpers/app";
import { User } from "../../server/users/user.entity";
import { HttpError } from "../../server/http/errors";
import {
  BoundedSemaphore,
  PRODUCTION_SCRYPT,
  currentScryptParams,
  hashPassword,
  hashScheme,
  hashingSlots,
  verifyPassword,
} from "../../server/auth/password-hash";

// Client addresses come from X-Forwarded-For with one trusted proxy (Express docs, "Express behind proxies").
process.env.TRUST_PROXY = "1";
jest.setTimeout(180_000);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await makeBakery(t.ds);
});
afterAll(() => t.close());

/** Run fn with SCRYPT_LOG_N (and NODE_ENV) set, then put them back. */
async function withEnv<T>(env: Record<string, string | undefined>, fn: () => Promise<T>): Promise<T> {
  const saved = Object.fromEntries(Object.keys(env).map((k) => [k, process.env[k]]));
  for (const [k, v] of Object.entries(env)) v === undefined ? delete process.env[k] : (process.env[k] = v);
  try {
    return await fn();
  } finally {
    for (const [k, v] of Object.entries(saved)) v === undefined ? delete process.env[k] : (process.env[k] = v);
  }
}

/** 40 sign-ins at once from 40 addresses with wrong passwords; prints what each got. */
const ATTACKERS = `
const base = process.argv[1];
Promise.all(Array.from({ length: 40 }, async (_, i) => {
  const res = await fetch(base + "/api/auth/sign-in", {
    method: "POST",
    headers: { "content-type": "application/json", "x-forwarded-for": "198.51.100." + (i + 1) },
    body: JSON.stringify({ email: "attacker" + i + "@nowhere.test", password: "wrong-password-" + i }),
  });
  const body = await res.json();
  return { status: res.status, retryAfter: res.headers.get("retry-after"), code: body.error && body.error.code };
})).then((r) => process.stdout.write(JSON.stringify(r)), (e) => { console.error(e); process.exit(1); });
`;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

it("new hashes use scrypt with the OWASP Password Storage Cheat Sheet parameters (N=2^17, r=8, p=1) outside tests", async () => {
  await withEnv({ NODE_ENV: "production", SCRYPT_LOG_N: undefined }, async () => {
    expect(currentScryptParams()).toEqual({ logN: 17, r: 8, p: 1 });
    expect(PRODUCTION_SCRYPT).toEqual({ logN: 17, r: 8, p: 1 });
    const hash = await hashPassword("brown butter and sage");
    expect(hash).toMatch(/^\$scrypt\$ln=17,r=8,p=1\$[A-Za-z0-9+/]{22}\$[A-Za-z0-9+/]{43}$/);
    expect(await verifyPassword("brown butter and sage", hash)).toBe(true);
    expect(await verifyPassword("brown butter and sagE", hash)).toBe(false);
  });
});

it("40 concurrent failing sign-ins from 40 addresses at production cost: /api/health stays under 200 ms", async () => {
  // Before: bcrypt on the main thread pushed /api/health to 8.8 s under this load. One listening server, as in
  // production, and real HTTP clients; the health checks share the event loop and the database pool with the sign-ins.
  const server = http.createServer(t.app);
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    await withEnv({ SCRYPT_LOG_N: String(PRODUCTION_SCRYPT.logN) }, async () => {
      // A server that has been running: code paths warm, the dummy hash for unknown e-mails made.
      await (await fetch(`${base}/api/health`)).text();
      const warm = await fetch(`${base}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json", "x-forwarded-for": "198.51.100.250" }, body: JSON.stringify({ email: "warm-up@nowhere.test", password: "not the password" }) });
      expect(warm.status).toBe(401);
      hashingSlots().peakActive = 0;
      // The 40 attackers are another process, as they would be: their HTTP clients do not share this event loop.
      const attackers = spawn(process.execPath, ["-e", ATTACKERS, base], { stdio: ["ignore", "pipe", "inherit"] });
      let out = "";
      attackers.stdout!.on("data", (d) => (out += d));
      let done = false;
      const all = new Promise<Array<{ status: number; retryAfter: string | null; code: string }>>((resolve, reject) =>
        attackers.once("exit", (code) => (code === 0 ? resolve(JSON.parse(out)) : reject(new Error(`attackers exited ${code}`)))),
      ).finally(() => (done = true));
      const healthMs: number[] = [];
      while (!done) {
        const started = process.hrtime.bigint();
        const res = await fetch(`${base}/api/health`);
        await res.text();
        healthMs.push(Number(process.hrtime.bigint() - started) / 1e6);
        expect(res.status).toBe(200);
        await new Promise((r) => setTimeout(r, 100));
      }
      const answers = await all;
      const statuses = answers.map((r) => r.status);
      // Each one is either evaluated (401) or, past the bounded queue, turned away at once (503 with Retry-After).
      expect(statuses.every((s) => s === 401 || s === 503)).toBe(true);
      expect(statuses.filter((s) => s === 401).length).toBeGreaterThanOrEqual(Math.min(40, hashingSlots().max + hashingSlots().maxQueue));
      for (const r of answers.filter((a) => a.status === 503)) {
        expect(r.retryAfter).toBe("5");
        expect(r.code).toBe("busy");
      }
      expect(hashingSlots().peakActive).toBeLessThanOrEqual(hashingSlots().max);
      expect(healthMs.length).toBeGreaterThan(5); // it really ran while the hashing did
      const worst = Math.max(...healthMs);
      if (worst >= 200) console.log(`/api/health answer times (ms): ${healthMs.map(Math.round).join(", ")}`);
      expect(worst).toBeLessThan(200);
    });
  } finally {
    server.closeAllConnections();
    await new Promise((r) => server.close(r));
  }
});

it("an unknown e-mail costs the same scrypt work as a known one", async () => {
  await withEnv({ SCRYPT_LOG_N: "14" }, async () => {
    const stored = await hashPassword("a real stored password");
    await verifyPassword("warm the dummy up", null);
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 7; i++) {
      let started = performance.now();
      expect(await verifyPassword("not the password", stored)).toBe(false);
      known.push(performance.now() - started);
      started = performance.now();
      expect(await verifyPassword("not the password", null)).toBe(false);
      unknown.push(performance.now() - started);
    }
    const [k, u] = [median(known), median(unknown)];
    expect(Math.abs(k - u) / Math.max(k, u)).toBeLessThan(0.3);
  });
});

it("bcrypt-era hashes still sign in, verified off the main thread, and are replaced by scrypt", async () => {
  const legacy = bcrypt.hashSync(TEST_PASSWORD, 12); // ~0.3 s of JavaScript: blocking, if it ran on the main thread
  const u = await makeUser(t.ds, "baker", { passwordHash: legacy });
  expect(hashScheme(legacy)).toBe("bcrypt");
  const lag = monitorEventLoopDelay({ resolution: 10 });
  lag.enable();
  const res = await t.http().post("/api/auth/sign-in").set("X-Forwarded-For", "198.51.100.200").send({ email: u.email, password: TEST_PASSWORD });
  lag.disable();
  expect(res.status).toBe(200);
  expect(lag.max / 1e6).toBeLessThan(150);
  const row = await t.ds.getRepository(User).findOneByOrFail({ id: u.id });
  expect(hashScheme(row.passwordHash)).toBe("scrypt");
  expect((await t.http().post("/api/auth/sign-in").set("X-Forwarded-For", "198.51.100.201").send({ email: u.email, password: TEST_PASSWORD })).status).toBe(200);
  expect((await t.http().post("/api/auth/sign-in").set("X-Forwarded-For", "198.51.100.202").send({ email: u.email, password: "not the password" })).status).toBe(401);
});

it("the hashing cap queues a bounded number and turns the rest away with 503", async () => {
  const sem = new BoundedSemaphore(1, 2);
  let release!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  const order: number[] = [];
  const task = (n: number) => sem.run(async () => {
    order.push(n);
    await gate;
    return n;
  });
  const running = [task(1), task(2), task(3)];
  expect(sem.inUse).toBe(1);
  expect(sem.queued).toBe(2);
  await expect(task(4)).rejects.toMatchObject({ status: 503, code: "busy" } satisfies Partial<HttpError>);
  release();
  expect(await Promise.all(running)).toEqual([1, 2, 3]);
  expect(order).toEqual([1, 2, 3]);
  expect(sem.peakActive).toBe(1);
  expect(sem.inUse).toBe(0);
});
