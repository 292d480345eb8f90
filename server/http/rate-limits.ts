import crypto from "node:crypto";
import type { Request, RequestHandler } from "express";
import type { RateLimiterMySQL } from "rate-limiter-flexible";
import type { AppContext } from "./context";
import { HttpError } from "./errors";
import type { RateLimitSettings } from "../config";

/**
 * Request limits beyond sign-in, counted by rate-limiter-flexible in MariaDB (its MySQL store on the app's own
 * mysql2 pool), so every server instance counts the same requests and nothing lives in one process's memory: no
 * in-memory block, no insurance limiter. The table `rate_limit_points` comes from a migration (`tableCreated: true`);
 * expired rows are dropped by the purge job (`purgeRateLimits`), not by a timer in each process.
 *
 * Windows are fixed: a key's first request opens a window of `durationSec`, at most `points` requests are let
 * through in it, and each refusal is a 429 `rate_limited` with Retry-After (RFC 6585 §4; RFC 9110 §10.2.3) in the
 * one error shape. The library keeps time with Date.now(), not the app's Clock. The figures are in server/config.ts
 * (common practice, no source), and RATE_LIMIT_<NAME>="points/seconds" changes one.
 *
 * The sign-in and password-reset-request limits stay on their own rows (server/auth/rate-limit.ts): they take a slot
 * before the password is checked and give it back after, which this library's fixed counters do not do.
 */
export const RATE_LIMIT_TABLE = "rate_limit_points";

export type LimitName = keyof RateLimitSettings;

const WHAT: Record<LimitName, string> = {
  tokenCheck: "Too many link checks from here.",
  feedToken: "This calendar feed was fetched too often.",
  feedAddress: "Too many calendar-feed requests from here.",
  checkout: "Too many payment pages were opened.",
};

const hash = (value: string) => crypto.createHash("sha256").update(value, "utf8").digest("hex");

export function rateLimitedError(name: LimitName, retryAfterSeconds: number): HttpError {
  const minutes = Math.ceil(retryAfterSeconds / 60);
  return new HttpError(
    429,
    "rate_limited",
    `${WHAT[name]} Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`,
    undefined,
    { retryAfterSeconds },
    { "Retry-After": String(retryAfterSeconds) },
  );
}

/** The mysql2 pool TypeORM opened (its driver's `pool`); the limiters borrow connections from it. */
function poolOf(ctx: AppContext): unknown {
  const pool = (ctx.dataSource.driver as unknown as { pool?: unknown }).pool;
  if (!pool) throw new Error("rate limits need the database connection: initialize the DataSource first");
  return pool;
}

const limitersByContext = new WeakMap<AppContext, Map<LimitName, RateLimiterMySQL>>();
/** The library, loaded on the first limited request (most processes that build the app never take a point). */
const library = () => require("rate-limiter-flexible") as typeof import("rate-limiter-flexible");

function limiterFor(ctx: AppContext, name: LimitName): RateLimiterMySQL {
  let made = limitersByContext.get(ctx);
  if (!made) limitersByContext.set(ctx, (made = new Map()));
  let limiter = made.get(name);
  if (!limiter) {
    const setting = ctx.config.rateLimits[name];
    limiter = new (library().RateLimiterMySQL)({
      storeClient: poolOf(ctx),
      storeType: "pool",
      dbName: String(ctx.dataSource.options.database),
      tableName: RATE_LIMIT_TABLE,
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix: name,
      points: setting.points,
      duration: setting.durationSec,
    });
    made.set(name, limiter);
  }
  return limiter;
}

/**
 * Take one point of a limit for this key (an address, a token, a user id; stored only as its SHA-256). Throws the
 * 429 when the window is full; a database failure is passed on as it is (the error handler answers 503 for an
 * unreachable database).
 */
export async function takePoint(ctx: AppContext, name: LimitName, key: string): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await limiterFor(ctx, name).consume(hash(key));
      return;
    } catch (err) {
      if (err instanceof library().RateLimiterRes) throw rateLimitedError(name, Math.max(1, Math.ceil(err.msBeforeNext / 1000)));
      // Concurrent first requests for one key can deadlock on its new row; InnoDB rolled the loser back, so run it again.
      if (attempt >= 6 || !isRetryable(err)) throw err;
      await new Promise((r) => setTimeout(r, 5 * attempt + Math.random() * 10));
    }
  }
}

/** A deadlock (1213) or lock wait timeout (1205): the transaction was rolled back and is safe to run again. */
function isRetryable(err: unknown): boolean {
  const errno = (err as { errno?: number } | null)?.errno;
  return errno === 1213 || errno === 1205;
}

/** Drop the rows of windows that ended (the hourly purge job). */
export async function purgeRateLimits(ctx: AppContext): Promise<void> {
  await ctx.dataSource.query(`DELETE FROM \`${RATE_LIMIT_TABLE}\` WHERE expire < ?`, [Date.now()]);
}

const addressOf = (req: Request) => req.ip || req.socket.remoteAddress || "unknown";

/** The feed token in /api/feeds/<token>.ics, as the route reads it (percent-decoded when it decodes). */
function feedTokenOf(req: Request): string {
  const raw = req.path.replace(/^\//, "").replace(/\.ics$/, "");
  try {
    return decodeURIComponent(raw);
  } catch {
    return raw;
  }
}

const handler = (take: (req: Request) => Promise<void>): RequestHandler => (req, _res, next) => {
  take(req).then(() => next(), next);
};

export interface RateLimitMiddleware {
  /** Reset-link and invitation-link checks and uses (GET /auth/invitations/:token, POST …/accept, POST /auth/password-reset/confirm), per address. */
  tokenCheck: RequestHandler;
  /** Calendar-feed fetches (/api/feeds/<token>.ics), per address, then per token. */
  feed: RequestHandler;
  /** Card-payment page creation (POST /api/invoices/:id/checkout), per signed-in user: after `allow(...)`. */
  checkout: RequestHandler;
}

/** The limits as Express middleware for this app's context. */
export function rateLimits(ctx: AppContext): RateLimitMiddleware {
  return {
    tokenCheck: handler((req) => takePoint(ctx, "tokenCheck", addressOf(req))),
    feed: handler(async (req) => {
      await takePoint(ctx, "feedAddress", addressOf(req));
      await takePoint(ctx, "feedToken", feedTokenOf(req));
    }),
    checkout: handler((req) => takePoint(ctx, "checkout", req.user ? `user:${req.user.id}` : `address:${addressOf(req)}`)),
  };
}
