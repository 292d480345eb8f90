/**
 * Product components: what goes on, in or over a product besides its dough — toppings, washes, fillings,
 * garnishes — each a few ingredients weighed per piece or per pan. Pure functions, used by the server's plan
 * and by the product form.
 *
 * A product is its formula's dough at a piece weight plus these components. The bake and cooling times belong to the
 * product (a 45 g bun and a 900 g lidded loaf of one dough do not bake alike); a product that sets none takes its
 * formula's bake and cool steps.
 */
import { ALLERGEN_LABEL, sortAllergens, type AllergenCode } from "./allergens";
import { roundGrams, type StepSpec } from "./production";

export const COMPONENT_KINDS = ["topping", "wash", "filling", "garnish"] as const;
export type ComponentKind = (typeof COMPONENT_KINDS)[number];
export const COMPONENT_KIND_LABEL: Record<ComponentKind, string> = { topping: "Topping", wash: "Wash", filling: "Filling", garnish: "Garnish" };

export const COMPONENT_PER = ["piece", "pan"] as const;
export type ComponentPer = (typeof COMPONENT_PER)[number];

/** One stored row: one ingredient of one component. Rows with the same kind and name make one component. */
export interface ComponentLine {
  kind: ComponentKind;
  /** The component's name, e.g. "Egg wash"; blank means the kind's label. */
  name: string;
  ingredientId: number;
  /** Grams of this ingredient on one piece, or in one pan. */
  grams: number;
  per: ComponentPer;
  note: string;
}

export const componentName = (c: Pick<ComponentLine, "kind" | "name">) => c.name.trim() || COMPONENT_KIND_LABEL[c.kind];

/** Group rows into components, in the order they were first listed. */
export function groupComponents<T extends Pick<ComponentLine, "kind" | "name">>(lines: T[]): { kind: ComponentKind; name: string; lines: T[] }[] {
  const out: { kind: ComponentKind; name: string; lines: T[] }[] = [];
  for (const l of lines) {
    const name = componentName(l);
    const found = out.find((g) => g.kind === l.kind && g.name === name);
    if (found) found.lines.push(l);
    else out.push({ kind: l.kind, name, lines: [l] });
  }
  return out;
}

// ---- allergens ------------------------------------------------------------------------------------

export interface AllergenParts {
  /** The formula's ingredients' allergens (empty without a formula). */
  formula: readonly string[];
  /** Each component's ingredients' allergens. */
  components: { name: string; allergens: readonly string[] }[];
  /** What the product itself adds (for a bought-in product: its whole declaration). */
  added: readonly string[];
  /** The formula's name, for the sources. */
  formulaName?: string | null;
}

export interface DeclaredAllergens {
  /** What the product declares: formula ∪ components ∪ added. Never fewer than `derived`. */
  declared: AllergenCode[];
  /** What comes from the formula and the components, which the product cannot take away. */
  derived: AllergenCode[];
  /** The product's own additions beyond what is derived. */
  added: AllergenCode[];
  /** Where each declared allergen comes from ("Brioche dough", "Toasted sesame topping", "Added by the bakery"). */
  sources: Partial<Record<AllergenCode, string[]>>;
}

export const ADDED_BY_BAKERY = "Added by the bakery";

/**
 * The declaration is the union (never a replacement): US FALCPA (as amended by the FASTER Act of 2021) and EU
 * Regulation 1169/2011 Art. 9(1)(c) with Annex II both require every major allergen used as an ingredient to be
 * declared, and a topping or wash is an ingredient of the food as sold.
 */
export function declaredAllergens(parts: AllergenParts): DeclaredAllergens {
  const derived = sortAllergens([...parts.formula, ...parts.components.flatMap((c) => c.allergens)]);
  const declared = sortAllergens([...derived, ...parts.added]);
  const added = declared.filter((a) => !derived.includes(a));
  const sources: Partial<Record<AllergenCode, string[]>> = {};
  const note = (code: string, from: string) => {
    const c = code as AllergenCode;
    if (!declared.includes(c)) return;
    const list = (sources[c] ??= []);
    if (!list.includes(from)) list.push(from);
  };
  for (const a of parts.formula) note(a, parts.formulaName ? `${parts.formulaName} dough` : "The dough");
  for (const c of parts.components) for (const a of c.allergens) note(a, c.name);
  for (const a of added) note(a, ADDED_BY_BAKERY);
  return { declared, derived, added, sources };
}

