// npm test — installs what it needs, uses (or starts) the private MariaDB, then runs:
// the type check, Jest (app + server), and the browser journeys in Chromium against the real server.
// Every run uses throw-away databases (prefix below) and drops them at the end.
import { DATA, StartupError, capture, freePort, httpOk, log, startChild, waitFor, warn } from "./lib/env.mjs";
import { ensureDebPackages, ensureNodeModules } from "./lib/deps.mjs";
import { createDatabase, dropDatabases, ensureAppUser, ensureMariadb } from "./lib/mariadb.mjs";
import { ensureWebBuild, webDist } from "./lib/web-build.mjs";
import { generateTypedRoutes } from "./lib/typed-routes.mjs";
import fs from "node:fs";
import crypto from "node:crypto";
import path from "node:path";

const args = process.argv.slice(2);
const stages = args.filter((a) => !a.includes("/"));
// Paths after the stage names pick single test files (e.g. `node scripts/test.mjs browser tests/browser/billing.test.ts`).
const files = args.filter((a) => a.includes("/"));
const only = (name) => stages.length === 0 || stages.includes(name);
const results = [];
const cleanups = [];

function stage(name, cmd, cmdArgs, env = {}) {
  log(`▶ ${name}`);
  const started = Date.now();
  const res = capture(cmd, cmdArgs, { stdio: "inherit", env: { ...process.env, ...env } });
  const ok = res.status === 0;
  results.push({ name, ok, seconds: Math.round((Date.now() - started) / 100) / 10 });
  (ok ? log : warn)(`${ok ? "✔" : "✘"} ${name} (${results.at(-1).seconds} s)`);
  return ok;
}

async function cleanup() {
  for (const fn of cleanups.reverse()) {
    try { await fn(); } catch (err) { warn(String(err)); }
  }
}

function stopChild(child) {
  return () => new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode) return resolve();
    const t = setTimeout(() => child.kill("SIGKILL"), 10000);
    child.once("exit", () => { clearTimeout(t); resolve(); });
    child.kill("SIGTERM");
  });
}

