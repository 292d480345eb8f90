import { z } from "zod";
import type { FieldErrors } from "../errors";

/**
 * zod 4 writes "Invalid input: expected string, received undefined" for a missing field; Panwise says
 * "Required." there, as zod 3 did. A schema's own message always wins over this one (zod's precedence:
 * schema, then parse, then this global map). Loaded wherever Panwise parses: every schema imports this file.
 */
z.config({ customError: (issue) => (issue.code === "invalid_type" && issue.input === undefined ? "Required." : undefined) });

/**
 * Password rules, OWASP ASVS 4.0.3 V2.1 (level 2): at least 12 characters once runs of spaces count as one (V2.1.1),
 * at most 128 (V2.1.2), nothing truncated (V2.1.3: the server hashes every character with scrypt), any printable
 * Unicode (V2.1.4), and no composition rules (V2.1.9). The check against common and breached passwords (V2.1.7)
 * runs on the server (server/auth/password-policy.ts): its list is too big to ship to every phone; the form shows
 * the server's answer on the field.
 */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 128;

/** Length as ASVS V2.1.1 counts it: Unicode code points, with each run of spaces counted once. */
export function passwordLength(password: string): number {
  return Array.from(password.replace(/ {2,}/g, " ")).length;
}

/**
 * Repetitive or sequential characters ("aaaaaaaaaaaa", "abcabcabcabc", "abcdefghijkl", "987654321098"), which NIST
 * SP 800-63B §5.1.1.2 lists among the values to refuse. Case and spaces are ignored.
 */
export function isRepetitiveOrSequential(password: string): boolean {
  const chars = Array.from(password.toLowerCase().replace(/\s+/g, ""));
  const n = chars.length;
  if (n < 2) return true;
  for (let unit = 1; unit <= 4 && unit * 2 <= n; unit++) {
    if (chars.every((c, i) => c === chars[i % unit])) return true;
  }
  const step = (a: string, b: string) => {
    if (/\d/.test(a) && /\d/.test(b)) return ((Number(b) - Number(a) + 15) % 10) - 5; // 9 → 0 continues a run
    return (b.codePointAt(0) ?? 0) - (a.codePointAt(0) ?? 0);
  };
  const first = step(chars[0], chars[1]);
  return (first === 1 || first === -1) && chars.every((c, i) => i === 0 || step(chars[i - 1], c) === first);
}

export const PASSWORD_TOO_SHORT = `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
export const PASSWORD_TOO_LONG = `Use at most ${PASSWORD_MAX_LENGTH} characters.`;
export const PASSWORD_PATTERN = "Avoid repeated or consecutive characters like “aaaa” or “1234”. A few unrelated words work well.";
export const PASSWORD_COMMON = "This password is on a list of common or leaked passwords. Choose another: a few unrelated words work well.";

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(254, "That e-mail address is too long.")
  .email("Enter a valid e-mail address, like name@example.com.")
  .transform((v) => v.toLowerCase());

export const newPasswordSchema = z
  .string({ error: "Choose a password." })
  .superRefine((password, ctx) => {
    const message =
      Array.from(password).length > PASSWORD_MAX_LENGTH
        ? PASSWORD_TOO_LONG
        : passwordLength(password) < PASSWORD_MIN_LENGTH
          ? PASSWORD_TOO_SHORT
          : isRepetitiveOrSequential(password)
            ? PASSWORD_PATTERN
            : null;
    if (message) ctx.addIssue({ code: "custom", message });
  });

export const idSchema = z.coerce
  .number({ error: (issue) => (issue.input === undefined ? undefined : "Must be a number.") })
  .int("Must be a whole number.")
  .positive("Must be a positive number.");

/** `/:id` route parameters. */
export const idParamSchema = z.object({ id: idSchema });

/** `?accountId=`: office users name an account, a buyer's own is used when left out. */
export const accountIdQuerySchema = z.object({ accountId: z.coerce.number().int().positive().optional() });

export const optionalText = (max: number, label = "This") =>
  z
    .string()
    .trim()
    .max(max, `${label} can be at most ${max} characters.`)
    .optional()
    .transform((v) => (v === undefined || v === "" ? null : v))
    .or(z.null());

/** Turn a zod error into per-field messages keyed by dotted path ("lines.0.quantity"). */
export function fieldErrorsFrom(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  // zod 4's .int() also refuses numbers past Number.MAX_SAFE_INTEGER (origin "int", too_big/too_small) before
  // the field's own .max()/.min() runs; for 1e20 the field's limit ("At most 10,000 units") says more than
  // "whole units", so those safe-range issues only speak when nothing else does.
  const safeRange = (issue: z.core.$ZodIssue) => (issue.code === "too_big" || issue.code === "too_small") && issue.origin === "int";
  for (const issue of [...error.issues.filter((i) => !safeRange(i)), ...error.issues.filter(safeRange)]) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

/**
 * Control characters (Unicode general category Cc: U+0000–U+001F, U+007F–U+009F) and the line and
 * paragraph separators U+2028/U+2029. Names (of accounts, products, sale units) travel into the calendar feed, CSV exports and mail headers,
 * where a CR or LF starts a new line: RFC 5545 §3.3.11 allows no CONTROL characters in TEXT, and RFC 5322
 * §2.2 none in a header field body.
 */
export const CONTROL = /[\u0000-\u001F\u007F-\u009F\u2028\u2029]/;

/** No line breaks or control characters in a one-line name that reaches the feed, e-mails and CSVs. */
export function isOneLine(v: string): boolean {
  return !CONTROL.test(v);
}
