import { z } from "zod";

export const PASSWORD_MISMATCH = "The two passwords don't match.";
export const PASSWORD_AGAIN = "Type the password again.";

/**
 * One of the shared set-password schemas (accepting an invitation, resetting a password) with the second
 * password typed to confirm it: the shared schema's messages first, then "don't match" (only when the
 * password itself passed), else "Type the password again." for an empty confirmation. The confirmation is
 * not sent.
 */
export function withConfirmation<S extends z.ZodTypeAny>(base: S) {
  return z
    .object({ password: z.string(), confirm: z.string() })
    .passthrough()
    .transform((values, ctx): z.output<S> => {
      const { confirm, ...sent } = values;
      const result = base.safeParse(sent);
      const issues = result.success ? [] : result.error.issues;
      for (const issue of issues) ctx.addIssue({ code: z.ZodIssueCode.custom, path: issue.path, message: issue.message });
      const passwordWrong = issues.some((i) => i.path.join(".") === "password");
      if (!passwordWrong && values.password !== confirm) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ["confirm"], message: PASSWORD_MISMATCH });
      else if (!confirm) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ["confirm"], message: PASSWORD_AGAIN });
      return result.success ? result.data : z.NEVER;
    });
}
