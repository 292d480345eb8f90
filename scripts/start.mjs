// npm start — everything from one command: installs, private MariaDB, migrations, demo data,
// web build, mail fake and the server. Node built-ins only.
// It supervises what it starts: MariaDB, the server and the fakes are started again (with backoff) when one dies,
// and Ctrl-C, SIGTERM or SIGHUP to it — or to npm, whose shell then goes away — stops all of them. The Node children
// stop by themselves if this process dies (scripts/lib/parent-watch.mjs), and mariadbd has a watchdog.
import fs from "node:fs";
import crypto from "node:crypto";
import path from "node:path";
import { DATA, PARENT_WATCH, StartupError, fail, httpOk, liveChildren, log, portFree, processAlive, readPid, runAsync, startChild, waitFor, warn } from "./lib/env.mjs";
import { ensureDebPackages, ensureNodeModules } from "./lib/deps.mjs";
import { createDatabase, dbSettings, ensureAppUser, ensureMariadb, ping } from "./lib/mariadb.mjs";
import { ensureWebBuild } from "./lib/web-build.mjs";
import { supervise } from "./lib/supervise.mjs";

const PORT = Number(process.env.PORT || 8080);
const MAIL_SMTP_PORT = Number(process.env.MAIL_SMTP_PORT || 1025);
const MAIL_HTTP_PORT = Number(process.env.MAIL_HTTP_PORT || 8025);
const useMailFake = !process.env.SMTP_URL;
const STRIPE_FAKE_PORT = Number(process.env.STRIPE_API_PORT || 12111);
const useStripeFake = !process.env.STRIPE_API_HOST;
// The fake and the server share a signing secret of this run's own (the one in the repository is public).
const STRIPE_WEBHOOK_SECRET = process.env.STRIPE_WEBHOOK_SECRET || (useStripeFake ? `whsec_${crypto.randomBytes(24).toString("hex")}` : "");
const PIDFILE = path.join(DATA, "start.pid");
/** PANWISE_SKIP_WEB_BUILD=1: do not build the web app (the API still runs; the page says it was not built). */
const skipWebBuild = process.env.PANWISE_SKIP_WEB_BUILD === "1";

const cleanups = [];
let shuttingDown = false;
const stopping = () => shuttingDown;

async function shutdown(code) {
  if (shuttingDown) return;
  shuttingDown = true;
  log("stopping…");
  for (const fn of cleanups.reverse()) {
    try { await fn(); } catch (err) { warn(String(err)); }
  }
  // Anything still running (a setup or web build in progress): end it too.
  for (const child of [...liveChildren]) {
    if (child.exitCode === null && !child.signalCode) child.kill("SIGTERM");
  }
  if (readPid(PIDFILE) === process.pid) fs.rmSync(PIDFILE, { force: true });
  log("stopped.");
  process.exit(code);
}

/** Stop a child: SIGTERM, then SIGKILL after 10 s. */
function stopChild(child, name) {
  return () => new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode) return resolve();
    const t = setTimeout(() => { child.kill("SIGKILL"); }, 10000);
    child.once("exit", () => { clearTimeout(t); resolve(); });
    child.kill("SIGTERM");
    log(`stopped ${name}`);
  });
}

/** The server's output passes through a pipe here: ask for colour when this process writes to a terminal (colorette reads FORCE_COLOR). */
function logColour() {
  return process.stdout.isTTY && !process.env.NO_COLOR && !process.env.FORCE_COLOR ? { FORCE_COLOR: "1" } : {};
}

/** Start a Node child that stops when this process dies (IPC + parent-watch preload); returns a supervisable handle. */
function nodeChild(name, label, script, env) {
  if (shuttingDown) fail("stopping");
  const child = startChild(name, process.execPath, ["--import", PARENT_WATCH, "--import", "tsx", script], { env, ipc: true });
  const exit = new Promise((resolve) => {
    child.once("exit", (code, signal) => resolve({ code, signal }));
    child.once("error", (err) => resolve({ code: -1, signal: null, error: err }));
  });
  return { child, exit, stop: stopChild(child, label) };
}

/** Supervise a Node child; `ready` says it answers (waited for at start and after each restart). */
async function superviseNode({ name, label, script, env, ready, readyWhat }) {
  const sup = await supervise({
    label,
    isStopping: stopping,
    onDeliberateExit: () => void shutdown(1),
    start: async () => nodeChild(name, label, script, env),
    onRestarted: async () => {
      await waitFor(readyWhat, ready, { timeoutMs: 60000 });
      log(`${label.charAt(0).toUpperCase()}${label.slice(1)} is back`);
    },
  });
  cleanups.push(() => sup.stop());
  await waitFor(readyWhat, ready, { timeoutMs: 60000 });
  return sup;
}

/**
 * MariaDB under supervision. When this process started it, its exit is watched and it is started again; when
 * another Panwise command runs it (npm test, npm run db), it is pinged, and started here if it is gone.
 */
