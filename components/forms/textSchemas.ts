import { z } from "zod";

/**
 * A text input read as something else ("12.50" → 1250 cents, "3" → 3): `read` returns the value, or the
 * message to show beside the input. For the text-value schemas of forms (with `useZodForm`'s `toInput`).
 */
export function readText<T>(read: (text: string) => { value: T } | { message: string }) {
  return z.string().transform((text, ctx): T => {
    const result = read(text);
    if ("message" in result) {
      // Fatal: checks over the whole form (a superRefine) wait until every input could be read.
      ctx.addIssue({ code: z.ZodIssueCode.custom, message: result.message, fatal: true });
      return z.NEVER;
    }
    return result.value;
  });
}
