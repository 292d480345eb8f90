import { formatCount } from "./units";
/**
 * A line's quantity is counted in its product's sale unit: "1 loaf", "3 trays of 15 rolls", "2 dozen buns".
 * Every product stores the singular (`saleUnit`) and the plural (`saleUnitPlural`) its owner chose; order lines keep
 * both as ordered. `suggestPlural` only proposes a plural for the product form and fills older rows.
 * ("units" stays the word of the office's production views: those count pieces and pans, not sale units.)
 */

/** "1 product", "3 products": how many products an order has (their quantities, in unlike units, never add up). */
export function productsText(n: number): string {
  return formatCount(n, "product", "products");
}

export interface SaleUnitWords {
  saleUnit: string;
  /** Blank on rows written before plurals were stored (raw inserts): the suggestion is used then. */
  saleUnitPlural?: string | null;
}

/** The sale unit for n of them: the singular for exactly 1, else the plural. */
export function saleUnitFor(n: number, unit: SaleUnitWords): string {
  if (n === 1) return unit.saleUnit;
  const plural = unit.saleUnitPlural?.trim();
  return plural ? plural : suggestPlural(unit.saleUnit);
}

/**
 * "3 trays of 15 rolls", "1 loaf", "0 loaves". `formatNumber` writes the count (the bakery's locale where the caller
 * has one); by default the plain digits.
 */
export function quantityText(n: number, unit: SaleUnitWords, formatNumber: (n: number) => string = String): string {
  return `${formatNumber(n)} ${saleUnitFor(n, unit)}`;
}

/**
 * Words that take no plural -s after a number or are already counts: "2 dozen buns", "3 each", "5 lb"
 * (common English usage: after a number "dozen" stays singular, Merriam-Webster, "dozen").
 */
const INVARIANT = new Set(["dozen", "each", "kg", "g", "lb", "lbs", "oz", "sheep", "deer", "fish", "series", "species"]);
/** Irregular plurals met in a bakery (f/fe → ves and the like; Merriam-Webster). */
const IRREGULAR: Record<string, string> = {
  loaf: "loaves", half: "halves", leaf: "leaves", shelf: "shelves", knife: "knives", life: "lives", calf: "calves", wolf: "wolves",
  man: "men", woman: "women", child: "children", person: "people", foot: "feet", tooth: "teeth", mouse: "mice", goose: "geese",
  tomato: "tomatoes", potato: "potatoes", hero: "heroes",
};

/**
 * One English noun's plural by the common English rules (as The Chicago Manual of Style, "Plurals", gives them): irregulars from a list;
 * -s, -x, -z, -ch, -sh add -es; consonant + y → -ies; otherwise add -s. The word's capitals are kept.
 */
export function pluralWord(word: string): string {
  const lower = word.toLowerCase();
  if (!/[a-z]/.test(lower) || INVARIANT.has(lower)) return word;
  const irregular = IRREGULAR[lower];
  if (irregular) return matchCase(word, irregular);
  let plural: string; // the suffix stays lower case: "POs"
  if (/(s|x|z|ch|sh)$/.test(lower)) plural = `${word}es`;
  else if (/[^aeiou]y$/.test(lower)) plural = `${word.slice(0, -1)}ies`;
  else plural = `${word}s`;
  return plural;
}

function matchCase(original: string, plural: string): string {
  if (original === original.toUpperCase()) return plural.toUpperCase();
  if (original[0] === original[0].toUpperCase()) return plural[0].toUpperCase() + plural.slice(1);
  return plural;
}

/**
 * A plural to propose for a sale unit: the head noun changes, what follows stays.
 * "tray of 15 rolls" → "trays of 15 rolls", "pack of 8 buns" → "packs of 8 buns", "loaf" → "loaves",
 * "box" → "boxes", "dozen buns" → "dozen buns", "bag" → "bags", "sandwich loaf" → "sandwich loaves".
 */
export function suggestPlural(singular: string): string {
  const text = singular.trim();
  if (!text) return text;
  const words = text.split(/\s+/);
  // "tray of 15 rolls": the head is the word before the first "of"; "dozen buns": a count word leads, nothing changes.
  const of = words.findIndex((w, i) => i > 0 && w.toLowerCase() === "of");
  if (of > 0) {
    words[of - 1] = pluralWord(words[of - 1]);
    return words.join(" ");
  }
  if (words.some((w) => INVARIANT.has(w.toLowerCase()))) return words.join(" ");
  const last = words.length - 1;
  // A multi-word unit already ending in a plural ("half buns") stays; a single "-s" noun ("glass") still gets -es.
  if (last > 0 && /[^s]s$/i.test(words[last])) return words.join(" ");
  words[last] = pluralWord(words[last]);
  return words.join(" ");
}
