import pino from "pino";

/** Structured JSON logs. Secrets (tokens, passwords, auth headers) are redacted wherever they appear. */
export function createLogger(level: string) {
  return pino({
    level,
    base: { service: "panwise" },
    redact: {
      paths: [
        "req.headers.authorization",
        "req.headers.cookie",
        "*.password",
        "*.token",
        "password",
        "token",
      ],
      censor: "[redacted]",
    },
  });
}
export type Logger = ReturnType<typeof createLogger>;
