import { stringify } from "csv-stringify/sync";
import { toDecimal } from "../../shared/money";
import type { ForecastDto } from "../../shared/contracts/production";

/** The purchasing forecast's header row (DEVELOPERS.md, "CSV exports": Title Case, dates ISO 8601). */
export function forecastCsvHeader(f: ForecastDto): string[] {
  return ["Ingredient", "Grams", "Pack", "Pack Grams", "Packs To Buy", "Currency", "Cost", ...f.days.map((d) => `Grams On ${d.date}`)];
}

/**
 * The purchasing forecast as CSV (RFC 4180 through csv-stringify, text cells formula-escaped — OWASP "CSV
 * Injection"): one row per ingredient with the whole period's grams, the packs to buy and their cost, then the
 * grams needed on each day. Grams are whole numbers; the cost is a plain decimal with its ISO 4217 code.
 */
export function forecastCsv(f: ForecastDto, currency: string): string {
  const rows = f.items.map((i) => [i.name, Math.round(i.grams), i.packName, i.packGrams, i.packs, currency, toDecimal(i.costCents, currency), ...f.days.map((d) => Math.round(i.byDay[d.date] ?? 0))]);
  const total = ["Total", "", "", "", "", currency, toDecimal(f.totalCostCents, currency), ...f.days.map((d) => Math.round(d.doughGrams))];
  return stringify([forecastCsvHeader(f), ...rows, total], { escape_formulas: true });
}
