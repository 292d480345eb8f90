import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";

/** Project root (server/ sits one level below it). */
export const ROOT_DIR = path.resolve(__dirname, "..");
export const DATA_DIR = process.env.PANWISE_DATA_DIR ? path.resolve(process.env.PANWISE_DATA_DIR) : path.join(ROOT_DIR, ".data");

function int(name: string, fallback: number, env: Record<string, string | undefined> = process.env): number {
  const raw = env[name];
  if (raw === undefined || raw === "") return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0 || n > 65535) throw new Error(`${name} must be a port number, got "${raw}"`);
  return n;
}

/**
 * The signing secret for sign-in tokens. Several instances behind one load balancer must share it,
 * so production sets JWT_SECRET; locally one is generated once and kept in .data/.
 */
function jwtSecret(): string {
  if (process.env.JWT_SECRET) return process.env.JWT_SECRET;
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

export interface Config {
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
  stripe: StripeSettings;
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

/** 127.0.0.0/8, ::1 and localhost (RFC 6761 §6.3: "localhost" names the loopback). */
export function isLoopbackHost(host: string): boolean {
  const h = host.trim().toLowerCase().replace(/^\[|\]$/g, "");
  return h === "localhost" || h === "::1" || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(h);
}

type Env = Record<string, string | undefined>;

function positiveMs(env: Env, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === "") return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0) throw new Error(`${name} must be a whole number of milliseconds, got "${raw}"`);
  return n;
}

/**
 * Stripe settings, refusing the published local secret and key unless the server talks to the local fake
 * (STRIPE_API_HOST unset or loopback) outside production. Throws one message naming what to set.
 */
export function stripeSettings(env: Env = process.env): StripeSettings {
  const host = env.STRIPE_API_HOST || "127.0.0.1";
  const secretKey = env.STRIPE_SECRET_KEY || LOCAL_FAKE_SECRET_KEY;
  const webhookSecret = env.STRIPE_WEBHOOK_SECRET || LOCAL_FAKE_WEBHOOK_SECRET;
  const production = env.NODE_ENV === "production";
  const local = isLoopbackHost(host);
  const published = [webhookSecret === LOCAL_FAKE_WEBHOOK_SECRET ? "STRIPE_WEBHOOK_SECRET" : null, secretKey === LOCAL_FAKE_SECRET_KEY ? "STRIPE_SECRET_KEY" : null].filter(Boolean);
  if (published.length && (production || !local)) {
    throw new Error(
      `Stripe is not configured: set ${published.join(" and ")} to your own values (the built-in ones are public and work only with the local Stripe fake${production ? ", never with NODE_ENV=production" : ""}; STRIPE_API_HOST is ${host}).`,
    );
  }
  return {
    secretKey,
    host,
    port: int("STRIPE_API_PORT", 12111, env),
    protocol: env.STRIPE_API_PROTOCOL === "https" ? "https" : "http",
    webhookSecret,
    publishableHint: env.STRIPE_API_HOST ? "stripe" : "local Stripe fake",
    catchUpEveryMs: positiveMs(env, "STRIPE_CATCH_UP_EVERY_MS", 3 * 60 * 1000) || 3 * 60 * 1000,
    catchUpSessionAgeMs: positiveMs(env, "STRIPE_CATCH_UP_SESSION_AGE_MS", 5 * 60 * 1000),
  };
}

export function loadConfig(): Config {
  const port = int("PORT", 8080);
  const host = process.env.HOST || "127.0.0.1";
  let stripe: StripeSettings | undefined;
  return {
    // Real Stripe: set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET, and STRIPE_API_HOST=api.stripe.com
    // STRIPE_API_PORT=443 STRIPE_API_PROTOCOL=https. Checked when first read (the server builds its Stripe
    // client at start, and refuses to start), so tools that only need the database settings still load.
    get stripe(): StripeSettings {
      return (stripe ??= stripeSettings());
    },
    set stripe(value: StripeSettings) {
      stripe = value;
    },
    host,
    port,
    publicUrl: (process.env.PUBLIC_URL || `http://127.0.0.1:${port}`).replace(/\/$/, ""),
    db: {
      host: process.env.DB_HOST || "127.0.0.1",
      port: int("DB_PORT", 3307),
      user: process.env.DB_USER || "panwise",
      password: process.env.DB_PASSWORD ?? "panwise-local",
      database: process.env.DB_NAME || "panwise",
    },
    jwtSecret: jwtSecret(),
    jwtTtlSeconds: 12 * 60 * 60,
    smtpUrl: process.env.SMTP_URL || "smtp://127.0.0.1:1025",
    mailFromAddress: process.env.MAIL_FROM_ADDRESS || "orders@hollowbrook.test",
    webDist: process.env.WEB_DIST ? path.resolve(process.env.WEB_DIST) : path.join(ROOT_DIR, "dist"),
    uploadsDir: path.join(DATA_DIR, "uploads"),
    logLevel: process.env.LOG_LEVEL || (process.env.NODE_ENV === "test" ? "silent" : "info"),
  };
}
