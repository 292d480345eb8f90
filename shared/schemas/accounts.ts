import { z } from "zod";
import { emailSchema } from "./common";

export const ACCOUNT_STATUSES = ["active", "on_hold", "closed"] as const;
export type AccountStatus = (typeof ACCOUNT_STATUSES)[number];
export const ACCOUNT_STATUS_LABELS: Record<AccountStatus, string> = {
  active: "Active",
  on_hold: "On hold",
  closed: "Closed",
};

const text = (label: string, max: number, required = false) => {
  const base = z.string({ invalid_type_error: `${label} must be text.` }).trim().max(max, `${label} can be at most ${max} characters.`);
  return required ? base.min(1, `Enter the ${label.toLowerCase()}.`) : base.default("");
};

export const accountInputSchema = z.object({
  businessName: text("Business name", 160, true),
  deliveryAddress: text("Delivery address", 500, true),
  contactName: text("Contact name", 120),
  contactPhone: z
    .string()
    .trim()
    .max(40, "Phone can be at most 40 characters.")
    .regex(/^[0-9+().\-\s]*$/, "Use digits, spaces and + ( ) - only.")
    .default(""),
  billingEmail: emailSchema,
  status: z.enum(ACCOUNT_STATUSES, { errorMap: () => ({ message: "Choose active, on hold or closed." }) }).default("active"),
  notes: text("Notes", 2000),
});
export type AccountInput = z.input<typeof accountInputSchema>;

export const accountUpdateSchema = accountInputSchema.partial();

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
