import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import { z } from "zod";

/** Project root (server/ sits one level below it). */
export const ROOT_DIR = path.resolve(__dirname, "..");
export const DATA_DIR = process.env.PANWISE_DATA_DIR ? path.resolve(process.env.PANWISE_DATA_DIR) : path.join(ROOT_DIR, ".data");

type Env = Record<string, string | undefined>;

export interface Config {
  /** NODE_ENV=production: the published local secrets and a generated JWT secret are refused. */
  production: boolean;
  host: string;
  port: number;
  publicUrl: string;
  db: { host: string; port: number; user: string; password: string; database: string };
  jwtSecret: string;
  jwtTtlSeconds: number;
  smtpUrl: string;
  mailFromAddress: string;
  webDist: string;
  uploadsDir: string;
  logLevel: string;
  /** Pretty, coloured log lines for a person's terminal (LOG_PRETTY=1, set by `npm start` and `npm run dev`); JSON otherwise. */
  logPretty: boolean;
  rateLimits: RateLimitSettings;
  stripe: StripeSettings;
}

/** One limit: at most `points` requests in `durationSec` seconds per key (server/http/rate-limits.ts). */
export interface LimitSetting {
  points: number;
  durationSec: number;
}

export interface RateLimitSettings {
  /** Reset-link and invitation-link checks and uses, per client address. */
  tokenCheck: LimitSetting;
  /** Calendar-feed fetches per feed token… */
  feedToken: LimitSetting;
  /** …and per client address (someone trying tokens). */
  feedAddress: LimitSetting;
  /** Card-payment pages (Stripe checkout sessions) asked for, per signed-in user. */
  checkout: LimitSetting;
}

export interface StripeSettings {
  secretKey: string;
  host: string;
  port: number;
  protocol: "http" | "https";
  webhookSecret: string;
  publishableHint: string;
  /** The catch-up job (server/jobs/stripe-catch-up.ts): how often it runs, and how old an open checkout session must be before it is checked. */
  catchUpEveryMs: number;
  catchUpSessionAgeMs: number;
}

/**
 * The local values every copy of Panwise knows (they are in this repository): usable only against the local
 * Stripe fake, never in production. Anyone who knows a webhook secret can sign events the server accepts
 * (Stripe docs, "Webhooks: verify signatures" — the endpoint secret must stay secret).
 */
export const LOCAL_FAKE_WEBHOOK_SECRET = "whsec_panwise_local_fake";
export const LOCAL_FAKE_SECRET_KEY = "sk_test_panwise_local_fake";
/** HS256 wants a key at least as long as its 256-bit output (RFC 7518 §3.2); 32 characters is the floor here. */
export const JWT_SECRET_MIN_LENGTH = 32;

/** The defaults of the limits (common practice, no source); RATE_LIMIT_<NAME>="points/seconds" changes one. */
export const DEFAULT_RATE_LIMITS: RateLimitSettings = {
  tokenCheck: { points: 40, durationSec: 15 * 60 },
  feedToken: { points: 120, durationSec: 60 * 60 },
  feedAddress: { points: 600, durationSec: 60 * 60 },
  checkout: { points: 30, durationSec: 10 * 60 },
};
const RATE_LIMIT_VARS: Record<keyof RateLimitSettings, string> = {
  tokenCheck: "RATE_LIMIT_TOKEN_CHECK",
  feedToken: "RATE_LIMIT_FEED_TOKEN",
  feedAddress: "RATE_LIMIT_FEED_ADDRESS",
  checkout: "RATE_LIMIT_CHECKOUT",
};

/** 127.0.0.0/8, ::1 and localhost (RFC 6761 §6.3: "localhost" names the loopback). */
export function isLoopbackHost(host: string): boolean {
  const h = host.trim().toLowerCase().replace(/^\[|\]$/g, "");
  return h === "localhost" || h === "::1" || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(h);
}

// ---- the one schema of the environment ----

const PORT_MESSAGE = "must be a port number (1–65535)";
const isPort = (v: string) => /^\d{1,5}$/.test(v) && Number(v) >= 1 && Number(v) <= 65535;
const isUrl = (protocols: string[]) => (v: string) => {
  try {
    return protocols.includes(new URL(v).protocol);
  } catch {
    return false;
  }
};
const isWholeMs = (v: string) => /^\d+$/.test(v) && Number.isSafeInteger(Number(v));
const LIMIT_PATTERN = /^([1-9]\d{0,8})\/([1-9]\d{0,7})$/;
const LOG_LEVELS = ["fatal", "error", "warn", "info", "debug", "trace", "silent"];

const text = (check: (v: string) => boolean, message: string) => z.string().refine(check, message).optional();
const limit = text((v) => LIMIT_PATTERN.test(v), 'must be "points/seconds", such as "40/900"');

