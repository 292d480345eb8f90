import type { ZodTypeAny, z } from "zod";
import { fieldErrorsFrom } from "../../shared/schemas/common";
import type { FieldErrors } from "../../shared/errors";
import { ApiError, messageOf } from "../api/client";

export type ValidationResult<S extends ZodTypeAny> = { ok: true; data: z.output<S> } | { ok: false; fields: FieldErrors };

/** Check values with one of the shared zod schemas, the same ones the server uses. */
export function validate<S extends ZodTypeAny>(schema: S, values: unknown): ValidationResult<S> {
  const result = schema.safeParse(values);
  if (result.success) return { ok: true, data: result.data };
  return { ok: false, fields: fieldErrorsFrom(result.error) };
}

/** The fields a form shows an error beside: their names, or a test for a name. */
export type FieldNames = readonly string[] | ((name: string) => boolean);

export function isFieldName(fields: FieldNames, name: string): boolean {
  return typeof fields === "function" ? fields(name) : fields.includes(name);
}

export interface SplitError {
  /** Shown at the top of the form. */
  formError: string | null;
  /** Shown next to the fields they name. */
  fields: FieldErrors;
}

/**
 * Split a failed request into messages for the form's own fields and one message for the top:
 * field errors the form has an input for go next to it; anything else goes to the top.
 */
export function splitError(error: unknown, formFields: FieldNames): SplitError {
  if (!error) return { formError: null, fields: {} };
  if (!(error instanceof ApiError) || !error.fields) return { formError: messageOf(error), fields: {} };
  const fields: FieldErrors = {};
  const others: string[] = [];
  for (const [key, message] of Object.entries(error.fields)) {
    if (isFieldName(formFields, key)) fields[key] = message;
    else others.push(message);
  }
  if (Object.keys(fields).length === 0) return { formError: error.message, fields: {} };
  return { formError: others.length ? error.message : null, fields };
}
