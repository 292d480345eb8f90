import { z } from "zod";
import { emailSchema } from "./common";
import { ROLES, type Role } from "../roles";

export const roleSchema = z.enum(ROLES, { error: "Choose one of: owner, baker, bookkeeper, buyer." });

export const invitationCreateSchema = z
  .object({
    email: emailSchema,
    role: roleSchema,
    accountId: z.number().int().positive().nullable().optional(),
    name: z.string().trim().max(120, "Use at most 120 characters.").optional(),
  })
  .superRefine((v, ctx) => {
    if (v.role === "buyer" && !v.accountId) {
      ctx.addIssue({ code: "custom", path: ["accountId"], message: "Choose the customer account this buyer orders for." });
    }
    if (v.role !== "buyer" && v.accountId) {
      ctx.addIssue({ code: "custom", path: ["accountId"], message: "Only buyers belong to a customer account." });
    }
  });
export type InvitationCreateInput = z.input<typeof invitationCreateSchema>;

export const userUpdateSchema = z
  .object({
    role: roleSchema.optional(),
    accountId: z.number().int().positive().nullable().optional(),
    disabled: z.boolean().optional(),
    name: z.string().trim().min(1, "Enter a name.").max(120, "Use at most 120 characters.").optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: "Nothing to change.", path: ["_"] });
export type UserUpdateInput = z.input<typeof userUpdateSchema>;

export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  accountId: number | null;
  accountName: string | null;
  disabled: boolean;
  lastSignInAt: string | null;
  createdAt: string;
}

export interface InvitationDto {
  id: number;
  email: string;
  role: Role;
  accountId: number | null;
  accountName: string | null;
  expiresAt: string;
  /** The link ran out unused (listed for 30 days, so it can be sent again). */
  expired: boolean;
  createdAt: string;
}

/** GET /api/users?q= (owner). */
export const userListQuerySchema = z.object({ q: z.string().trim().max(100).optional() });
