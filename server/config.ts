import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";

/** Project root (server/ sits one level below it). */
export const ROOT_DIR = path.resolve(__dirname, "..");
export const DATA_DIR = process.env.PANWISE_DATA_DIR ? path.resolve(process.env.PANWISE_DATA_DIR) : path.join(ROOT_DIR, ".data");

function int(name: string, fallback: number): number {
  const raw = process.env[name];
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
  stripe: { secretKey: string; host: string; port: number; protocol: "http" | "https"; webhookSecret: string; publishableHint: string };
}

export function loadConfig(): Config {
  const port = int("PORT", 8080);
  const host = process.env.HOST || "127.0.0.1";
  return {
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
    // Real Stripe: set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET, and STRIPE_API_HOST=api.stripe.com STRIPE_API_PORT=443 STRIPE_API_PROTOCOL=https.
    stripe: {
      secretKey: process.env.STRIPE_SECRET_KEY || "sk_test_panwise_local_fake",
      host: process.env.STRIPE_API_HOST || "127.0.0.1",
      port: int("STRIPE_API_PORT", 12111),
      protocol: process.env.STRIPE_API_PROTOCOL === "https" ? "https" : "http",
      webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || "whsec_panwise_local_fake",
      publishableHint: process.env.STRIPE_API_HOST ? "stripe" : "local Stripe fake",
    },
  };
}
