// A private MariaDB instance under .data/mariadb, on 127.0.0.1 with its own socket.
// It never touches a system MariaDB: --no-defaults keeps /etc/mysql out of it.
import fs from "node:fs";
import path from "node:path";
import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { DATA, capture, fail, log, portFree, processAlive, readPid, run, waitFor } from "./env.mjs";

const BASE = path.join(DATA, "mariadb");
const DATADIR = path.join(BASE, "data");
const RUNDIR = path.join(BASE, "run");
export const SOCKET = path.join(RUNDIR, "mysqld.sock");
const PIDFILE = path.join(RUNDIR, "mariadbd.pid");
const LOCKFILE = path.join(RUNDIR, "start.lock");
const ERRLOG = path.join(BASE, "error.log");
export const MARIADB_PIDFILE = PIDFILE;
const WATCHDOG = path.join(path.dirname(fileURLToPath(import.meta.url)), "watchdog.mjs");

export const dbSettings = () => ({
  port: Number(process.env.DB_PORT || 3307),
  user: process.env.DB_USER || "panwise",
  password: process.env.DB_PASSWORD ?? "panwise-local",
  database: process.env.DB_NAME || "panwise",
});

const client = (args, input) =>
  capture("mariadb", ["--no-defaults", `--socket=${SOCKET}`, "-uroot", "--batch", "--skip-column-names", ...args], input ? { input } : {});

export function ping() {
  return capture("mariadb-admin", ["--no-defaults", `--socket=${SOCKET}`, "-uroot", "ping"]).status === 0;
}

function initialise() {
  if (fs.existsSync(path.join(DATADIR, "mysql"))) return;
  log(`initialising a private MariaDB data directory in ${path.relative(process.cwd(), BASE) || BASE}…`);
  fs.rmSync(DATADIR, { recursive: true, force: true });
  fs.mkdirSync(DATADIR, { recursive: true });
  const args = ["--no-defaults", `--datadir=${DATADIR}`, "--auth-root-authentication-method=socket", "--skip-test-db",
    "--character-set-server=utf8mb4", "--collation-server=utf8mb4_unicode_ci"];
  if (process.getuid?.() === 0) args.push("--user=root");
  const res = capture("mariadb-install-db", args);
  if (res.status !== 0) fail(`mariadb-install-db failed:\n${res.stdout}\n${res.stderr}`);
}

function takeLock() {
  fs.mkdirSync(RUNDIR, { recursive: true });
  for (let i = 0; i < 2; i++) {
    try {
      const fd = fs.openSync(LOCKFILE, "wx");
      fs.writeSync(fd, String(process.pid));
      fs.closeSync(fd);
      return true;
    } catch {
      const holder = readPid(LOCKFILE);
      if (holder && processAlive(holder) && holder !== process.pid) return false;
      fs.rmSync(LOCKFILE, { force: true }); // stale lock from a process that died
    }
  }
  return false;
}
const releaseLock = () => {
  if (readPid(LOCKFILE) === process.pid) fs.rmSync(LOCKFILE, { force: true });
};

/** A watchdog that stops mariadbd when this process dies, however it dies (see watchdog.mjs). */
function startWatchdog(pid) {
  try {
    const dog = spawn(process.execPath, [WATCHDOG, String(pid)], { stdio: ["ignore", "ignore", "ignore", "ipc"] });
    dog.on("error", () => {});
    dog.unref();
    dog.channel?.unref();
    return dog;
  } catch {
    return null;
  }
}

/**
 * Make sure the private MariaDB is running. Returns { startedHere, stop, pid, exit }: when started here, `exit`
 * resolves with { code, signal } once that mariadbd exits (for a supervisor), and a watchdog stops it if this
 * process dies without stopping it. If another Panwise process already runs it, it is reused and left alone.
 */
