import { productsText } from "../../shared/quantity";
/** Quantity steps and checks for one product line (0 = not ordering it). */
import { quantityText } from "../../shared/quantity";

export interface QuantityRule {
  minQuantity: number;
  maxQuantity: number;
  saleUnit: string;
  saleUnitPlural?: string;
}

/** "+": from nothing straight to the product's minimum, then one at a time up to its maximum. */
export function stepUp(quantity: number, rule: Pick<QuantityRule, "minQuantity" | "maxQuantity">): number {
  const q = Number.isFinite(quantity) && quantity > 0 ? Math.floor(quantity) : 0;
  if (q < rule.minQuantity) return Math.min(rule.minQuantity, rule.maxQuantity);
  return Math.min(q + 1, rule.maxQuantity);
}

/** "−": one at a time down to the minimum, then to nothing. */
export function stepDown(quantity: number, rule: Pick<QuantityRule, "minQuantity" | "maxQuantity">): number {
  const q = Number.isFinite(quantity) && quantity > 0 ? Math.floor(quantity) : 0;
  if (q > rule.maxQuantity) return rule.maxQuantity;
  if (q <= rule.minQuantity) return 0;
  return q - 1;
}

/** What a typed quantity means: blank is 0; anything but whole digits is NaN. */
export function parseQuantity(text: string): number {
  const t = text.trim();
  if (t === "") return 0;
  if (!/^\d+$/.test(t)) return Number.NaN;
  return Number(t);
}

/** Why a quantity can't be ordered, in the server's own wording; null when it is fine. */
export function quantityProblem(quantity: number, rule: QuantityRule): string | null {
  if (Number.isNaN(quantity)) return "Enter a whole number.";
  if (quantity === 0) return null;
  if (quantity > rule.maxQuantity) return `At most ${quantityText(rule.maxQuantity, rule)} per order.`;
  if (quantity < rule.minQuantity) return `At least ${quantityText(rule.minQuantity, rule)} per order.`;
  return null;
}

/** "add $12.00 more to reach the $50.00 minimum" logic: the shortfall in cents (0 when met or nothing chosen). */
export function shortfall(totalCents: number, minimumCents: number): number {
  if (minimumCents <= 0 || totalCents <= 0) return 0;
  return Math.max(0, minimumCents - totalCents);
}

/** How many products an order (or a board) has: its quantities are trays, dozens and loaves, which never add up. */
export function productsLabel(n: number): string {
  return productsText(n);
}

/** "3 orders" / "1 order". */
export const ordersLabel = (n: number) => (n === 1 ? "1 order" : `${n} orders`);
