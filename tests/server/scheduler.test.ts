import { createTestDatabase } from "./helpers/db";
import { startScheduler, type Job } from "../../server/jobs/scheduler";
import { createLogger } from "../../server/logger";
import type { AppContext } from "../../server/http/context";

/**
 * The scheduler runs due jobs one at a time. Each job holds one pooled connection for its named lock
 * (MariaDB GET_LOCK) and its work takes another: with every job started at once, a pool smaller than
 * twice the job count deadlocked and /api/health waited forever (seen with 10 jobs on the default pool of 10).
 */
let db: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => { db = await createTestDatabase(); });
afterAll(() => db?.drop());

it("runs ten due jobs on a small pool without taking every connection, and a query still answers meanwhile", async () => {
  const pool = (db.dataSource.driver as unknown as { pool: { config: { connectionLimit: number } } }).pool;
  const limit = pool?.config?.connectionLimit ?? 10;
  const ctx = { dataSource: db.dataSource, logger: createLogger("silent") } as unknown as AppContext;
  const done: string[] = [];
  let inFlight = 0;
  let maxInFlight = 0;
  const jobs: Job[] = Array.from({ length: limit }, (_, i) => ({
    name: `test-job-${i}`,
    everyMs: 60_000,
    run: async () => {
      inFlight++;
      maxInFlight = Math.max(maxInFlight, inFlight);
      // Hold a second connection, as real jobs do in their transactions.
      await db.dataSource.transaction(async (m) => { await m.query("SELECT SLEEP(0.05)"); });
      inFlight--;
      done.push(`test-job-${i}`);
    },
  }));
  const scheduler = startScheduler(ctx, jobs);
  const started = Date.now();
  const [row] = await db.dataSource.query("SELECT 1 AS one");
  const healthMs = Date.now() - started;
  const until = Date.now() + 10_000;
  while (done.length < jobs.length && Date.now() < until) await new Promise((r) => setTimeout(r, 20));
  await scheduler.stop();
  expect(Number(row.one)).toBe(1);
  expect(healthMs).toBeLessThan(1000);
  expect(done.sort()).toEqual(jobs.map((j) => j.name).sort());
  expect(maxInFlight).toBe(1);
});
