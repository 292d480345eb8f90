import { z } from "zod";
import { ORDER_LIST_MAX_DAYS, dateRangeCheck, dateSchema } from "./calendar";
import type { AllergenCode } from "../allergens";
import type { Weekday } from "../calendar";
import { DEFAULT_LOCALE, formatNumber } from "../format";

export const ORDER_STATUSES = ["open", "locked", "delivered", "cancelled"] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];
export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  open: "Open",
  locked: "Locked for baking",
  delivered: "Delivered",
  cancelled: "Canceled",
};

/** Most units on one line: the same ceiling as a product's own maximum (shared/schemas/catalog.ts). */
export const MAX_LINE_QUANTITY = 10_000;
/**
 * Most cents one order line, or one order, may come to: the top of the signed INT columns that hold them
 * (MariaDB Knowledge Base, "INT": −2147483648 to 2147483647), i.e. 2^31 − 1.
 */
export const MAX_ORDER_CENTS = 2_147_483_647;

export const quantitySchema = z
  .number({ error: (issue) => (issue.input === undefined ? "Enter a quantity." : "The quantity must be a number.") })
  .int("Quantities are whole units.")
  .positive("The quantity must be at least 1.")
  .max(MAX_LINE_QUANTITY, `At most ${formatNumber(MAX_LINE_QUANTITY, DEFAULT_LOCALE)} units on one line.`);

const lineSchema = z.object({
  productId: z.number({ error: "Choose a product." }).int().positive("Choose a product."),
  quantity: quantitySchema,
});

const linesSchema = z
  .array(lineSchema, { error: (issue) => (issue.input === undefined ? "Add at least one product." : undefined) })
  .min(1, "Add at least one product.")
  .max(100, "At most 100 lines.")
  .superRefine((lines, ctx) => {
    const seen = new Set<number>();
    lines.forEach((l, i) => {
      if (seen.has(l.productId)) ctx.addIssue({ code: "custom", path: [i, "productId"], message: "This product is already on the order; change its quantity instead." });
      seen.add(l.productId);
    });
  });

const poSchema = z.string().trim().max(40, "Use at most 40 characters.").optional();
const noteSchema = z.string().trim().max(500, "Use at most 500 characters.").optional();

/** The owner's confirmation that an order is taken or changed past its cut-off, with the reason kept on the order. */
export const overrideReasonSchema = z
  .string({ error: "Say why the cut-off is set aside, as text." })
  .trim()
  .min(3, "Say why the cut-off is set aside (at least 3 characters), e.g. “Phoned at 3 pm; oven has room”.")
  .max(200, "The reason can be at most 200 characters.");
export const cutoffOverrideSchema = z.object({ confirm: z.literal(true, { error: "Confirm that the cut-off is set aside." }), reason: overrideReasonSchema });
export type CutoffOverrideInput = z.infer<typeof cutoffOverrideSchema>;

export const orderCreateSchema = z.object({
  deliveryDate: dateSchema,
  lines: linesSchema,
  poNumber: poSchema,
  note: noteSchema,
  accountId: z.number().int().positive().optional(),
  /** Owner only: take the order even though the date's cut-off has passed. */
  cutoffOverride: cutoffOverrideSchema.optional(),
});
export type OrderCreateInput = z.input<typeof orderCreateSchema>;

export const NOTHING_TO_CHANGE = "Nothing to change: send the lines, the PO number or the note.";
export const orderUpdateSchema = z
  .object({ lines: linesSchema.optional(), poNumber: poSchema, note: noteSchema, cutoffOverride: cutoffOverrideSchema.optional() })
  .refine((v) => v.lines !== undefined || v.poNumber !== undefined || v.note !== undefined, { message: NOTHING_TO_CHANGE });
export type OrderUpdateInput = z.input<typeof orderUpdateSchema>;

/** DELETE /api/orders/:id?overrideReason=…: the owner cancels past the cut-off. */
export const orderCancelQuerySchema = z.object({ overrideReason: overrideReasonSchema.optional() });

