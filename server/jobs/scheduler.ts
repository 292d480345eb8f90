import type { AppContext } from "../http/context";

export interface Job {
  name: string;
  everyMs: number;
  run(ctx: AppContext): Promise<void>;
}

/**
 * Run a job under a MariaDB named lock (GET_LOCK), so that with several server instances
 * against one database only one runs it at a time. Returns false when another holds the lock.
 */
export async function runLocked(ctx: AppContext, job: Job): Promise<boolean> {
  const runner = ctx.dataSource.createQueryRunner();
  await runner.connect();
  try {
    const [row] = await runner.query("SELECT GET_LOCK(?, 0) AS got", [`panwise:job:${job.name}`]);
    if (Number(row?.got) !== 1) return false;
    try {
      await job.run(ctx);
    } finally {
      await runner.query("SELECT RELEASE_LOCK(?)", [`panwise:job:${job.name}`]);
    }
    return true;
  } finally {
    await runner.release();
  }
}

export function startScheduler(ctx: AppContext, jobs: Job[]): { stop(): Promise<void>; trigger(name: string): void } {
  const timers: NodeJS.Timeout[] = [];
  const running = new Set<Promise<unknown>>();
  const ticks = new Map<string, () => void>();
  const soon = new Set<string>();
  let stopped = false;
  for (const job of jobs) {
    const tick = () => {
      if (stopped) return;
      const p = runLocked(ctx, job)
        .catch((err) => ctx.logger.error({ err, job: job.name }, "scheduled job failed"))
        .finally(() => running.delete(p));
      running.add(p);
    };
    timers.push(setInterval(tick, job.everyMs));
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
      await Promise.allSettled([...running]);
    },
  };
}
