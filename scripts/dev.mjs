// npm run dev — the development loop: private MariaDB, mail fake, the API server restarted on every
// change (node --watch), and the Expo web dev server with fast refresh talking to that API.
import { DATA, StartupError, capture, fail, httpOk, log, startChild, waitFor, warn } from "./lib/env.mjs";
import { ensureDebPackages, ensureNodeModules } from "./lib/deps.mjs";
import { createDatabase, dbSettings, ensureAppUser, ensureMariadb } from "./lib/mariadb.mjs";

const API_PORT = Number(process.env.PORT || 8080);
const WEB_PORT = Number(process.env.WEB_PORT || 8081);
const cleanups = [];
let stopping = false;

async function stop(code) {
  if (stopping) return;
  stopping = true;
  for (const fn of cleanups.reverse()) {
    try { await fn(); } catch (err) { warn(String(err)); }
  }
  process.exit(code);
}
const killer = (child) => () => new Promise((resolve) => {
  if (child.exitCode !== null || child.signalCode) return resolve();
  child.once("exit", resolve);
  child.kill("SIGTERM");
});

async function main() {
  process.on("SIGINT", () => void stop(130));
  process.on("SIGTERM", () => void stop(143));
  ensureNodeModules();
  ensureDebPackages(["mariadb-server", "mariadb-client"]);
  const db = await ensureMariadb();
  if (db.startedHere) cleanups.push(db.stop);
  ensureAppUser();
  createDatabase(dbSettings().database);
  if (capture("node", ["--import", "tsx", "server/cli.ts", "setup"], { stdio: "inherit" }).status !== 0) fail("database setup failed");

  const mail = startChild("mail", "node", ["--import", "tsx", "fakes/mail/main.ts"]);
  cleanups.push(killer(mail));
  const stripe = startChild("stripe", "node", ["--import", "tsx", "fakes/stripe/main.ts"], { env: { STRIPE_WEBHOOK_URL: `http://127.0.0.1:${API_PORT}/api/webhooks/stripe` } });
  cleanups.push(killer(stripe));
  const webOrigin = `http://127.0.0.1:${WEB_PORT}`;
  const server = startChild("api", "node", ["--watch", "--import", "tsx", "server/index.ts"], {
    env: { PORT: String(API_PORT), CORS_ORIGIN: `${webOrigin},http://localhost:${WEB_PORT}`, PUBLIC_URL: webOrigin, LOG_PRETTY: process.env.LOG_PRETTY || "1", ...(process.stdout.isTTY && !process.env.NO_COLOR ? { FORCE_COLOR: "1" } : {}) },
  });
  cleanups.push(killer(server));
  await waitFor("the API server", () => httpOk(`http://127.0.0.1:${API_PORT}/api/health`), { timeoutMs: 60000 });
  const web = startChild("web", "npx", ["expo", "start", "--web", "--port", String(WEB_PORT)], {
    // Not CI mode: Metro watches files and refreshes the page on every change.
    env: { EXPO_OFFLINE: "1", EXPO_NO_TELEMETRY: "1", EXPO_PUBLIC_API_URL: `http://127.0.0.1:${API_PORT}` },
  });
  cleanups.push(killer(web));
  web.on("exit", () => void stop(1));
  log(`dev: web app with fast refresh on ${webOrigin}/ (first page takes ~30 s), API on http://127.0.0.1:${API_PORT}/api, mail on http://127.0.0.1:8025/`);
  void DATA;
}

main().catch(async (err) => {
  warn(err instanceof StartupError ? err.message : String(err?.stack || err));
  await stop(1);
});
