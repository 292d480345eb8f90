import { z } from "zod";
import type { FieldErrors } from "../../shared/errors";

/** What a form's own check gives: the API body, or a message per field (keyed like the API's fields). */
export type CheckResult<T> = { ok: true; input: T } | { ok: false; fields: FieldErrors };

/** Said when a check refuses the values without naming a field (a check should always name one). */
const UNNAMED = "Some fields need attention.";

/**
 * A zod schema made from a form's own check, for `useZodForm`: forms whose inputs hold text that a shared schema
 * cannot read as it is (money typed in dollars, temperatures in the reader's units, rows still being filled in)
 * run the shared schema inside their check and add the rules of the form. Each message lands on its field's path
 * ("lines.0.percent"), and what the schema outputs is the body the API takes.
 */
export function checkedSchema<V, T>(check: (values: V) => CheckResult<T>) {
  return z.custom<V>(() => true).transform((values, ctx): T => {
    const result = check(values);
    if (result.ok) return result.input;
    const entries = Object.entries(result.fields);
    if (entries.length === 0) ctx.addIssue({ code: "custom", message: UNNAMED });
    for (const [path, message] of entries) ctx.addIssue({ code: "custom", path: path.split("."), message });
    return z.NEVER;
  });
}

/** The field names of rows: `rowFields("lines", 40, ["ingredientId", "percent"])` → "lines.0.ingredientId", … up to the schema's most rows. */
export function rowFields(list: string, most: number, keys: readonly string[]): string[] {
  return Array.from({ length: most }, (_, i) => keys.map((k) => `${list}.${i}.${k}`)).flat();
}