export async function ensureMariadb() {
  const { port } = dbSettings();
  const foreign = () => ({ startedHere: false, stop: async () => {}, pid: readPid(PIDFILE), exit: null });
  if (!takeLock()) {
    // Someone else is starting it right now; wait for them to finish.
    await waitFor("MariaDB started by another Panwise process", () => ping(), { timeoutMs: 60000 });
    return foreign();
  }
  try {
    const pid = readPid(PIDFILE);
    if (pid && processAlive(pid) && ping()) return foreign();
    if (pid && processAlive(pid)) {
      // A mariadbd from an earlier run still shutting down or hung: wait for it to go away.
      await waitFor("an earlier MariaDB to stop", () => !processAlive(pid), { timeoutMs: 40000 }).catch(() =>
        fail(`a MariaDB process (pid ${pid}) for .data/mariadb is running but not answering; stop it with: kill ${pid}`));
    }
    if (!(await portFree(port))) {
      fail(`port ${port} on 127.0.0.1 is busy (another MariaDB?). Stop it or choose another port: DB_PORT=3308 npm start`);
    }
    initialise();
    fs.rmSync(SOCKET, { force: true });
    const args = ["--no-defaults", `--datadir=${DATADIR}`, `--port=${port}`, "--bind-address=127.0.0.1", `--socket=${SOCKET}`,
      `--pid-file=${PIDFILE}`, `--log-error=${ERRLOG}`, "--skip-name-resolve", "--skip-log-bin",
      "--character-set-server=utf8mb4", "--collation-server=utf8mb4_unicode_ci", "--max-connections=500",
      "--innodb-buffer-pool-size=256M", "--innodb-flush-log-at-trx-commit=2"];
    if (process.getuid?.() === 0) args.push("--user=root");
    const child = spawn("/usr/sbin/mariadbd", args, { stdio: "ignore", detached: false });
    let exited = false;
    const exit = new Promise((resolve) => child.on("exit", (code, signal) => { exited = true; resolve({ code, signal }); }));
    child.on("error", () => { exited = true; });
    const dog = startWatchdog(child.pid);
    const stopDog = () => { try { dog?.kill("SIGTERM"); } catch { /* gone */ } };
    void exit.then(stopDog);
    try {
      await waitFor("MariaDB to accept connections", () => {
        if (exited) fail(`mariadbd exited during start-up; see ${ERRLOG}`);
        return ping();
      }, { timeoutMs: 60000 });
    } catch (err) {
      if (!exited) child.kill("SIGKILL");
      stopDog();
      throw err;
    }
    log(`MariaDB is up on 127.0.0.1:${port} (pid ${child.pid})`);
    const stop = async () => {
      if (exited) return stopDog();
      child.kill("SIGTERM");
      await waitFor("MariaDB to stop", () => exited || !processAlive(child.pid), { timeoutMs: 60000 }).catch(() => child.kill("SIGKILL"));
      stopDog();
    };
    return { startedHere: true, stop, pid: child.pid, exit };
  } finally {
    releaseLock();
  }
}

const esc = (s) => s.replace(/\\/g, "\\\\").replace(/'/g, "\\'");

/** Create the application's own user (for 127.0.0.1 and localhost) with rights on panwise* databases. */
export function ensureAppUser() {
  const { user, password } = dbSettings();
  const sql = ["127.0.0.1", "localhost"].map((host) =>
    `CREATE USER IF NOT EXISTS '${esc(user)}'@'${host}' IDENTIFIED BY '${esc(password)}';
     ALTER USER '${esc(user)}'@'${host}' IDENTIFIED BY '${esc(password)}';
     GRANT ALL PRIVILEGES ON \`panwise%\`.* TO '${esc(user)}'@'${host}';`).join("\n");
  const res = client([], sql + "\nFLUSH PRIVILEGES;");
  if (res.status !== 0) fail(`could not create the MariaDB user: ${res.stderr}`);
}

export function createDatabase(name) {
  if (!/^[A-Za-z0-9_]+$/.test(name)) fail(`bad database name ${name}`);
  const res = client([], `CREATE DATABASE IF NOT EXISTS \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`);
  if (res.status !== 0) fail(`could not create database ${name}: ${res.stderr}`);
}

/** Drop databases whose names start with the prefix (throw-away test databases). */
export function dropDatabases(prefix) {
  const list = client(["-e", "SHOW DATABASES"]);
  if (list.status !== 0) return;
  const names = list.stdout.split("\n").map((s) => s.trim()).filter((n) => n.startsWith(prefix));
  if (names.length === 0) return;
  client([], names.map((n) => `DROP DATABASE IF EXISTS \`${n}\`;`).join("\n"));
}

export { run };