async function superviseMariadb() {
  const handleOf = async () => {
    const db = await ensureMariadb();
    if (db.startedHere) return { exit: db.exit, stop: db.stop };
    // Not ours: watch it from outside. "Exits" when it stops answering and its process is gone.
    let timer = null;
    const exit = new Promise((resolve) => {
      timer = setInterval(() => {
        if (shuttingDown) return clearInterval(timer);
        const pid = readPid(path.join(DATA, "mariadb", "run", "mariadbd.pid"));
        if (!ping() && !(pid && processAlive(pid))) {
          clearInterval(timer);
          resolve({ code: null, signal: null, reason: "it no longer answers and its process is gone" });
        }
      }, 2000);
    });
    return { exit, stop: async () => clearInterval(timer) };
  };
  const sup = await supervise({
    label: "MariaDB",
    isStopping: stopping,
    onDeliberateExit: () => void shutdown(1),
    start: handleOf,
  });
  cleanups.push(() => sup.stop());
  return sup;
}

/**
 * npm runs this through `sh -c`, and SIGTERM to npm ends npm and that shell, not this process (seen here with npm 11
 * and Debian's dash): when started by npm (npm sets npm_lifecycle_event), notice the parent going away and stop.
 */
function watchParent() {
  if (!process.env.npm_lifecycle_event) return;
  const parent = process.ppid;
  const t = setInterval(() => {
    if (process.ppid !== parent) {
      clearInterval(t);
      log(`the process that started this one (pid ${parent}) has gone`);
      void shutdown(143);
    }
  }, 1000);
  t.unref();
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
  process.on("SIGHUP", () => void shutdown(129));
  watchParent();

  ensureNodeModules();
  ensureDebPackages(["mariadb-server", "mariadb-client"]);

  const busy = [];
  if (!(await portFree(PORT))) busy.push(`${PORT} (web and API; set PORT=…)`);
  if (useMailFake && !(await portFree(MAIL_SMTP_PORT))) busy.push(`${MAIL_SMTP_PORT} (mail fake SMTP; set MAIL_SMTP_PORT=…)`);
  if (useMailFake && !(await portFree(MAIL_HTTP_PORT))) busy.push(`${MAIL_HTTP_PORT} (mail fake inbox; set MAIL_HTTP_PORT=…)`);
  if (useStripeFake && !(await portFree(STRIPE_FAKE_PORT))) busy.push(`${STRIPE_FAKE_PORT} (Stripe fake; set STRIPE_API_PORT=…)`);
  if (busy.length) fail(`port(s) already in use on 127.0.0.1: ${busy.join(", ")}`);

  await superviseMariadb();
  ensureAppUser();
  const { database } = dbSettings();
  createDatabase(database);

  if (useStripeFake) {
    // Started before the seed: the demo's card payments go through it. Its webhooks reach the server once it is up (they retry).
    await superviseNode({
      name: "stripe",
      label: "the Stripe fake",
      script: "fakes/stripe/main.ts",
      env: { STRIPE_WEBHOOK_SECRET, STRIPE_FAKE_PORT: String(STRIPE_FAKE_PORT), STRIPE_WEBHOOK_URL: `http://127.0.0.1:${PORT}/api/webhooks/stripe`, STRIPE_FAKE_STATE: path.join(DATA, "stripe-fake.json") },
      ready: () => httpOk(`http://127.0.0.1:${STRIPE_FAKE_PORT}/_fake/webhooks`),
      readyWhat: "the Stripe fake",
    });
  }

  log("running migrations and demo seed…");
  if (shuttingDown) return;
  const setup = await runAsync(process.execPath, ["--import", PARENT_WATCH, "--import", "tsx", "server/cli.ts", "setup"], {
    stdio: ["inherit", "inherit", "inherit", "ipc"],
    env: { ...process.env, STRIPE_API_PORT: String(STRIPE_FAKE_PORT) },
  });
  if (shuttingDown) return;
  if (setup.status !== 0) fail("database setup failed (see above)");

  if (skipWebBuild) log("PANWISE_SKIP_WEB_BUILD=1: not building the web app (the API runs; the page says if it was never built)");
  else await ensureWebBuild();
  if (shuttingDown) return;

  const env = {};
  if (useMailFake) {
    await superviseNode({
      name: "mail",
      label: "the mail fake",
      script: "fakes/mail/main.ts",
      env: { MAIL_SMTP_PORT: String(MAIL_SMTP_PORT), MAIL_HTTP_PORT: String(MAIL_HTTP_PORT) },
      ready: () => httpOk(`http://127.0.0.1:${MAIL_HTTP_PORT}/api/messages`),
      readyWhat: "the mail fake",
    });
    env.SMTP_URL = `smtp://127.0.0.1:${MAIL_SMTP_PORT}`;
  }

  await superviseNode({
    name: "server",
    label: "the server",
    script: "server/index.ts",
    // Log lines for a person (pino-pretty in the server, server/logger.ts), coloured on a terminal; JSON in production.
    env: { ...env, PORT: String(PORT), STRIPE_API_PORT: String(STRIPE_FAKE_PORT), ...(STRIPE_WEBHOOK_SECRET ? { STRIPE_WEBHOOK_SECRET } : {}), LOG_PRETTY: process.env.LOG_PRETTY || "1", ...logColour() },
    ready: () => httpOk(`http://127.0.0.1:${PORT}/api/health`),
    readyWhat: "the server",
  });

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

  MariaDB, the server and the fakes are restarted if they die. Ctrl-C stops everything.
${line}\n`);
}

main().catch(async (err) => {
  if (shuttingDown) return;
  warn(err instanceof StartupError ? err.message : String(err?.stack || err));
  await shutdown(1);
});
