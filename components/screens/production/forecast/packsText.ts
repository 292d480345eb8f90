import type { ForecastDto } from "../../../api/production";

type Item = ForecastDto["items"][number];

/** "2 × 25 kg sack", or why nothing is bought. */
export function packsText(i: Pick<Item, "packs" | "packName" | "packGrams">): string {
  if (i.packGrams <= 0) return "Not bought";
  return `${i.packs} × ${i.packName}`;
}
