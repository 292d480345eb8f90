/**
 * The fixed allergen list. It follows the US major food allergens (FALCPA 2004 and the FASTER Act 2021:
 * milk, egg, fish, crustacean shellfish, tree nuts, peanuts, wheat, soybeans, sesame) and the 14 groups
 * of EU Regulation 1169/2011 Annex II (cereals containing gluten, crustaceans, eggs, fish, peanuts,
 * soybeans, milk, nuts, celery, mustard, sesame, sulphur dioxide and sulphites, lupin, molluscs).
 * Where both lists name the same thing it is one entry; "wheat" (US) sits beside "gluten" (EU). Annex II point 1
 * names the cereals containing gluten: wheat, rye, barley, oats (and their hybridised strains), so an oat
 * ingredient carries "gluten".
 *
 * A product declares the union of its formula's, its components' and its own allergens (shared/components.ts).
 */
export const ALLERGENS = [
  { code: "gluten", label: "Cereals containing gluten", us: false, eu: true },
  { code: "wheat", label: "Wheat", us: true, eu: false },
  { code: "crustaceans", label: "Crustacean shellfish", us: true, eu: true },
  { code: "egg", label: "Egg", us: true, eu: true },
  { code: "fish", label: "Fish", us: true, eu: true },
  { code: "peanuts", label: "Peanuts", us: true, eu: true },
  { code: "soy", label: "Soybeans", us: true, eu: true },
  { code: "milk", label: "Milk", us: true, eu: true },
  { code: "tree_nuts", label: "Tree nuts", us: true, eu: true },
  { code: "celery", label: "Celery", us: false, eu: true },
  { code: "mustard", label: "Mustard", us: false, eu: true },
  { code: "sesame", label: "Sesame", us: true, eu: true },
  { code: "sulphites", label: "Sulfur dioxide and sulfites", us: false, eu: true },
  { code: "lupin", label: "Lupin", us: false, eu: true },
  { code: "molluscs", label: "Mollusks", us: false, eu: true },
] as const;

export type AllergenCode = (typeof ALLERGENS)[number]["code"];
export const ALLERGEN_CODES = ALLERGENS.map((a) => a.code) as unknown as readonly [AllergenCode, ...AllergenCode[]];
export const ALLERGEN_LABEL: Record<AllergenCode, string> = Object.fromEntries(ALLERGENS.map((a) => [a.code, a.label])) as Record<AllergenCode, string>;

export const ALLERGEN_CAUTION =
  "Allergens shown are a guide. The bakery's own declaration is what counts: anyone with a severe allergy should ask the bakery before ordering. Products are made in a kitchen that handles wheat, milk, egg, sesame and nuts.";

export function sortAllergens(codes: Iterable<string>): AllergenCode[] {
  const set = new Set(codes);
  return ALLERGENS.filter((a) => set.has(a.code)).map((a) => a.code);
}

const isCode = (s: string): s is AllergenCode => Object.prototype.hasOwnProperty.call(ALLERGEN_LABEL, s);

/**
 * One line for a product's allergens, as an e-mail or a sheet prints it: "Contains: Cereals containing gluten, Wheat,
 * Egg, Milk, Sesame. May contain: Tree nuts." ("may contain" is stored as codes, anything else kept as written).
 */
export function allergenStatement(codes: readonly AllergenCode[], mayContain = ""): string {
  const traces = mayContain.split(",").map((t) => t.trim()).filter(Boolean).map((t) => (isCode(t) ? ALLERGEN_LABEL[t] : t));
  const contains = codes.length ? `Contains: ${sortAllergens(codes).map((c) => ALLERGEN_LABEL[c]).join(", ")}.` : "Contains none of the listed allergens.";
  return traces.length ? `${contains} May contain: ${traces.join(", ")}.` : contains;
}