async function main() {
  ensureNodeModules();
  ensureDebPackages(["mariadb-server", "mariadb-client", "chromium"]);
  const db = await ensureMariadb();
  if (db.startedHere) cleanups.push(db.stop);
  ensureAppUser();

  const prefix = `panwise_test_${Date.now().toString(36)}_${process.pid}`;
  cleanups.push(async () => dropDatabases(prefix));
  const testEnv = { NODE_ENV: "test", TEST_DB_PREFIX: prefix, BCRYPT_ROUNDS: "4", PANWISE_DATA_DIR: path.join(DATA, "test-runs", prefix) };
  fs.mkdirSync(testEnv.PANWISE_DATA_DIR, { recursive: true });
  cleanups.push(async () => fs.rmSync(testEnv.PANWISE_DATA_DIR, { recursive: true, force: true }));

  if (only("types")) {
    // Expo Router's route types first (a fresh clone has none), so tsc checks every link against app/.
    try {
      generateTypedRoutes();
    } catch (err) {
      warn(String(err.message || err));
      results.push({ name: "typed routes (expo customize tsconfig.json)", ok: false, seconds: 0 });
    }
    stage("type check (tsc --noEmit)", "npx", ["tsc", "--noEmit", "-p", "tsconfig.json"]);
  }
  if (only("jest")) stage("jest: app screens + server API + shared", "npx", ["jest", "--selectProjects", "app", "server", "--ci"], testEnv);
  // The API fuzz: every route, every role, thousands of malformed requests against a server process (tests/fuzz).
  if (only("fuzz")) stage("fuzz: malformed input on every API route (fast-check)", "npx", ["jest", "--selectProjects", "fuzz", "--runInBand", "--ci", "--forceExit"], testEnv);
  // Faults on purpose (tests/reliability): MariaDB SIGKILLed mid order burst, the start command restarting what dies.
  // Each test runs its own mariadbd in a temp dir on free ports; the shared one is never touched.
  if (only("reliability")) stage("reliability: MariaDB killed mid-burst, npm start heals and stops cleanly", "npx", ["jest", "--selectProjects", "reliability", "--runInBand", "--ci"], testEnv);

  if (only("browser")) {
    await ensureWebBuild();
    const dbName = `${prefix}_browser`;
    createDatabase(dbName);
    const [port, smtpPort, mailHttpPort, stripePort] = [await freePort(), await freePort(), await freePort(), await freePort()];
    const env = { ...testEnv, DB_NAME: dbName, NODE_ENV: "production", LOG_LEVEL: "warn", PORT: String(port), SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      MAIL_SMTP_PORT: String(smtpPort), MAIL_HTTP_PORT: String(mailHttpPort), PUBLIC_URL: `http://127.0.0.1:${port}`, WEB_DIST: webDist(),
      STRIPE_API_PORT: String(stripePort), STRIPE_FAKE_PORT: String(stripePort), STRIPE_WEBHOOK_URL: `http://127.0.0.1:${port}/api/webhooks/stripe`, STRIPE_FAKE_STATE: path.join(testEnv.PANWISE_DATA_DIR, "stripe-fake.json"),
      // Production mode refuses the published local secret and key: this run's own, given to the fake and the server alike.
      STRIPE_WEBHOOK_SECRET: `whsec_${crypto.randomBytes(24).toString("hex")}`, STRIPE_SECRET_KEY: `sk_test_${crypto.randomBytes(12).toString("hex")}`,
      // …and a generated JWT secret (production wants JWT_SECRET set, server/config.ts).
      JWT_SECRET: crypto.randomBytes(48).toString("hex") };
    const stripe = startChild("stripe", "node", ["--import", "tsx", "fakes/stripe/main.ts"], { env, quiet: true });
    cleanups.push(stopChild(stripe));
    await waitFor("the test Stripe fake", () => httpOk(`http://127.0.0.1:${stripePort}/_fake/webhooks`), { timeoutMs: 30000 });
    const setup = capture("node", ["--import", "tsx", "server/cli.ts", "setup"], { stdio: "inherit", env: { ...process.env, ...env } });
    if (setup.status !== 0) {
      results.push({ name: "browser: database setup", ok: false, seconds: 0 });
    } else {
      const mail = startChild("mail", "node", ["--import", "tsx", "fakes/mail/main.ts"], { env, quiet: true });
      cleanups.push(stopChild(mail));
      const server = startChild("server", "node", ["--import", "tsx", "server/index.ts"], { env });
      cleanups.push(stopChild(server));
      await waitFor("the test server", () => httpOk(`http://127.0.0.1:${port}/api/health`), { timeoutMs: 60000 });
      await waitFor("the test mail fake", () => httpOk(`http://127.0.0.1:${mailHttpPort}/api/messages`), { timeoutMs: 30000 });
      stage("browser journeys (Chromium, phone and desktop)", "npx", ["jest", "--selectProjects", "browser", "--runInBand", "--ci", ...files], {
        ...testEnv,
        BASE_URL: `http://127.0.0.1:${port}`,
        MAIL_URL: `http://127.0.0.1:${mailHttpPort}`,
        STRIPE_URL: `http://127.0.0.1:${stripePort}`,
      });
    }
  }
}

let code = 0;
try {
  await main();
} catch (err) {
  warn(err instanceof StartupError ? err.message : String(err?.stack || err));
  code = 1;
} finally {
  await cleanup();
}
const failed = results.filter((r) => !r.ok);
console.log("\n" + results.map((r) => `  ${r.ok ? "✔" : "✘"} ${r.name}  ${r.seconds} s`).join("\n"));
console.log(`test stages: ${results.length - failed.length} passed, ${failed.length} failed`);
if (failed.length || code || results.length === 0) process.exit(1);
