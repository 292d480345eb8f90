// Shared helpers for the start-up scripts. Node built-ins only: these run before node_modules exist.
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");
/** Local state (MariaDB, secrets, uploads, the Stripe fake's state): PANWISE_DATA_DIR, as the server reads it, or .data/. */
export const DATA = process.env.PANWISE_DATA_DIR ? path.resolve(process.env.PANWISE_DATA_DIR) : path.join(ROOT, ".data");

const useColour = process.stdout.isTTY;
const paint = (code, s) => (useColour ? `\x1b[${code}m${s}\x1b[0m` : s);
export const log = (msg) => console.log(`${paint("33", "panwise")} ${msg}`);
export const warn = (msg) => console.error(`${paint("31", "panwise")} ${msg}`);

export class StartupError extends Error {}

export function fail(message) {
  throw new StartupError(message);
}

/** Run a command to completion, streaming its output; throw with a clear message when it fails. */
export function run(cmd, args, opts = {}) {
  const res = spawnSync(cmd, args, { stdio: "inherit", cwd: ROOT, ...opts });
  if (res.error) fail(`could not run ${cmd}: ${res.error.message}`);
  if (res.status !== 0) fail(`${cmd} ${args.join(" ")} exited with ${res.status ?? res.signal}`);
  return res;
}

/** Run and capture; returns { status, stdout, stderr } without throwing. */
export function capture(cmd, args, opts = {}) {
  const res = spawnSync(cmd, args, { cwd: ROOT, encoding: "utf8", ...opts });
  return { status: res.error ? -1 : res.status, stdout: res.stdout || "", stderr: res.stderr || (res.error ? res.error.message : "") };
}

/** Children that are running right now (startChild, runAsync), so a stop on a signal can end them all. */
export const liveChildren = new Set();
function track(child) {
  liveChildren.add(child);
  child.once("exit", () => liveChildren.delete(child));
  child.once("error", () => liveChildren.delete(child));
  return child;
}

/** Preload for Node children: they stop (SIGTERM to themselves) when their parent's IPC channel closes. */
export const PARENT_WATCH = path.join(ROOT, "scripts", "lib", "parent-watch.mjs");

/**
 * Start a long-running child; returns it. Output is prefixed so interleaved logs stay readable.
 * `ipc: true` opens an IPC channel: a Node child preloaded with PARENT_WATCH sees it close when this process
 * dies, however it dies, and stops itself.
 */
export function startChild(name, cmd, args, { env = {}, quiet = false, ipc = false } = {}) {
  const stdio = ipc ? ["ignore", "pipe", "pipe", "ipc"] : ["ignore", "pipe", "pipe"];
  const child = track(spawn(cmd, args, { cwd: ROOT, env: { ...process.env, ...env }, stdio }));
  const forward = (stream, out) => {
    let buf = "";
    stream.on("data", (chunk) => {
      buf += chunk;
      let i;
      while ((i = buf.indexOf("\n")) >= 0) {
        const line = buf.slice(0, i);
        buf = buf.slice(i + 1);
        if (!quiet) out.write(`[${name}] ${line}\n`);
      }
    });
  };
  forward(child.stdout, process.stdout);
  forward(child.stderr, process.stderr);
  return child;
}

/** Run a command to completion without blocking this process (signals are still handled meanwhile); resolves with its exit status. */
export function runAsync(cmd, args, opts = {}) {
  return new Promise((resolve) => {
    const child = track(spawn(cmd, args, { stdio: "inherit", cwd: ROOT, ...opts }));
    child.once("error", (err) => resolve({ status: -1, signal: null, error: err }));
    child.once("exit", (status, signal) => resolve({ status, signal }));
  });
}

/** Is a TCP port on 127.0.0.1 free to listen on? */
export function portFree(port, host = "127.0.0.1") {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once("error", () => resolve(false));
    srv.listen(port, host, () => srv.close(() => resolve(true)));
  });
}

/** Ask the OS for a free port on loopback. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}

export async function waitFor(what, check, { timeoutMs = 60000, intervalMs = 200 } = {}) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    if (await check()) return;
    if (Date.now() > until) fail(`timed out after ${Math.round(timeoutMs / 1000)} s waiting for ${what}`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}

export async function httpOk(url) {
  try {
    const res = await fetch(url);
    return res.ok;
  } catch {
    return false;
  }
}

/** True when a process with this pid exists and is not a zombie. */
export function processAlive(pid) {
  if (!pid) return false;
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    const state = stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3);
    return state !== "Z" && state !== "X";
  } catch {
    try {
      process.kill(pid, 0);
      return true;
    } catch {
      return false;
    }
  }
}

export function readPid(file) {
  try {
    const pid = Number(fs.readFileSync(file, "utf8").trim());
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

export const isRoot = () => typeof process.getuid === "function" && process.getuid() === 0;
