import { dictionary } from "@zxcvbn-ts/language-common";
import { HttpError } from "../http/errors";
import { PASSWORD_COMMON } from "../../shared/schemas/common";

/**
 * OWASP ASVS 4.0.3 V2.1.7: new passwords are checked against a set of breached or common passwords, locally (e.g.
 * "the top 1,000 or 10,000 most common passwords which match the system's password policy"). The list is the one
 * @zxcvbn-ts/language-common ships (about 49,000 common passwords that zxcvbn scores against; no network), compared
 * without case and with spaces removed too, so "Password 1234" is refused like "password1234".
 * The length and pattern rules live in the shared schema (shared/schemas/common.ts), which the forms use as well.
 */
let common: Set<string> | null = null;
function commonPasswords(): Set<string> {
  common ??= new Set(dictionary.passwords.map((p) => p.toLowerCase()));
  return common;
}

export function isCommonPassword(password: string): boolean {
  const lower = password.normalize("NFKC").toLowerCase();
  const list = commonPasswords();
  return list.has(lower) || list.has(lower.replace(/\s+/g, ""));
}

/** Refuse a common or breached password with a 400 on the password field (the form shows it there). */
export function assertNotCommonPassword(password: string): void {
  if (isCommonPassword(password)) throw new HttpError(400, "validation_failed", PASSWORD_COMMON, { password: PASSWORD_COMMON });
}