/**
 * The derived allergens a requested declaration leaves out, with a message naming each and where it comes from;
 * null when nothing derived is missing. A product may add allergens but never remove a derived one.
 */
export function missingDerived(requested: readonly string[], d: Pick<DeclaredAllergens, "derived" | "sources">): { missing: AllergenCode[]; message: string } | null {
  const missing = d.derived.filter((a) => !requested.includes(a));
  if (!missing.length) return null;
  const parts = missing.map((a) => `${ALLERGEN_LABEL[a]} (from ${(d.sources[a] ?? ["the formula"]).filter((s) => s !== ADDED_BY_BAKERY).join(", ")})`);
  return {
    missing,
    message: `${parts.join("; ")} cannot be taken off: ${missing.length === 1 ? "it comes" : "they come"} from the product's ingredients. Change the formula or the component instead.`,
  };
}

// ---- bake and cool --------------------------------------------------------------------------------

export interface BakeOverrides {
  bakeTempC: number | null;
  bakeMinutes: number | null;
  coolMinutes: number | null;
}

export interface ResolvedBake {
  /** Oven temperature, °C (null when neither the product nor its formula's bake step sets one). */
  bakeTempC: number | null;
  /** Minutes in the oven (null when neither sets them). */
  bakeMinutes: number | null;
  /** Minutes cooling after the bake (null when neither sets them). */
  coolMinutes: number | null;
}

/** The formula's defaults: its bake step's minutes and temperature, its cool step's minutes. */
export function formulaBake(steps: readonly StepSpec[] | null | undefined): ResolvedBake {
  const bake = steps?.find((s) => s.kind === "bake");
  const cool = steps?.find((s) => s.kind === "cool");
  return { bakeTempC: bake?.temperatureC ?? null, bakeMinutes: bake ? bake.minutes : null, coolMinutes: cool ? cool.minutes : null };
}

/** Each value is the product's own, or else the formula's (null = the formula's default). */
export function resolveBake(product: BakeOverrides, steps: readonly StepSpec[] | null | undefined): ResolvedBake {
  const f = formulaBake(steps);
  return {
    bakeTempC: product.bakeTempC ?? f.bakeTempC,
    bakeMinutes: product.bakeMinutes ?? f.bakeMinutes,
    coolMinutes: product.coolMinutes ?? f.coolMinutes,
  };
}

// ---- the day's weigh-out ----------------------------------------------------------------------------

export interface ComponentCard {
  /** "<productId>:<kind>:<name>" */
  key: string;
  productId: number;
  productName: string;
  kind: ComponentKind;
  name: string;
  lines: { ingredientId: number; name: string; per: ComponentPer; count: number; gramsEach: number; grams: number; note: string }[];
  totalGrams: number;
}

/**
 * One card per component per product for the day: grams = pieces (or pans) × grams each, weighed as given
 * (no loss allowance is added: set the grams each to what is actually weighed out).
 */
export function componentCards(
  products: { productId: number; name: string; pieces: number; pans: number }[],
  lines: (ComponentLine & { productId: number })[],
  ingredientName: (id: number) => string,
): ComponentCard[] {
  const cards: ComponentCard[] = [];
  for (const p of products) {
    if (p.pieces <= 0 && p.pans <= 0) continue;
    for (const g of groupComponents(lines.filter((l) => l.productId === p.productId))) {
      const rows = g.lines.map((l) => {
        const count = l.per === "piece" ? p.pieces : p.pans;
        return { ingredientId: l.ingredientId, name: ingredientName(l.ingredientId), per: l.per, count, gramsEach: l.grams, grams: roundGrams(count * l.grams), note: l.note };
      });
      cards.push({ key: `${p.productId}:${g.kind}:${g.name}`, productId: p.productId, productName: p.name, kind: g.kind, name: g.name, lines: rows, totalGrams: roundGrams(rows.reduce((s, r) => s + r.grams, 0)) });
    }
  }
  return cards;
}

/** Grams per ingredient over the day's component cards (for the day's totals and the purchasing forecast). */
export function componentTotals(cards: ComponentCard[]): Map<number, number> {
  const out = new Map<number, number>();
  for (const c of cards) for (const l of c.lines) out.set(l.ingredientId, (out.get(l.ingredientId) ?? 0) + l.grams);
  return out;
}
