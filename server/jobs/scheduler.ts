import crypto from "node:crypto";
import type { AppContext } from "../http/context";

export interface Job {
  name: string;
  /** How often it runs; a function when it comes from the configuration. */
  everyMs: number | ((ctx: AppContext) => number);
  run(ctx: AppContext): Promise<void>;
}

/**
 * The MariaDB named lock a job runs under; a route that does the same work by hand takes the same one.
 * "Names are locked on a server-wide basis" (MariaDB docs, GET_LOCK), not per database, so the name carries
 * the database: two Panwise databases on one MariaDB server (or test runs side by side) never block each
 * other. Hashed to keep names short (MySQL caps lock names at 64 characters, from memory).
 */
export const jobLockName = (job: string, database: string) => `panwise:${crypto.createHash("sha256").update(database).digest("hex").slice(0, 12)}:job:${job}`;
const databaseOf = (ctx: AppContext) => String(ctx.dataSource.options.database ?? "");

/** A job's own lock, for work done by hand that must not run beside the job (statements issued "now"). */
export async function withJobLock<T>(ctx: AppContext, job: string, work: () => Promise<T>) {
  return withNamedLock(ctx, jobLockName(job, databaseOf(ctx)), work);
}

/**
 * Run `work` while holding a MariaDB named lock (GET_LOCK with timeout 0: MariaDB docs, GET_LOCK — 1 when
 * obtained, 0 when another connection holds it), so only one holder at a time across every server instance
 * on the database. `{ ran: false }` when another holds it.
 */
export async function withNamedLock<T>(ctx: AppContext, name: string, work: () => Promise<T>): Promise<{ ran: true; value: T } | { ran: false }> {
  const runner = ctx.dataSource.createQueryRunner();
  await runner.connect();
  try {
    const [row] = await runner.query("SELECT GET_LOCK(?, 0) AS got", [name]);
    if (Number(row?.got) !== 1) return { ran: false };
    try {
      return { ran: true, value: await work() };
    } finally {
      await runner.query("SELECT RELEASE_LOCK(?)", [name]);
    }
  } finally {
    await runner.release();
  }
}

/**
 * Run a job under its MariaDB named lock, so that with several server instances against one database only
 * one runs it at a time. Returns false when another holds the lock.
 */
export async function runLocked(ctx: AppContext, job: Job): Promise<boolean> {
  return (await withNamedLock(ctx, jobLockName(job.name, databaseOf(ctx)), () => job.run(ctx))).ran;
}

/**
 * Jobs run one at a time, in the order they fall due: each holds a pooled connection for its named lock
 * and needs more for its work, so running every due job at once (ten at start-up) could take the whole
 * pool and leave every request, /api/health included, waiting for a connection. A job that is already
 * waiting or running is not queued twice.
 */
export function startScheduler(ctx: AppContext, jobs: Job[]): { stop(): Promise<void>; trigger(name: string): void } {
  const timers: NodeJS.Timeout[] = [];
  const ticks = new Map<string, () => void>();
  const soon = new Set<string>();
  const queued: Job[] = [];
  let current: Promise<void> | null = null;
  let stopped = false;

  const drain = () => {
    if (current || stopped) return;
    const job = queued.shift();
    if (!job) return;
    current = runLocked(ctx, job)
      .then(() => undefined, (err) => ctx.logger.error({ err, job: job.name }, "scheduled job failed"))
      .finally(() => { current = null; setImmediate(drain); });
  };

  for (const job of jobs) {
    const tick = () => {
      if (stopped || queued.includes(job)) return;
      queued.push(job);
      drain();
    };
    timers.push(setInterval(tick, typeof job.everyMs === "function" ? job.everyMs(ctx) : job.everyMs));
    ticks.set(job.name, tick);
    setImmediate(tick);
  }
  return {
    /** Run a job shortly (debounced), e.g. the mail worker right after a mail is queued. */
    trigger(name: string) {
      if (soon.has(name) || !ticks.has(name)) return;
      soon.add(name);
      setTimeout(() => { soon.delete(name); ticks.get(name)!(); }, 50).unref();
    },
    async stop() {
      stopped = true;
      timers.forEach(clearInterval);
      queued.length = 0;
      await current;
    },
  };
}
