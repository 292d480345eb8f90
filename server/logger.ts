import pino from "pino";
import type PinoPretty from "pino-pretty";

const REDACT = {
  paths: ["req.headers.authorization", "req.headers.cookie", "*.password", "*.token", "password", "token"],
  censor: "[redacted]",
};

/** One short line per finished request: "GET /api/orders 200 12 ms [request id]". */
function requestLine(log: Record<string, unknown>, messageKey: string): string {
  const req = log.req as { method?: string; url?: string; id?: string } | undefined;
  const res = log.res as { statusCode?: number } | undefined;
  if (!req || !res) return String(log[messageKey] ?? "");
  const ms = typeof log.responseTime === "number" ? ` ${Math.round(log.responseTime)} ms` : "";
  return `${req.method} ${req.url} ${res.statusCode}${ms} [${req.id}]`;
}

/**
 * pino with secrets (tokens, passwords, auth headers) redacted wherever they appear. JSON lines by default
 * (production, tests, anything that reads the logs); `pretty` gives a person's terminal short lines
 * ("12:04:31 INFO: GET /api/health 200 2 ms") through pino-pretty, in colour when the terminal has it
 * (colorette: a TTY, or FORCE_COLOR; NO_COLOR turns it off).
 */
export function createLogger(level: string, opts: { pretty?: boolean } = {}) {
  const options = { level, base: { service: "panwise" }, redact: REDACT };
  if (!opts.pretty) return pino(options);
  // Loaded only here: a JSON logger (tests, production) never needs it.
  const pretty = require("pino-pretty") as typeof PinoPretty;
  const stream = pretty({
    sync: true,
    singleLine: true,
    translateTime: "SYS:HH:MM:ss",
    ignore: "pid,hostname,service,req,res,responseTime",
    messageFormat: requestLine,
  });
  return pino(options, stream);
}
export type Logger = ReturnType<typeof createLogger>;
