import crypto from "node:crypto";
import type { EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { AuthRateCounter } from "./rate-counter.entity";

/**
 * Counters in MariaDB for the sign-in and password-reset limits.
 *
 * Each counter is one row keyed by (scope, SHA-256 of the key). Taking a slot is one
 * `INSERT … ON DUPLICATE KEY UPDATE count = count + 1` followed by a `SELECT … FOR UPDATE` of the same row inside one
 * transaction: the upsert takes the row's exclusive lock, so concurrent requests queue on it and each sees its own
 * number (MariaDB KB, "INSERT ON DUPLICATE KEY UPDATE"; InnoDB locking reads). A request whose number is over the
 * limit rolls its transaction back, so refused requests are not counted and can never let a later one through.
 *
 * Windows are fixed and start at the first attempt: the count resets to 1 once `windowStart` is older than the
 * window. `count` is assigned before `windowStart`, so it reads the old `windowStart` both when assignments run left
 * to right (MySQL Reference Manual, "UPDATE Statement": single-table assignments are generally evaluated from left
 * to right) and under MariaDB's SIMULTANEOUS_ASSIGNMENT mode.
 */
export interface RateLimit {
  /** What is counted, e.g. "sign_in_pair"; at most 24 characters. */
  scope: string;
  /** Whose attempts: an e-mail, an address, or both. Stored only as its SHA-256. */
  key: string;
  max: number;
  windowMs: number;
}

export interface Refusal {
  limit: RateLimit;
  retryAfterSeconds: number;
}

const keyHash = (key: string) => crypto.createHash("sha256").update(key, "utf8").digest("hex");

class Refused extends Error {
  constructor(readonly refusal: Refusal) {
    super("rate limited");
  }
}

/** A deadlock (1213) or lock wait timeout (1205): InnoDB rolled the transaction back; it is safe to run it again. */
function isRetryable(err: unknown): boolean {
  const e = err as { errno?: number; driverError?: { errno?: number } };
  const errno = e?.driverError?.errno ?? e?.errno;
  return errno === 1213 || errno === 1205;
}

async function withRetry<T>(fn: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn();
    } catch (err) {
      if (attempt >= 6 || !isRetryable(err)) throw err;
      await new Promise((r) => setTimeout(r, 5 * attempt + Math.random() * 10));
    }
  }
}

async function upsert(m: EntityManager, limit: RateLimit, now: Date): Promise<{ count: number; windowStart: Date }> {
  const cutoff = new Date(now.getTime() - limit.windowMs);
  const hash = keyHash(limit.key);
  await m.query(
    "INSERT INTO auth_rate_counter (scope, keyHash, count, windowStart) VALUES (?, ?, 1, ?) " +
      "ON DUPLICATE KEY UPDATE count = IF(windowStart <= ?, 1, count + 1), windowStart = IF(windowStart <= ?, ?, windowStart)",
    [limit.scope, hash, now, cutoff, cutoff, now],
  );
  const rows: { count: number | string; windowStart: Date }[] = await m.query(
    "SELECT count, windowStart FROM auth_rate_counter WHERE scope = ? AND keyHash = ? FOR UPDATE",
    [limit.scope, hash],
  );
  return { count: Number(rows[0].count), windowStart: new Date(rows[0].windowStart) };
}

/**
 * Take one slot in every limit, all or none. Returns null when taken, or the first limit that is full and when it
 * frees up. Limits are locked in a fixed order so two requests sharing two counters cannot deadlock each other.
 */
export async function takeSlots(ctx: AppContext, limits: RateLimit[]): Promise<Refusal | null> {
  const now = ctx.clock.now();
  const ordered = [...limits].sort((a, b) => (a.scope + keyHash(a.key) < b.scope + keyHash(b.key) ? -1 : 1));
  try {
    await withRetry(() =>
      ctx.dataSource.transaction(async (m) => {
        for (const limit of ordered) {
          const row = await upsert(m, limit, now);
          if (row.count > limit.max) {
            const freeAt = row.windowStart.getTime() + limit.windowMs;
            throw new Refused({ limit, retryAfterSeconds: Math.max(1, Math.ceil((freeAt - now.getTime()) / 1000)) });
          }
        }
      }),
    );
    return null;
  } catch (err) {
    if (err instanceof Refused) return err.refusal;
    throw err;
  }
}

/** Give back slots taken by takeSlots (a successful sign-in, or a request that was never evaluated). */
export async function giveBack(ctx: AppContext, limits: RateLimit[]): Promise<void> {
  const now = ctx.clock.now();
  for (const limit of limits) {
    await withRetry(() =>
      ctx.dataSource.query("UPDATE auth_rate_counter SET count = GREATEST(count - 1, 0) WHERE scope = ? AND keyHash = ? AND windowStart > ?", [
        limit.scope,
        keyHash(limit.key),
        new Date(now.getTime() - limit.windowMs),
      ]),
    );
  }
}

/** Count one more, with no cap; returns the count in the current window. */
export async function bump(ctx: AppContext, limit: RateLimit): Promise<number> {
  const now = ctx.clock.now();
  return withRetry(() => ctx.dataSource.transaction(async (m) => (await upsert(m, limit, now)).count));
}

/** The count in the current window (0 when the window has passed). */
export async function countIn(ctx: AppContext, limit: RateLimit): Promise<number> {
  const now = ctx.clock.now();
  const rows: { count: number | string }[] = await ctx.dataSource.query(
    "SELECT count FROM auth_rate_counter WHERE scope = ? AND keyHash = ? AND windowStart > ?",
    [limit.scope, keyHash(limit.key), new Date(now.getTime() - limit.windowMs)],
  );
  return rows.length ? Number(rows[0].count) : 0;
}

/** Drop counters whose window ended (a scheduled job); `longestWindowMs` is the longest window in use. */
export async function purgeCounters(ctx: AppContext, longestWindowMs: number): Promise<void> {
  await ctx.dataSource
    .createQueryBuilder()
    .delete()
    .from(AuthRateCounter)
    .where("windowStart < :t", { t: new Date(ctx.clock.now().getTime() - longestWindowMs) })
    .execute();
}
