import { z } from "zod";
import { CONTROL, emailSchema } from "./common";

export const ACCOUNT_STATUSES = ["active", "on_hold", "closed"] as const;
export type AccountStatus = (typeof ACCOUNT_STATUSES)[number];
export const ACCOUNT_STATUS_LABELS: Record<AccountStatus, string> = {
  active: "Active",
  on_hold: "Paused",
  closed: "Closed",
};

/**
 * Two kinds of hold share the stored status `on_hold`: the owner pausing an account by hand ("Paused"),
 * and the automatic credit hold when an invoice is overdue (`creditHold`, lifted by paying it).
 * People always read which one it is.
 */
export const CREDIT_HOLD_LABEL = "Credit hold";
export function accountStatusLabel(a: { status: AccountStatus; creditHold?: boolean }): string {
  return a.status === "on_hold" && a.creditHold ? CREDIT_HOLD_LABEL : ACCOUNT_STATUS_LABELS[a.status];
}

/** The same, but line breaks (and tabs) are fine: for multi-line text such as an address. */
const CONTROL_BUT_LINES = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/;

const text = (label: string, max: number, opts: { required?: boolean; multiline?: boolean } = {}) => {
  let base = z.string({ error: (issue) => (issue.input === undefined ? undefined : `${label} must be text.`) }).trim().max(max, `${label} can be at most ${max} characters.`);
  if (opts.required) base = base.min(1, `Enter the ${label.toLowerCase()}.`);
  const checked = opts.multiline
    ? base
        .transform((v) => v.replace(/\r\n?|[\u2028\u2029]/g, "\n"))
        .refine((v) => !CONTROL_BUT_LINES.test(v), `${label} cannot contain control characters.`)
    : base.refine((v) => !CONTROL.test(v), `${label} must be one line, without line breaks or control characters.`);
  return opts.required ? checked : checked.default("");
};

export const accountInputSchema = z.object({
  businessName: text("Business name", 160, { required: true }),
  deliveryAddress: text("Delivery address", 500, { required: true, multiline: true }),
  contactName: text("Contact name", 120),
  contactPhone: z
    .string()
    .trim()
    .max(40, "Phone can be at most 40 characters.")
    .regex(/^[0-9+().\-\s]*$/, "Use digits, spaces and + ( ) - only.")
    .default(""),
  billingEmail: emailSchema,
  status: z.enum(ACCOUNT_STATUSES, { error: "Choose active, on hold or closed." }).default("active"),
  notes: text("Notes", 2000, { multiline: true }),
});
export type AccountInput = z.input<typeof accountInputSchema>;

export const accountUpdateSchema = accountInputSchema.partial();

/** GET /api/accounts?q=&status= (owner, bookkeeper). */
export const accountListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  status: z.enum(ACCOUNT_STATUSES).optional(),
});

export interface AccountDto {
  id: number;
  businessName: string;
  deliveryAddress: string;
  contactName: string;
  contactPhone: string;
  billingEmail: string;
  status: AccountStatus;
  notes: string;
  /** "card", "net7", "net14" or "net30" (shared/billing.ts). */
  paymentTerms: "card" | "net7" | "net14" | "net30";
  /** On hold because invoices are overdue (paying them lifts it). */
  creditHold: boolean;
  buyerCount: number;
  createdAt: string;
  updatedAt: string;
}

/** GET /api/accounts/:id/buyers (owner, bookkeeper): the account's sign-ins, by name. */
export interface AccountBuyerDto {
  id: number;
  name: string;
  email: string;
  /** Signed-in turned off by the owner. */
  disabled: boolean;
  lastSignInAt: string | null;
}
