import { z } from "zod";
import { parseMoney, toDecimal } from "../../../shared/money";
import { priceListInputSchema, type PriceListDto, type PriceListInput } from "../../../shared/schemas/catalog";

/** "10 % off list prices", "Own prices for 3 products". */
export function describePriceList(list: PriceListDto): string {
  if (list.kind === "percent") return `${list.percentOff} % off list prices`;
  return list.items.length === 1 ? "Own price for 1 product" : `Own prices for ${list.items.length} products`;
}

export const usedBy = (n: number) => (n === 0 ? "No accounts use it" : n === 1 ? "Used by 1 account" : `Used by ${n} accounts`);

/** The price list form's inputs: own prices as typed, by product id. */
export interface PriceListValues {
  name: string;
  kind: PriceListDto["kind"];
  percent: string;
  prices: Record<number, string>;
}

export function priceListValues(existing: PriceListDto | undefined): PriceListValues {
  return {
    name: existing?.name ?? "",
    kind: existing?.kind ?? "percent",
    percent: existing ? String(existing.percentOff) : "10",
    prices: Object.fromEntries((existing?.items ?? []).map((i) => [i.productId, toDecimal(i.priceCents)])),
  };
}

/** Errors beside the name, kind, percentage, the list of prices, and each product's price (`price.<id>`). */
export const isPriceListField = (name: string) => ["name", "kind", "percentOff", "items"].includes(name) || name.startsWith("price.");

/** What the schema reads: own prices only for a fixed list, only for the products shown, in their order. */
export function priceListFormInput(v: PriceListValues, productIds: number[]) {
  return {
    name: v.name,
    kind: v.kind,
    percentOff: v.kind === "percent" ? v.percent : 0,
    prices: v.kind === "fixed" ? productIds.map((productId) => ({ productId, text: (v.prices[productId] ?? "").trim() })) : [],
  };
}

type FormInput = ReturnType<typeof priceListFormInput>;

/**
 * The shared price-list schema over typed prices: each own price readable as dollars and cents (an empty one
 * keeps the list price), and a fixed list with at least one own price.
 */
export const priceListFormSchema: z.ZodType<PriceListInput, FormInput> = z
  .object({ name: z.string(), kind: z.custom<PriceListDto["kind"]>(), percentOff: z.union([z.string(), z.number()]), prices: z.array(z.object({ productId: z.number(), text: z.string() })) })
  .transform((v, ctx): PriceListInput => {
    const items: PriceListInput["items"] = [];
    let priceErrors = 0;
    for (const { productId, text } of v.prices) {
      if (!text) continue;
      const cents = parseMoney(text);
      if (cents === null) {
        priceErrors++;
        ctx.addIssue({ code: z.ZodIssueCode.custom, path: ["price", productId], message: "Write it in dollars and cents, like 16.50." });
      } else items.push({ productId, priceCents: cents });
    }
    const checked = priceListInputSchema.safeParse({ name: v.name, kind: v.kind, percentOff: v.percentOff, items });
    if (!checked.success) for (const issue of checked.error.issues) ctx.addIssue({ code: z.ZodIssueCode.custom, path: issue.path, message: issue.message });
    if (v.kind === "fixed" && items.length === 0 && !priceErrors) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ["items"], message: "Set a price for at least one product." });
    return checked.success && !priceErrors && (v.kind !== "fixed" || items.length > 0) ? (checked.data as PriceListInput) : z.NEVER;
  });
