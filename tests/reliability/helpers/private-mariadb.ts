import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

/** The repository root (tests/reliability/helpers is three levels down). */
export const ROOT = path.resolve(__dirname, "..", "..", "..");

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Alive and not a zombie (toolchain notes: a stopped mariadbd stays a zombie for ~2 s; read /proc, not only kill -0). */
export function alive(pid: number): boolean {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    const state = stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3);
    return state !== "Z" && state !== "X";
  } catch {
    return false;
  }
}

/** Poll until `check` is true, at most `timeoutMs`; returns whether it became true. */
export async function until(check: () => boolean | Promise<boolean>, timeoutMs: number, everyMs = 100): Promise<boolean> {
  const end = Date.now() + timeoutMs;
  for (let i = 0; i < 100000 && Date.now() < end; i++) {
    if (await check()) return true;
    await sleep(everyMs);
  }
  return check();
}

/** Every descendant of a pid (children, their children, …), read from /proc. */
export function descendants(pid: number): number[] {
  const parentOf = new Map<number, number>();
  for (const name of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${name}/stat`, "utf8");
      const ppid = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      parentOf.set(Number(name), ppid);
    } catch {
      // Gone meanwhile.
    }
  }
  const out: number[] = [];
  const queue = [pid];
  for (let guard = 0; queue.length && guard < 10000; guard++) {
    const p = queue.shift()!;
    for (const [child, parent] of parentOf) if (parent === p && !out.includes(child)) { out.push(child); queue.push(child); }
  }
  return out;
}

/**
 * A MariaDB of the test's own — its own data directory under the OS temp dir and a free port — started through
 * the project's own `npm run db` script (scripts/db.mjs), never the shared one on 3307. `kill()` SIGKILLs the
 * mariadbd; `restart()` starts it again on the same data directory and port.
 */
export class PrivateMariadb {
  readonly dir: string;
  readonly port: number;
  readonly database: string;
  private runners: ChildProcess[] = [];
  private output = "";

  private constructor(dir: string, port: number, database: string) {
    this.dir = dir;
    this.port = port;
    this.database = database;
  }

  static async start(database = "panwise_reliability"): Promise<PrivateMariadb> {
    // Short: the socket path must stay under 107 characters.
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pw-rel-"));
    const db = new PrivateMariadb(dir, await freePort(), database);
    await db.run();
    return db;
  }

  get env(): NodeJS.ProcessEnv {
    return { ...process.env, PANWISE_DATA_DIR: this.dir, DB_PORT: String(this.port), DB_NAME: this.database };
  }

  get pid(): number | null {
    try {
      return Number(fs.readFileSync(path.join(this.dir, "mariadb", "run", "mariadbd.pid"), "utf8").trim()) || null;
    } catch {
      return null;
    }
  }

  /** Start scripts/db.mjs and wait (at most 90 s) until it says MariaDB is on our port. */
  private async run(): Promise<void> {
    const child = spawn(process.execPath, [path.join(ROOT, "scripts", "db.mjs")], { cwd: ROOT, env: this.env, stdio: ["ignore", "pipe", "pipe"] });
    this.runners.push(child);
    let said = false;
    let exited: number | null = null;
    const onData = (chunk: Buffer) => {
      this.output += chunk.toString();
      if (this.output.includes(`MariaDB on 127.0.0.1:${this.port}`)) said = true;
    };
    child.stdout!.on("data", onData);
    child.stderr!.on("data", onData);
    child.once("exit", (code) => { exited = code ?? -1; });
    const ok = await until(() => said || exited !== null, 90_000);
    if (!ok || !said) throw new Error(`private MariaDB did not start (exit ${exited}):\n${this.output.slice(-2000)}`);
  }

  kill(): number {
    const pid = this.pid;
    if (!pid || !alive(pid)) throw new Error("no mariadbd to kill");
    process.kill(pid, "SIGKILL");
    return pid;
  }

  async restart(): Promise<void> {
    await this.run();
  }

  /** Stop every db.mjs this started (each stops its mariadbd), wait for them, remove the data directory. */
  async stop(): Promise<void> {
    const pid = this.pid;
    for (const r of this.runners) if (r.exitCode === null && !r.signalCode) r.kill("SIGTERM");
    await until(() => this.runners.every((r) => r.exitCode !== null || r.signalCode !== null) && !(pid && alive(pid)), 60_000);
    if (pid && alive(pid)) process.kill(pid, "SIGKILL");
    fs.rmSync(this.dir, { recursive: true, force: true });
  }
}
