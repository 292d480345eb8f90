// npm start — everything from one command: installs, private MariaDB, migrations, demo data,
// web build, mail fake and the server. Ctrl-C stops all of it. Node built-ins only.
import fs from "node:fs";
import crypto from "node:crypto";
import path from "node:path";
import { DATA, StartupError, capture, fail, httpOk, log, portFree, processAlive, readPid, startChild, waitFor, warn } from "./lib/env.mjs";
import { ensureDebPackages, ensureNodeModules } from "./lib/deps.mjs";
import { createDatabase, dbSettings, ensureAppUser, ensureMariadb } from "./lib/mariadb.mjs";
import { ensureWebBuild } from "./lib/web-build.mjs";

const PORT = Number(process.env.PORT || 8080);
const MAIL_SMTP_PORT = Number(process.env.MAIL_SMTP_PORT || 1025);
const MAIL_HTTP_PORT = Number(process.env.MAIL_HTTP_PORT || 8025);
const useMailFake = !process.env.SMTP_URL;
const STRIPE_FAKE_PORT = Number(process.env.STRIPE_API_PORT || 12111);
const useStripeFake = !process.env.STRIPE_API_HOST;
// The fake and the server share a signing secret of this run's own (the one in the repository is public).
const STRIPE_WEBHOOK_SECRET = process.env.STRIPE_WEBHOOK_SECRET || (useStripeFake ? `whsec_${crypto.randomBytes(24).toString("hex")}` : "");
const PIDFILE = path.join(DATA, "start.pid");

const cleanups = [];
let shuttingDown = false;

async function shutdown(code) {
  if (shuttingDown) return;
  shuttingDown = true;
  log("stopping…");
  for (const fn of cleanups.reverse()) {
    try { await fn(); } catch (err) { warn(String(err)); }
  }
  if (readPid(PIDFILE) === process.pid) fs.rmSync(PIDFILE, { force: true });
  log("stopped.");
  process.exit(code);
}

function stopChild(child, name) {
  return () => new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode) return resolve();
    const t = setTimeout(() => { child.kill("SIGKILL"); }, 10000);
    child.once("exit", () => { clearTimeout(t); resolve(); });
    child.kill("SIGTERM");
    log(`stopped ${name}`);
  });
}

function watch(child, name) {
  child.on("exit", (code, signal) => {
    if (shuttingDown) return;
    warn(`${name} exited unexpectedly (${code ?? signal}); stopping everything`);
    void shutdown(1);
  });
}

