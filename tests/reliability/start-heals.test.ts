import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { ROOT, alive, descendants, freePort, sleep, until } from "./helpers/private-mariadb";

/**
 * `npm start` heals itself: it is run here for real — its own data directory (PANWISE_DATA_DIR) and free ports,
 * never the shared MariaDB on 3307 — with PANWISE_SKIP_WEB_BUILD=1 (no web export in a test). Each test kills
 * something and checks that it comes back, then stops the whole stack and checks that no process it started is
 * left. Every wait is bounded.
 */

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pw-start-"));
let ports: Record<string, number>;
let running: ChildProcess | null = null;

beforeAll(async () => {
  ports = { PORT: await freePort(), DB_PORT: await freePort(), MAIL_SMTP_PORT: await freePort(), MAIL_HTTP_PORT: await freePort(), STRIPE_API_PORT: await freePort() };
});

afterAll(async () => {
  // Belt and braces: whatever a failed test left behind.
  if (running?.pid && alive(running.pid)) {
    const left = descendants(running.pid);
    running.kill("SIGKILL");
    for (const p of left) try { process.kill(p, "SIGKILL"); } catch { /* gone */ }
  }
  await sleep(500);
  fs.rmSync(dir, { recursive: true, force: true });
}, 30_000);

function env(): NodeJS.ProcessEnv {
  const e: NodeJS.ProcessEnv = { ...process.env, PANWISE_DATA_DIR: dir, PANWISE_SKIP_WEB_BUILD: "1", LOG_LEVEL: "warn", WEB_DIST: path.join(dir, "no-web-build") };
  for (const [k, v] of Object.entries(ports)) e[k] = String(v);
  // What `npm start` sees on a developer's machine: no test settings, the fakes started by it.
  for (const k of ["NODE_ENV", "SMTP_URL", "STRIPE_API_HOST", "STRIPE_WEBHOOK_SECRET", "DB_NAME", "TEST_DB_PREFIX", "PUBLIC_URL", "npm_lifecycle_event"]) delete e[k];
  return e;
}

const base = () => `http://127.0.0.1:${ports.PORT}`;
async function healthy(): Promise<boolean> {
  try {
    const res = await fetch(`${base()}/api/health`, { signal: AbortSignal.timeout(2000) });
    return res.status === 200;
  } catch {
    return false;
  }
}

function mariadbdPid(): number {
  return Number(fs.readFileSync(path.join(dir, "mariadb", "run", "mariadbd.pid"), "utf8").trim());
}

/** Start a command of the stack, collect its terminal output, wait (at most 4 min: first run initialises and seeds) for health. */
async function startStack(cmd: string, args: string[]): Promise<{ child: ChildProcess; output: () => string }> {
  const child = spawn(cmd, args, { cwd: ROOT, env: env(), stdio: ["ignore", "pipe", "pipe"] });
  running = child;
  let out = "";
  child.stdout!.on("data", (c) => (out += c));
  child.stderr!.on("data", (c) => (out += c));
  const up = await until(async () => child.exitCode !== null || (await healthy()), 240_000, 500);
  if (!up || child.exitCode !== null) throw new Error(`the stack did not come up:\n${out.slice(-3000)}`);
  return { child, output: () => out };
}

function serverPidIn(pids: Iterable<number>): number | undefined {
  return [...pids].find((p) => {
    try { return fs.readFileSync(`/proc/${p}/cmdline`, "utf8").includes("server/index.ts"); } catch { return false; }
  });
}

/** The stack's processes now (the command itself and everything under it). */
function stackPids(root: number): Set<number> {
  return new Set([root, ...descendants(root)]);
}

async function allGone(pids: Iterable<number>, timeoutMs: number): Promise<number[]> {
  const list = [...pids];
  await until(() => list.every((p) => !alive(p)), timeoutMs, 200);
  return list.filter((p) => alive(p));
}

describe("the start command", () => {
  it("restarts a SIGKILLed MariaDB within 10 s, and SIGTERM stops every process it started", async () => {
    const { child, output } = await startStack(process.execPath, ["scripts/start.mjs"]);
    const seen = stackPids(child.pid!);
    const killed = mariadbdPid();
    expect(seen.has(killed)).toBe(true);
    const serverPid = serverPidIn(seen);
    expect(serverPid).toBeDefined();

    // Already running: a second copy says so and leaves.
    const second = spawnSync(process.execPath, ["scripts/start.mjs"], { cwd: ROOT, env: env(), encoding: "utf8", timeout: 30_000 });
    expect(second.status).toBe(0);
    expect(second.stdout).toContain(`Panwise is already running (pid ${child.pid})`);

    process.kill(killed, "SIGKILL");
    const killedAt = Date.now();
    await until(async () => !(await healthy()), 5000, 50); // the outage is real
    const back = await until(() => healthy(), 10_000, 200);
    expect(back).toBe(true);
    expect(Date.now() - killedAt).toBeLessThan(10_000);
    expect(output()).toContain("MariaDB stopped unexpectedly (signal SIGKILL); restarting in 1 s (attempt 2)");
    const restarted = mariadbdPid();
    expect(restarted).not.toBe(killed);
    // The same server process serves again: its connection pool recovered by itself.
    expect(alive(serverPid!)).toBe(true);
    stackPids(child.pid!).forEach((p) => seen.add(p));

    child.kill("SIGTERM");
    const exited = await until(() => child.exitCode !== null || child.signalCode !== null, 60_000, 200);
    expect(exited).toBe(true);
    expect(await allGone(seen, 20_000)).toEqual([]);
    expect(output()).toContain("stopped.");
  }, 360_000);

  it("under npm: restarts a SIGKILLed server, and SIGTERM to npm's own process stops every process", async () => {
    const { child, output } = await startStack("npm", ["start"]);
    const seen = stackPids(child.pid!);
    const serverPid = serverPidIn(seen);
    expect(serverPid).toBeDefined();
    process.kill(serverPid!, "SIGKILL");
    await until(async () => !(await healthy()), 5000, 50);
    expect(await until(() => healthy(), 30_000, 200)).toBe(true);
    expect(output()).toContain("The server stopped unexpectedly (signal SIGKILL); restarting in 1 s (attempt 2)");
    stackPids(child.pid!).forEach((p) => seen.add(p));

    // npm forwards SIGTERM to its `sh -c`, which dies without passing it on: start.mjs must notice by itself.
    child.kill("SIGTERM");
    expect(await allGone(seen, 30_000)).toEqual([]);
    expect(output()).toContain("stopped.");
  }, 360_000);

  it("when start.mjs itself is SIGKILLed, the server, the fakes and MariaDB stop by themselves", async () => {
    const { child } = await startStack(process.execPath, ["scripts/start.mjs"]);
    const seen = stackPids(child.pid!);
    expect(seen.size).toBeGreaterThanOrEqual(5); // start.mjs, mariadbd, its watchdog, two fakes, the server
    child.kill("SIGKILL");
    expect(await allGone(seen, 30_000)).toEqual([]);
    expect(await healthy()).toBe(false);
  }, 360_000);
});
