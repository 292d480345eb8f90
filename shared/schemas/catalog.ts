import { z } from "zod";
import { isOneLine } from "./common";
import { ALLERGEN_CODES, type AllergenCode } from "../allergens";
import { COMPONENT_KINDS, COMPONENT_PER, componentName, type ComponentKind, type ComponentPer, type ResolvedBake } from "../components";

const intIn = (label: string, min: number, max: number) =>
  z.coerce
    .number({ error: (issue) => (issue.input === undefined ? undefined : `${label} must be a number.`) })
    .int(`${label} must be a whole number.`)
    .min(min, `${label} must be at least ${min}.`)
    .max(max, `${label} can be at most ${max}.`);

/**
 * Highest unit price, in cents (100,000.00). With at most 10,000 units a line (shared/schemas/orders.ts)
 * a line can still pass 2^31 − 1 cents; the order service refuses those with the limit named.
 */
export const MAX_PRICE_CENTS = 10_000_000;

/** One ingredient of a component, weighed per piece or per pan (0.1 g resolution, as the column stores it). */
export const componentInputSchema = z.object({
  kind: z.enum(COMPONENT_KINDS, { error: "Choose topping, wash, filling or garnish." }),
  name: z.string().trim().max(80, "Use at most 80 characters.").default(""),
  ingredientId: z.number({ error: "Choose the ingredient." }).int("Choose the ingredient.").positive("Choose the ingredient."),
  grams: z.coerce
    .number({ error: (issue) => (issue.input === undefined ? undefined : "Enter the grams, e.g. 2 or 1.5.") })
    .min(0.1, "Weigh at least 0.1 g.")
    .max(10000, "At most 10,000 g.")
    .refine((g) => Math.abs(g * 10 - Math.round(g * 10)) < 1e-6, "Use at most one decimal, e.g. 1.5 g."),
  per: z.enum(COMPONENT_PER, { error: "Choose per piece or per pan." }),
  note: z.string().trim().max(200, "Use at most 200 characters.").default(""),
});
export type ComponentInput = z.input<typeof componentInputSchema>;

export const productInputSchema = z
  .object({
    name: z.string({ error: (issue) => (issue.input === undefined ? "Enter the product's name." : undefined) }).trim().min(1, "Enter the product's name.").max(120, "Use at most 120 characters.").refine(isOneLine, "Keep the name on one line, without line breaks or control characters."),
    description: z.string().trim().max(1000, "Use at most 1000 characters.").default(""),
    saleUnit: z.string({ error: (issue) => (issue.input === undefined ? "Enter the sale unit, e.g. tray of 15 rolls." : undefined) }).trim().min(1, "Enter the sale unit, e.g. tray of 15 rolls.").max(60, "Use at most 60 characters.").refine(isOneLine, "Keep the sale unit on one line, without line breaks or control characters."),
    /** "trays of 15 rolls": how a count of more than one reads (shared/quantity.ts). */
    saleUnitPlural: z.string({ error: (issue) => (issue.input === undefined ? "Enter the plural of the sale unit, e.g. trays of 15 rolls." : undefined) }).trim().min(1, "Enter the plural of the sale unit, e.g. trays of 15 rolls.").max(60, "Use at most 60 characters.").refine(isOneLine, "Keep the plural on one line, without line breaks or control characters."),
    piecesPerUnit: intIn("Pieces per unit", 1, 500),
    pieceGrams: intIn("Piece weight", 1, 5000),
    panName: z.string().trim().min(1, "Name the pan, e.g. 9×13 in pan.").max(60, "Use at most 60 characters."),
    panLengthMm: intIn("Pan length", 10, 2000),
    panWidthMm: intIn("Pan width", 10, 2000),
    unitsPerPan: intIn("Units per pan", 1, 100),
    // Each message names its field as the product form labels it (components/screens/products/ProductFormScreen.tsx).
    priceCents: intIn("List price", 0, MAX_PRICE_CENTS),
    minQuantity: intIn("Minimum per order", 1, 10000).default(1),
    maxQuantity: intIn("Maximum per order", 1, 10000).default(100),
    leadDays: intIn("Days of notice", 0, 14).nullable().default(null),
    allergens: z.array(z.enum(ALLERGEN_CODES, { error: "Choose allergens from the list." })).max(20).default([]),
    mayContain: z.string().trim().max(300, "Use at most 300 characters.").default(""),
    active: z.boolean().default(true),
    formulaId: z.number().int().positive().nullable().optional(),
    /** The explicit "bought in / not planned" choice: no dough is planned for it. */
    boughtIn: z.boolean().default(false),
    /** The product's own bake and cooling; null = its formula's bake and cool steps. */
    bakeTempC: intIn("Bake temperature", 90, 300).nullable().default(null),
    bakeMinutes: intIn("Bake time", 1, 300).nullable().default(null),
    coolMinutes: intIn("Cooling time", 0, 24 * 60).nullable().default(null),
    /** When sent, replaces the product's components. */
    components: z.array(componentInputSchema).max(30, "At most 30 component lines.").optional(),
  })
  .superRefine((v, ctx) => {
    if (v.maxQuantity < v.minQuantity) ctx.addIssue({ code: "custom", path: ["maxQuantity"], message: "The maximum per order must be at least the minimum per order." });
    if (v.formulaId && v.boughtIn) ctx.addIssue({ code: "custom", path: ["boughtIn"], message: "A product is either baked from a formula or bought in, not both." });
    if (v.active && !v.formulaId && !v.boughtIn) {
      ctx.addIssue({ code: "custom", path: ["formulaId"], message: "Choose the formula it is baked from, or mark it bought in / not planned: otherwise buyers could order what production cannot plan." });
    }
    if (v.boughtIn) {
      if (v.components?.length) ctx.addIssue({ code: "custom", path: ["components"], message: "A bought-in product has no components to weigh out: remove them, or choose its formula." });
      for (const k of ["bakeTempC", "bakeMinutes", "coolMinutes"] as const) {
        if (v[k] !== null) ctx.addIssue({ code: "custom", path: [k], message: "A bought-in product is not baked here: leave the bake and cooling blank." });
      }
    }
    const seen = new Set<string>();
    v.components?.forEach((c, i) => {
      const key = `${c.kind}|${componentName(c)}|${c.ingredientId}`;
      if (seen.has(key)) ctx.addIssue({ code: "custom", path: ["components", i, "ingredientId"], message: "This ingredient is already in this component." });
      seen.add(key);
    });
  });
