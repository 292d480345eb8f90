import { celsiusToFahrenheit } from "../../../../shared/units";
import type { ProductDto } from "../../../../shared/schemas/catalog";

/** "180 °C (356 °F)" */
export const withF = (c: number) => `${c} °C (${Math.round(celsiusToFahrenheit(c))} °F)`;

/** The names of the products made from a formula; a count while the products are loading. */
export function productNames(ids: number[], products: ProductDto[] | undefined): string {
  if (!products) return ids.length ? `${ids.length} products` : "None yet";
  const names = ids.map((id) => products.find((p) => p.id === id)?.name).filter(Boolean);
  return names.length ? names.join(", ") : "None yet";
}
