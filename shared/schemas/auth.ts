import { z } from "zod";
import { emailSchema, newPasswordSchema } from "./common";
import { ROLES } from "../roles";

export const signInSchema = z.object({
  email: emailSchema,
  // New passwords stop at 128 characters; a longer limit here keeps older, longer passwords working while still
  // bounding the work one request can ask of the hash (OWASP ASVS 4.0.3 V2.1.2 is about setting passwords).
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(1024, "That password is too long."),
});
export type SignInInput = z.input<typeof signInSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const passwordResetConfirmSchema = z.object({
  token: z.string({ error: (issue) => (issue.input === undefined ? "The link is missing its token." : undefined) }).min(10, "The link is incomplete."),
  password: newPasswordSchema,
});

export const invitationAcceptSchema = z.object({
  token: z.string({ error: (issue) => (issue.input === undefined ? "The link is missing its token." : undefined) }).min(10, "The link is incomplete."),
  password: newPasswordSchema,
  name: z.string({ error: (issue) => (issue.input === undefined ? "Enter your name." : undefined) }).trim().min(1, "Enter your name.").max(120, "Use at most 120 characters."),
});

export const sessionUserSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  accountId: z.number().nullable(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export interface SignInResponse {
  token: string;
  user: SessionUser;
}
