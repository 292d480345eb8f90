import { z } from "zod";
import { idSchema } from "./common";
import { dateRangeCheck, dateSchema } from "./calendar";
import { PAYMENT_TERMS } from "../billing";

/**
 * The billing API's request schemas (server/billing/*.routes.ts parses with them; the forms can too). The answers
 * are the types in shared/contracts/billing.ts.
 */

export const INVOICE_STATUSES = ["open", "paid", "void", "partially_refunded", "refunded"] as const;
export const INVOICE_SORTS = ["newest", "oldest", "due", "amount", "account"] as const;
export type InvoiceSort = (typeof INVOICE_SORTS)[number];
/** The ways of paying the office records by hand (card payments arrive from the card processor). */
export const PAYMENT_METHODS = ["bank_transfer", "cheque", "cash", "other"] as const;
export type ManualPaymentMethod = (typeof PAYMENT_METHODS)[number];
export const EXPORT_FILES = ["invoices.csv", "payments.csv", "payouts.csv"] as const;
export type ExportFile = (typeof EXPORT_FILES)[number];

/** The id in a billing URL: the one id parameter schema (shared/schemas/common.ts). */
export { idParamSchema } from "./common";

const money = z.number({ error: (issue) => (issue.input === undefined ? undefined : "Enter an amount in cents.") }).int("Whole cents only.").positive("The amount must be more than 0.");

/** GET /api/invoices query */
export const invoiceListQuerySchema = z.object({
  status: z.enum(INVOICE_STATUSES).optional(),
  accountId: z.coerce.number().int().positive().optional(),
  from: dateSchema.optional(), to: dateSchema.optional(),
  overdue: z.enum(["1", "true"]).optional().transform((v) => !!v),
  q: z.string().trim().max(80).optional(),
  sort: z.enum(INVOICE_SORTS).optional(),
}).superRefine(dateRangeCheck({ from: "from", to: "to" }));
export type InvoiceListQuery = z.output<typeof invoiceListQuerySchema>;

/** POST /api/invoices/statements */
export const statementsSchema = z.object({ through: dateSchema.optional() });

/** POST /api/invoices/:id/payments */
export const manualPaymentSchema = z.object({
  amountCents: money,
  method: z.enum(PAYMENT_METHODS, { error: "Choose bank transfer, check, cash or other." }),
  reference: z.string().trim().min(1, "Enter the transfer reference or check number.").max(120),
  receivedOn: dateSchema,
});
export type PaymentInput = z.input<typeof manualPaymentSchema>;

/** POST /api/invoices/:id/credit-notes */
export const creditNoteSchema = z.object({
  reason: z.string().trim().min(1, "Say why (short delivery, damaged, …).").max(300),
  lines: z.array(z.object({ description: z.string().trim().min(1).max(200), quantity: z.number().int().positive("At least 1."), unitPriceCents: z.number().int().positive() })).min(1, "Add what is credited."),
  carry: z.boolean().optional(),
});
export type CreditNoteInput = z.input<typeof creditNoteSchema>;

/** POST /api/deliveries/:date/confirm */
/** The delivery date in the dispatch URL: the one date parameter schema (shared/schemas/calendar.ts). */
export { dateQuerySchema as dispatchDateSchema } from "./calendar";
/** A line that went out short: what was delivered of it, and why. */
export const dispatchAdjustmentSchema = z.object({
  orderId: z.number().int().positive(),
  productId: z.number().int().positive(),
  deliveredQuantity: z.number().int("Whole units.").min(0, "Cannot be negative."),
  reason: z.string().trim().max(200).optional(),
});
export type DispatchAdjustment = z.input<typeof dispatchAdjustmentSchema>;
export const dispatchConfirmSchema = z.object({ adjustments: z.array(dispatchAdjustmentSchema).max(500).default([]) });

/** /api/payouts/:id */
export const payoutIdSchema = z.object({ id: z.string().regex(/^po_[A-Za-z0-9_]+$/, "Not a payout id.") });
/** POST /api/payouts/:id/reconcile */
export const reconcileSchema = z.object({ note: z.string().trim().max(300).default(""), force: z.boolean().default(false) });
export type ReconcileInput = z.input<typeof reconcileSchema>;
/** POST /api/payouts/:id/undo-reconcile: why the reconciliation is taken back (kept in the payout's history). */
export const undoReconcileSchema = z.object({
  reason: z.string({ error: "Say why the reconciliation is undone." }).trim().min(3, "Say why the reconciliation is undone (at least 3 characters).").max(300, "The reason can be at most 300 characters."),
});

/** GET /api/reports/exports/:file */
export const exportFileSchema = z.object({
  file: z.enum(EXPORT_FILES, { error: "Exports: invoices.csv, payments.csv, payouts.csv." }),
});
/** ?from=&to= on an export: invoices by issue date, payments by the day received, payouts by arrival (both ends kept). */
export const exportRangeSchema = z
  .object({ from: dateSchema.optional(), to: dateSchema.optional() })
  .superRefine(dateRangeCheck({ from: "from", to: "to", reversed: "The end date is before the start date." }));
export type ExportRange = z.infer<typeof exportRangeSchema>;

/** PUT /api/settings/billing */
export const billingSettingsSchema = z.object({
  salesTaxRateBp: z.number().int("Use basis points: 875 for 8.75 %.").min(0).max(3000, "At most 30 %."),
  invoicePrefix: z.string().trim().regex(/^[A-Z]{1,6}$/, "1 to 6 capital letters, e.g. HB."),
  creditHoldDays: z.number().int().min(1, "At least 1 day.").max(180),
  paymentInstructions: z.string().trim().max(600).default(""),
});

/** PUT /api/settings/billing/reminders (owner or bookkeeper): the payment-reminder schedule on or off. */
export const remindersSwitchSchema = z.object({ on: z.boolean({ error: "Say on (true) or off (false)." }) });

/** PUT /api/accounts/:id/terms */
export const paymentTermsSchema = z.object({
  paymentTerms: z.enum(PAYMENT_TERMS, { error: "Choose card, net7, net14 or net30." }),
});

/** POST /api/accounts/:id/certificates (the multipart text field next to the file) */
export const certificateUploadSchema = z.object({ expiresOn: dateSchema });

/** POST /api/certificates/:id/review */
export const certificateReviewSchema = z.object({
  status: z.enum(["approved", "rejected"], { error: "Choose approved or rejected." }),
});