/** Every variable Panwise reads for its settings. Unset and empty mean "the default" (except DB_PASSWORD). */
export const envSchema = z.object({
  NODE_ENV: z.string().optional(),
  HOST: z.string().optional(),
  PORT: text(isPort, PORT_MESSAGE),
  PUBLIC_URL: text(isUrl(["http:", "https:"]), "must be an http(s) URL, such as https://orders.example.com"),
  DB_HOST: z.string().optional(),
  DB_PORT: text(isPort, PORT_MESSAGE),
  DB_USER: z.string().optional(),
  DB_PASSWORD: z.string().optional(),
  DB_NAME: text((v) => /^[A-Za-z0-9_$]{1,64}$/.test(v), "must be a MariaDB database name (letters, digits, _ and $; at most 64)"),
  JWT_SECRET: text((v) => v.length >= JWT_SECRET_MIN_LENGTH, `must be at least ${JWT_SECRET_MIN_LENGTH} characters (such as the output of \`openssl rand -hex 48\`)`),
  SMTP_URL: text(isUrl(["smtp:", "smtps:"]), "must be an smtp:// or smtps:// URL"),
  MAIL_FROM_ADDRESS: text((v) => z.string().email().safeParse(v).success, "must be an e-mail address"),
  WEB_DIST: z.string().optional(),
  LOG_LEVEL: text((v) => LOG_LEVELS.includes(v), `must be one of ${LOG_LEVELS.join(", ")}`),
  LOG_PRETTY: text((v) => v === "0" || v === "1", "must be 0 or 1"),
  STRIPE_SECRET_KEY: z.string().optional(),
  STRIPE_WEBHOOK_SECRET: z.string().optional(),
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: text(isPort, PORT_MESSAGE),
  STRIPE_API_PROTOCOL: text((v) => v === "http" || v === "https", "must be http or https"),
  STRIPE_CATCH_UP_EVERY_MS: text(isWholeMs, "must be a whole number of milliseconds"),
  STRIPE_CATCH_UP_SESSION_AGE_MS: text(isWholeMs, "must be a whole number of milliseconds"),
  RATE_LIMIT_TOKEN_CHECK: limit,
  RATE_LIMIT_FEED_TOKEN: limit,
  RATE_LIMIT_FEED_ADDRESS: limit,
  RATE_LIMIT_CHECKOUT: limit,
});
export type ParsedEnv = z.infer<typeof envSchema>;

/** Values never repeated in a message. */
const SECRET_VARS = new Set(["JWT_SECRET", "DB_PASSWORD", "SMTP_URL", "STRIPE_SECRET_KEY", "STRIPE_WEBHOOK_SECRET"]);

/** Settings that cannot be used; its message names every bad variable at once, on one line. */
export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`the configuration has ${problems.length === 1 ? "a problem" : `${problems.length} problems`}: ${problems.join("; ")}.`);
    this.name = "ConfigError";
  }
}

/** Parse the environment; every variable that does not fit is one problem ("PORT must be a port number…, got \"x\""). */
function parseEnv(env: Env): { values: ParsedEnv; problems: string[] } {
  const clean: Env = {};
  for (const [k, v] of Object.entries(env)) if (v !== "" || k === "DB_PASSWORD") clean[k] = v;
  const result = envSchema.safeParse(clean);
  if (result.success) return { values: result.data, problems: [] };
  const problems = result.error.issues.map((issue) => {
    const name = String(issue.path[0]);
    const got = SECRET_VARS.has(name) ? "" : `, got "${clean[name]}"`;
    return `${name} ${issue.message}${got}`;
  });
  return { values: {}, problems };
}

// ---- Stripe ----

function stripeProblem(env: Env): string | null {
  const host = env.STRIPE_API_HOST || "127.0.0.1";
  const production = env.NODE_ENV === "production";
  const published = [
    (env.STRIPE_WEBHOOK_SECRET || LOCAL_FAKE_WEBHOOK_SECRET) === LOCAL_FAKE_WEBHOOK_SECRET ? "STRIPE_WEBHOOK_SECRET" : null,
    (env.STRIPE_SECRET_KEY || LOCAL_FAKE_SECRET_KEY) === LOCAL_FAKE_SECRET_KEY ? "STRIPE_SECRET_KEY" : null,
  ].filter(Boolean);
  if (!published.length || (!production && isLoopbackHost(host))) return null;
  return `Stripe is not configured: set ${published.join(" and ")} to your own values (the built-in ones are public and work only with the local Stripe fake${production ? ", never with NODE_ENV=production" : ""}; STRIPE_API_HOST is ${host})`;
}

/**
 * Stripe settings, refusing the published local secret and key unless the server talks to the local fake
 * (STRIPE_API_HOST unset or loopback) outside production. Throws one message naming what to set.
 */
export function stripeSettings(env: Env = process.env): StripeSettings {
  const { values, problems } = parseEnv(env);
  const stripeFormat = problems.filter((p) => p.startsWith("STRIPE_"));
  if (stripeFormat.length) throw new ConfigError(stripeFormat);
  const problem = stripeProblem(env);
  if (problem) throw new Error(`${problem}.`);
  const everyMs = Number(values.STRIPE_CATCH_UP_EVERY_MS ?? 0);
  return {
    secretKey: values.STRIPE_SECRET_KEY || LOCAL_FAKE_SECRET_KEY,
    host: values.STRIPE_API_HOST || "127.0.0.1",
    port: Number(values.STRIPE_API_PORT ?? 12111),
    protocol: values.STRIPE_API_PROTOCOL === "https" ? "https" : "http",
    webhookSecret: values.STRIPE_WEBHOOK_SECRET || LOCAL_FAKE_WEBHOOK_SECRET,
    publishableHint: values.STRIPE_API_HOST ? "stripe" : "local Stripe fake",
    catchUpEveryMs: everyMs || 3 * 60 * 1000,
    catchUpSessionAgeMs: Number(values.STRIPE_CATCH_UP_SESSION_AGE_MS ?? 5 * 60 * 1000),
  };
}

