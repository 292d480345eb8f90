import { spawn, type ChildProcess } from "node:child_process";
import net from "node:net";
import path from "node:path";

export const ROOT = path.resolve(__dirname, "..");

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

export function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  const i = Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1);
  return sorted[Math.max(0, i)];
}

export function summarise(ms: number[], seconds: number) {
  const s = [...ms].sort((a, b) => a - b);
  return { count: s.length, p50: percentile(s, 50), p99: percentile(s, 99), max: s.at(-1) ?? NaN, perSecond: s.length / seconds };
}

export function startServer(env: Record<string, string>): ChildProcess {
  const child = spawn("node", ["--import", "tsx", "server/index.ts"], { cwd: ROOT, env: { ...process.env, ...env }, stdio: ["ignore", "ignore", "inherit"] });
  return child;
}

export async function waitHttp(url: string, timeoutMs = 60000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    try {
      if ((await fetch(url)).ok) return;
    } catch { /* not yet */ }
    if (Date.now() > until) throw new Error(`timed out waiting for ${url}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export const stop = (c: ChildProcess) => new Promise<void>((resolve) => {
  if (c.exitCode !== null) return resolve();
  c.once("exit", () => resolve());
  c.kill("SIGTERM");
});

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