export const orderListQuerySchema = z
  .object({ from: dateSchema.optional(), to: dateSchema.optional(), accountId: z.coerce.number().int().positive().optional(), status: z.enum(ORDER_STATUSES).optional() })
  .superRefine(dateRangeCheck({ from: "from", to: "to", maxDays: ORDER_LIST_MAX_DAYS, what: "orders" }));

export interface OrderLineDto {
  productId: number;
  productName: string;
  saleUnit: string;
  /** As ordered, like the singular: "trays of 15 rolls". */
  saleUnitPlural: string;
  quantity: number;
  unitPriceCents: number;
  lineTotalCents: number;
  allergens: AllergenCode[];
  mayContain: string;
}

export interface OrderDto {
  id: number;
  accountId: number;
  accountName: string;
  deliveryDate: string;
  status: OrderStatus;
  poNumber: string | null;
  note: string | null;
  lines: OrderLineDto[];
  totalCents: number;
  /** Earliest cut-off among the date and the lines' products, ISO 8601 with the bakery's offset. */
  cutoffAt: string;
  source: "one_off" | "standing";
  editedByHand: boolean;
  /** The owner took or changed it past its cut-off: when and why (null for every other order). */
  cutoffOverride: { at: string; reason: string; byId: number | null } | null;
  createdAt: string;
  updatedAt: string;
}

/** Standing order: quantities per product per weekday. */
export const standingOrderSchema = z
  .object({
    accountId: z.number().int().positive().optional(),
    startDate: dateSchema,
    endDate: dateSchema.nullable().default(null),
    intervalWeeks: z.union([z.literal(1), z.literal(2)], { error: "Choose every week or every other week." }),
    skipDates: z.array(dateSchema).max(200).default([]),
    lines: z
      .array(z.object({ productId: z.number().int().positive(), weekday: z.number().int().min(1).max(7), quantity: z.number().int("Quantities are whole units.").min(0, "Quantities cannot be negative.").max(MAX_LINE_QUANTITY, `At most ${formatNumber(MAX_LINE_QUANTITY, DEFAULT_LOCALE)} units on one line.`) }))
      .max(500),
    active: z.boolean().default(true),
  })
  .superRefine((v, ctx) => {
    dateRangeCheck({ from: "startDate", to: "endDate", reversed: "The end date must be after the start date." })(v, ctx);
    const seen = new Set<string>();
    v.lines.forEach((l, i) => {
      const k = `${l.productId}:${l.weekday}`;
      if (seen.has(k)) ctx.addIssue({ code: "custom", path: ["lines", i], message: "This product and weekday appear twice." });
      seen.add(k);
    });
  });
export type StandingOrderInput = z.input<typeof standingOrderSchema>;

export interface StandingOrderDto {
  accountId: number;
  startDate: string;
  endDate: string | null;
  intervalWeeks: 1 | 2;
  skipDates: string[];
  lines: { productId: number; weekday: Weekday; quantity: number }[];
  active: boolean;
  /** The RFC 5545 recurrence rule it is stored as. */
  rrule: string;
  /** Upcoming dates it produces (within the horizon), with whether the buyer changed that order by hand. */
  upcoming: StandingUpcomingDate[];
}

/**
 * What becomes of one date of a standing order: "ordered" (its order exists: see status), "waiting" (made when
 * the bakery's next run reaches it), "closed" (the bakery is closed that day), "held" (not made while the account
 * is on hold; made if the hold ends before the cut-off), "paused" (the standing order is paused), "no_delivery"
 * (no delivery to this account that weekday), "missed" (past the cut-off with no order).
 */
export type StandingDatePlan = "ordered" | "waiting" | "closed" | "held" | "paused" | "no_delivery" | "missed";

export interface StandingUpcomingDate {
  date: string;
  orderId: number | null;
  editedByHand: boolean;
  status: string | null;
  plan: StandingDatePlan;
  /** The plan in the buyer's words ("Bakery closed: Thanksgiving"). */
  planText: string;
  /** Whether skipping this date changes anything (false for closed, missed, delivered dates). */
  skippable: boolean;
}