// ---- the JWT secret ----

function jwtProblem(env: Env): string | null {
  if (env.NODE_ENV !== "production" || (env.JWT_SECRET ?? "") !== "") return null;
  return `JWT_SECRET must be set with NODE_ENV=production (at least ${JWT_SECRET_MIN_LENGTH} characters, the same on every instance; a generated one kept in a file is for one machine only)`;
}

/**
 * The signing secret for sign-in tokens. Several instances behind one load balancer must share it,
 * so production sets JWT_SECRET; locally one is generated once and kept in .data/.
 */
function generatedJwtSecret(): string {
  const file = path.join(DATA_DIR, "jwt-secret");
  try {
    return fs.readFileSync(file, "utf8").trim();
  } catch {
    fs.mkdirSync(DATA_DIR, { recursive: true });
    const secret = crypto.randomBytes(48).toString("hex");
    fs.writeFileSync(file, secret, { mode: 0o600 });
    return secret;
  }
}

function rateLimits(values: ParsedEnv): RateLimitSettings {
  const out = { ...DEFAULT_RATE_LIMITS };
  for (const key of Object.keys(RATE_LIMIT_VARS) as (keyof RateLimitSettings)[]) {
    const m = LIMIT_PATTERN.exec(values[RATE_LIMIT_VARS[key] as keyof ParsedEnv] ?? "");
    if (m) out[key] = { points: Number(m[1]), durationSec: Number(m[2]) };
  }
  return out;
}

/**
 * The settings, from one parse of the environment. A variable in the wrong form throws a ConfigError naming every
 * such variable. The rules only the server needs (Stripe's own keys, JWT_SECRET in production) are checked when
 * the value is first read, so tools that only need the database settings (migrations, the test harness) still load;
 * the server process calls loadServerConfig, which checks everything at once.
 */
export function loadConfig(env: Env = process.env): Config {
  const { values: v, problems } = parseEnv(env);
  if (problems.length) throw new ConfigError(problems);
  const port = Number(v.PORT ?? 8080);
  const production = env.NODE_ENV === "production";
  let stripe: StripeSettings | undefined;
  let jwtSecret: string | undefined = v.JWT_SECRET;
  return {
    production,
    // Real Stripe: set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET, and STRIPE_API_HOST=api.stripe.com
    // STRIPE_API_PORT=443 STRIPE_API_PROTOCOL=https.
    get stripe(): StripeSettings {
      return (stripe ??= stripeSettings(env));
    },
    set stripe(value: StripeSettings) {
      stripe = value;
    },
    get jwtSecret(): string {
      if (jwtSecret === undefined) {
        const problem = jwtProblem(env);
        if (problem) throw new ConfigError([problem]);
        jwtSecret = generatedJwtSecret();
      }
      return jwtSecret;
    },
    set jwtSecret(value: string) {
      jwtSecret = value;
    },
    host: v.HOST || "127.0.0.1",
    port,
    publicUrl: (v.PUBLIC_URL || `http://127.0.0.1:${port}`).replace(/\/$/, ""),
    db: {
      host: v.DB_HOST || "127.0.0.1",
      port: Number(v.DB_PORT ?? 3307),
      user: v.DB_USER || "panwise",
      password: v.DB_PASSWORD ?? "panwise-local",
      database: v.DB_NAME || "panwise",
    },
    jwtTtlSeconds: 12 * 60 * 60,
    smtpUrl: v.SMTP_URL || "smtp://127.0.0.1:1025",
    mailFromAddress: v.MAIL_FROM_ADDRESS || "orders@hollowbrook.test",
    webDist: v.WEB_DIST ? path.resolve(v.WEB_DIST) : path.join(ROOT_DIR, "dist"),
    uploadsDir: path.join(DATA_DIR, "uploads"),
    logLevel: v.LOG_LEVEL || (env.NODE_ENV === "test" ? "silent" : "info"),
    logPretty: v.LOG_PRETTY === "1" && !production,
    rateLimits: rateLimits(v),
  };
}

/**
 * The server process's settings: every problem at once — variables in the wrong form, the published Stripe
 * values where they are refused, a missing JWT_SECRET in production — in one ConfigError, before anything starts.
 */
export function loadServerConfig(env: Env = process.env): Config {
  const { problems } = parseEnv(env);
  const all = [...problems, ...[stripeProblem(env), jwtProblem(env)].filter((p): p is string => p !== null)];
  if (all.length) throw new ConfigError(all);
  const config = loadConfig(env);
  void config.stripe;
  void config.jwtSecret;
  return config;
}