export type ProductInput = z.input<typeof productInputSchema>;

export interface ProductDto {
  id: number;
  name: string;
  description: string;
  /** The photo for product screens (640 px WebP). */
  photoUrl: string | null;
  /** The photo for list tiles (160 px WebP); the same as photoUrl for photos stored before sizes were made. */
  photoThumbUrl: string | null;
  saleUnit: string;
  /** "trays of 15 rolls" (shared/quantity.ts quantityText). */
  saleUnitPlural: string;
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
  /** The declaration: formula ∪ components ∪ the product's own additions (shared/components.ts declaredAllergens). */
  allergens: AllergenCode[];
  /** From the formula and the components: the product cannot take these off. */
  derivedAllergens: AllergenCode[];
  /** The product's own additions (for a bought-in product, its whole declaration). */
  addedAllergens: AllergenCode[];
  /** Where each declared allergen comes from, e.g. { sesame: ["Toasted sesame topping"] }. */
  allergenSources: Partial<Record<AllergenCode, string[]>>;
  mayContain: string;
  active: boolean;
  formulaId: number | null;
  formulaName: string | null;
  boughtIn: boolean;
  /** The product's own values (null = the formula's). */
  bakeTempC: number | null;
  bakeMinutes: number | null;
  coolMinutes: number | null;
  /** The formula's bake and cool steps (null without a formula). */
  formulaBake: ResolvedBake | null;
  /** What production uses: the product's own, else the formula's. */
  bake: ResolvedBake;
  /** Office users only (buyers get []: recipes stay in the bakery). */
  components: ComponentDto[];
}

export interface ComponentDto {
  kind: ComponentKind;
  /** As stored (may be blank: the kind's label is shown then). */
  name: string;
  ingredientId: number;
  ingredientName: string;
  grams: number;
  per: ComponentPer;
  note: string;
  allergens: AllergenCode[];
}

export const PRICE_LIST_KINDS = ["fixed", "percent"] as const;
export const priceListInputSchema = z
  .object({
    name: z.string().trim().min(1, "Name the price list.").max(80, "Use at most 80 characters."),
    kind: z.enum(PRICE_LIST_KINDS, { error: "Choose per-product prices or a percentage off." }),
    percentOff: z.coerce.number({ error: (issue) => (issue.input === undefined ? undefined : "Enter a percentage.") }).min(0, "At least 0 %.").max(90, "At most 90 %.").multipleOf(0.01, "Use at most two decimals.").default(0),
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
  /** The accounts on this list, by name. */
  accounts: { id: number; businessName: string }[];
}
