import { z } from "zod";
import { ALLERGEN_CODES, type AllergenCode } from "../allergens";

const intIn = (label: string, min: number, max: number) =>
  z.coerce
    .number({ invalid_type_error: `${label} must be a number.` })
    .int(`${label} must be a whole number.`)
    .min(min, `${label} must be at least ${min}.`)
    .max(max, `${label} can be at most ${max}.`);

/**
 * Highest unit price, in cents (100,000.00). With at most 10,000 units a line (shared/schemas/orders.ts)
 * a line can still pass 2^31 − 1 cents; the order service refuses those with the limit named.
 */
export const MAX_PRICE_CENTS = 10_000_000;

export const productInputSchema = z
  .object({
    name: z.string({ required_error: "Enter the product's name." }).trim().min(1, "Enter the product's name.").max(120, "Use at most 120 characters."),
    description: z.string().trim().max(1000, "Use at most 1000 characters.").default(""),
    saleUnit: z.string({ required_error: "Enter how it is sold, e.g. tray of 15 rolls." }).trim().min(1, "Enter how it is sold, e.g. tray of 15 rolls.").max(60, "Use at most 60 characters."),
    piecesPerUnit: intIn("Pieces per unit", 1, 500),
    pieceGrams: intIn("Piece weight", 1, 5000),
    panName: z.string().trim().min(1, "Name the pan, e.g. 9×13 in pan.").max(60, "Use at most 60 characters."),
    panLengthMm: intIn("Pan length", 10, 2000),
    panWidthMm: intIn("Pan width", 10, 2000),
    unitsPerPan: intIn("Units per pan", 1, 100),
    priceCents: intIn("Price", 0, MAX_PRICE_CENTS),
    minQuantity: intIn("Minimum quantity", 1, 10000).default(1),
    maxQuantity: intIn("Maximum quantity", 1, 10000).default(100),
    leadDays: intIn("Lead days", 0, 14).nullable().default(null),
    allergens: z.array(z.enum(ALLERGEN_CODES, { errorMap: () => ({ message: "Choose allergens from the list." }) })).max(20).default([]),
    mayContain: z.string().trim().max(300, "Use at most 300 characters.").default(""),
    active: z.boolean().default(true),
    formulaId: z.number().int().positive().nullable().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.maxQuantity < v.minQuantity) ctx.addIssue({ code: "custom", path: ["maxQuantity"], message: "The maximum must be at least the minimum." });
  });
export type ProductInput = z.input<typeof productInputSchema>;

export interface ProductDto {
  id: number;
  name: string;
  description: string;
  photoUrl: string | null;
  saleUnit: string;
  piecesPerUnit: number;
  pieceGrams: number;
  panName: string;
  panLengthMm: number;
  panWidthMm: number;
  unitsPerPan: number;
  /** The list price. */
  listPriceCents: number;
  /** The caller's own price (a buyer's price list applied); equals list price for office users. */
  priceCents: number;
  minQuantity: number;
  maxQuantity: number;
  leadDays: number | null;
  allergens: AllergenCode[];
  mayContain: string;
  active: boolean;
  formulaId: number | null;
}

export const PRICE_LIST_KINDS = ["fixed", "percent"] as const;
export const priceListInputSchema = z
  .object({
    name: z.string().trim().min(1, "Name the price list.").max(80, "Use at most 80 characters."),
    kind: z.enum(PRICE_LIST_KINDS, { errorMap: () => ({ message: "Choose per-product prices or a percentage off." }) }),
    percentOff: z.coerce.number({ invalid_type_error: "Enter a percentage." }).min(0, "At least 0 %.").max(90, "At most 90 %.").multipleOf(0.01, "Use at most two decimals.").default(0),
    items: z.array(z.object({ productId: z.number().int().positive(), priceCents: z.number().int("Prices are whole cents.").min(0, "Prices cannot be negative.").max(MAX_PRICE_CENTS, `Prices can be at most ${MAX_PRICE_CENTS} cents (100,000.00).`) })).default([]),
  })
  .superRefine((v, ctx) => {
    const seen = new Set<number>();
    v.items.forEach((it, i) => {
      if (seen.has(it.productId)) ctx.addIssue({ code: "custom", path: ["items", i, "productId"], message: "This product is listed twice." });
      seen.add(it.productId);
    });
  });
export type PriceListInput = z.input<typeof priceListInputSchema>;

export interface PriceListDto {
  id: number;
  name: string;
  kind: (typeof PRICE_LIST_KINDS)[number];
  percentOff: number;
  items: { productId: number; priceCents: number }[];
  accountCount: number;
}