async function main() {
  fs.mkdirSync(DATA, { recursive: true });
  const other = readPid(PIDFILE);
  if (other && other !== process.pid && processAlive(other)) {
    log(`Panwise is already running (pid ${other}) at http://127.0.0.1:${PORT}/ — not starting a second copy.`);
    log(`Stop it with Ctrl-C in its terminal, or: kill ${other}`);
    process.exit(0);
  }
  fs.writeFileSync(PIDFILE, String(process.pid));
  process.on("SIGINT", () => void shutdown(130));
  process.on("SIGTERM", () => void shutdown(143));

  ensureNodeModules();
  ensureDebPackages(["mariadb-server", "mariadb-client"]);

  const busy = [];
  if (!(await portFree(PORT))) busy.push(`${PORT} (web and API; set PORT=…)`);
  if (useMailFake && !(await portFree(MAIL_SMTP_PORT))) busy.push(`${MAIL_SMTP_PORT} (mail fake SMTP; set MAIL_SMTP_PORT=…)`);
  if (useMailFake && !(await portFree(MAIL_HTTP_PORT))) busy.push(`${MAIL_HTTP_PORT} (mail fake inbox; set MAIL_HTTP_PORT=…)`);
  if (useStripeFake && !(await portFree(STRIPE_FAKE_PORT))) busy.push(`${STRIPE_FAKE_PORT} (Stripe fake; set STRIPE_API_PORT=…)`);
  if (busy.length) fail(`port(s) already in use on 127.0.0.1: ${busy.join(", ")}`);

  const db = await ensureMariadb();
  if (db.startedHere) cleanups.push(db.stop);
  ensureAppUser();
  const { database } = dbSettings();
  createDatabase(database);

  if (useStripeFake) {
    // Started before the seed: the demo's card payments go through it. Its webhooks reach the server once it is up (they retry).
    const stripe = startChild("stripe", "node", ["--import", "tsx", "fakes/stripe/main.ts"], {
      env: { STRIPE_WEBHOOK_SECRET, STRIPE_FAKE_PORT: String(STRIPE_FAKE_PORT), STRIPE_WEBHOOK_URL: `http://127.0.0.1:${PORT}/api/webhooks/stripe`, STRIPE_FAKE_STATE: path.join(DATA, "stripe-fake.json") },
    });
    cleanups.push(stopChild(stripe, "Stripe fake"));
    watch(stripe, "the Stripe fake");
    await waitFor("the Stripe fake", () => httpOk(`http://127.0.0.1:${STRIPE_FAKE_PORT}/_fake/webhooks`), { timeoutMs: 30000 });
  }

  log("running migrations and demo seed…");
  const setup = capture("node", ["--import", "tsx", "server/cli.ts", "setup"], { stdio: "inherit", env: { ...process.env, STRIPE_API_PORT: String(STRIPE_FAKE_PORT) } });
  if (setup.status !== 0) fail("database setup failed (see above)");

  await ensureWebBuild();

  const env = {};
  if (useMailFake) {
    const mail = startChild("mail", "node", ["--import", "tsx", "fakes/mail/main.ts"], { env: { MAIL_SMTP_PORT: String(MAIL_SMTP_PORT), MAIL_HTTP_PORT: String(MAIL_HTTP_PORT) } });
    cleanups.push(stopChild(mail, "mail fake"));
    watch(mail, "the mail fake");
    await waitFor("the mail fake", () => httpOk(`http://127.0.0.1:${MAIL_HTTP_PORT}/api/messages`), { timeoutMs: 30000 });
    env.SMTP_URL = `smtp://127.0.0.1:${MAIL_SMTP_PORT}`;
  }

  const server = startChild("server", "node", ["--import", "tsx", "server/index.ts"], { env: { ...env, PORT: String(PORT), STRIPE_API_PORT: String(STRIPE_FAKE_PORT), ...(STRIPE_WEBHOOK_SECRET ? { STRIPE_WEBHOOK_SECRET } : {}) } });
  cleanups.push(stopChild(server, "server"));
  watch(server, "the server");
  await waitFor("the server", () => httpOk(`http://127.0.0.1:${PORT}/api/health`), { timeoutMs: 60000 });

  const line = "─".repeat(64);
  console.log(`\n${line}
  Panwise is running — the Hollowbrook Bakehouse demo

  App:        http://127.0.0.1:${PORT}/
  API health: http://127.0.0.1:${PORT}/api/health
  ${useMailFake ? `Mail inbox: http://127.0.0.1:${MAIL_HTTP_PORT}/   (every e-mail the app sends lands here)` : `Mail:       sent through ${process.env.SMTP_URL}`}
  ${useStripeFake ? `Stripe fake: http://127.0.0.1:${STRIPE_FAKE_PORT}/   (test card 4242 4242 4242 4242; 4000 0000 0000 0002 is declined)` : `Stripe:     ${process.env.STRIPE_API_HOST}`}

  Demo sign-ins (password: panwise-demo)
    owner@hollowbrook.test     owner
    baker@hollowbrook.test     baker
    books@hollowbrook.test     bookkeeper
    buyer@tidewater.test       buyer, Tidewater Café
    buyer@junipertable.test    buyer, Juniper Table
    buyer@northpier.test       buyer, North Pier Coffee

  Ctrl-C stops everything.
${line}\n`);
}

main().catch(async (err) => {
  warn(err instanceof StartupError ? err.message : String(err?.stack || err));
  await shutdown(1);
});
