// Keep a child running: start it again with backoff when it dies, say so on the terminal, reset the backoff after
// a stable period. Node built-ins only. A "deliberate" stop (exit code 0, or ended by SIGINT/SIGTERM/SIGHUP — someone
// asked it to stop) is not restarted: the caller is told, and stops everything.
import { log, warn } from "./env.mjs";

/** Waits before restart attempts 2, 3, 4, … (seconds); the last repeats. Common practice (capped exponential backoff), no source. */
export const RESTART_BACKOFF_S = [1, 2, 4, 8, 16, 30];
/** Up this long without dying: the next death starts the backoff from the beginning again. */
export const STABLE_MS = Number(process.env.PANWISE_RESTART_STABLE_MS || 60000);

const cap = (s) => s.charAt(0).toUpperCase() + s.slice(1);
const DELIBERATE_SIGNALS = new Set(["SIGINT", "SIGTERM", "SIGHUP"]);

/** "signal SIGKILL", "exit code 1", or the watcher's own words. */
export const describeExit = ({ code, signal, reason }) => reason ?? (signal ? `signal ${signal}` : `exit code ${code}`);

export const isDeliberate = ({ code, signal, reason }) => !reason && (signal ? DELIBERATE_SIGNALS.has(signal) : code === 0);

/**
 * Supervise one child.
 * - `start()` starts it and resolves with { exit: Promise<{ code, signal }>, stop(): Promise<void> } (or throws).
 * - `isStopping()` is true once everything is being stopped: nothing is restarted then.
 * - `onDeliberateExit(exitInfo)` is called when it stopped on request (the caller then stops everything).
 * - `onRestarted()` runs after a successful restart (e.g. wait for its health and say it is back).
 * Returns { stop(), running() }; the first start is awaited by `supervise`, so start-up failures reach the caller.
 */
export async function supervise({ label, start, isStopping, onDeliberateExit, onRestarted }) {
  let current = null;
  let startedAt = 0;
  let failures = 0; // deaths in the current unstable streak
  let timer = null;
  let stopped = false;

  const watch = (handle) => {
    void handle.exit.then((info) => {
      if (current !== handle) return;
      current = null;
      if (stopped || isStopping()) return;
      if (isDeliberate(info)) {
        log(`${cap(label)} stopped (${describeExit(info)}); stopping everything`);
        onDeliberateExit?.(info);
        return;
      }
      if (Date.now() - startedAt >= STABLE_MS) failures = 0;
      schedule(`${cap(label)} stopped unexpectedly (${describeExit(info)})`);
    });
  };

  const schedule = (why) => {
    const delay = RESTART_BACKOFF_S[Math.min(failures, RESTART_BACKOFF_S.length - 1)];
    failures++;
    warn(`${why}; restarting in ${delay} s (attempt ${failures + 1})`);
    timer = setTimeout(() => void restart(), delay * 1000);
  };

  const launch = async () => {
    const handle = await start();
    startedAt = Date.now();
    current = handle;
    watch(handle);
    return handle;
  };

  const restart = async () => {
    timer = null;
    if (stopped || isStopping()) return;
    try {
      await launch();
    } catch (err) {
      if (stopped || isStopping()) return;
      schedule(`${cap(label)} did not start (${String(err?.message || err).split("\n")[0]})`);
      return;
    }
    try {
      await onRestarted?.();
    } catch (err) {
      warn(`${cap(label)}: ${String(err?.message || err)}`);
    }
  };

  await launch();
  return {
    running: () => current !== null,
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      const h = current;
      current = null;
      if (h) await h.stop();
    },
  };
}
