import type { OrderDto } from "../../../shared/schemas/orders";
import type { ProductDto } from "../../../shared/schemas/catalog";

/** Typed quantities by product id ("" = none). */
export type Quantities = Record<number, string>;

/** The quantities an existing order starts the form with (nothing for a new one). */
export function quantitiesOf(order: OrderDto | null): Quantities {
  const q: Quantities = {};
  for (const l of order?.lines ?? []) q[l.productId] = String(l.quantity);
  return q;
}

/** The lines to send: whole positive quantities only, in the catalog's order; `bad` names the products typed wrong. */
export function phoneLines(products: ProductDto[], q: Quantities): { lines: { productId: number; quantity: number }[]; bad: string[] } {
  const lines: { productId: number; quantity: number }[] = [];
  const bad: string[] = [];
  for (const p of products) {
    const text = (q[p.id] ?? "").trim();
    if (!text || text === "0") continue;
    if (!/^\d{1,4}$/.test(text)) bad.push(p.name);
    else lines.push({ productId: p.id, quantity: Number(text) });
  }
  return { lines, bad };
}

/** The list-price total of the typed lines (the account's own prices are applied when the order is saved). */
export function listTotalCents(products: ProductDto[], lines: { productId: number; quantity: number }[]): number {
  return lines.reduce((s, l) => s + (products.find((p) => p.id === l.productId)?.priceCents ?? 0) * l.quantity, 0);
}
