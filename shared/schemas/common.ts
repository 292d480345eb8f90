import { z } from "zod";
import type { FieldErrors } from "../errors";

export const PASSWORD_MIN_LENGTH = 10;

export const emailSchema = z
  .string({ required_error: "Enter an e-mail address.", invalid_type_error: "Enter an e-mail address." })
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(254, "That e-mail address is too long.")
  .email("Enter a valid e-mail address, like name@example.com.")
  .transform((v) => v.toLowerCase());

export const newPasswordSchema = z
  .string({ required_error: "Choose a password.", invalid_type_error: "Choose a password." })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(200, "Use at most 200 characters.");

export const idSchema = z.coerce
  .number({ invalid_type_error: "Must be a number." })
  .int("Must be a whole number.")
  .positive("Must be a positive number.");

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
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}
