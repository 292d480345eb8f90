import { ADDED_BY_BAKERY, declaredAllergens, groupComponents, type ComponentKind, type ComponentPer, type DeclaredAllergens } from "../../../shared/components";
import { sortAllergens, type AllergenCode } from "../../../shared/allergens";
import { parseMoney, toDecimal } from "../../../shared/money";
import { productInputSchema, type ProductDto, type ProductInput } from "../../../shared/schemas/catalog";
import type { FormulaDto, IngredientDto } from "../../../shared/schemas/production";
import { fieldErrorsFrom } from "../../../shared/schemas/common";
import type { FieldErrors } from "../../../shared/errors";
import { suggestPlural } from "../../../shared/quantity";
import { mayContainParts, mayContainText } from "../../ordering/allergens";
import { rowFields, type CheckResult } from "../../forms/checkedSchema";

/**
 * The product form's values and what is worked out from them, without React: the values from a product, the
 * declaration a buyer will see, the hints from the chosen formula, and the check that makes the API's body.
 */

/** "How it's made": baked here from a formula, or bought in / not planned. */
export type Making = "formula" | "bought_in";

/** One component line as the form holds it (grams as typed). */
export interface ComponentRow {
  key: string;
  kind: ComponentKind;
  name: string;
  ingredientId: number | null;
  grams: string;
  per: ComponentPer;
  note: string;
}

let seq = 0;
export const newComponentRow = (over: Partial<ComponentRow> = {}): ComponentRow => ({ key: `component-${++seq}`, kind: "topping", name: "", ingredientId: null, grams: "", per: "piece", note: "", ...over });

/** A new line carries on the last one's kind, name and per (the next ingredient of the same egg wash). */
export function nextComponentRow(rows: readonly ComponentRow[]): ComponentRow {
  const last = rows[rows.length - 1];
  return newComponentRow(last ? { kind: last.kind, name: last.name, per: last.per } : {});
}

export interface ProductValues {
  name: string;
  description: string;
  saleUnit: string;
  /** Pre-filled from the singular (shared/quantity.ts suggestPlural) until the owner writes their own. */
  saleUnitPlural: string;
  piecesPerUnit: string;
  pieceGrams: string;
  panName: string;
  panLengthMm: string;
  panWidthMm: string;
  unitsPerPan: string;
  /** Dollars as typed, "18.00". */
  price: string;
  minQuantity: string;
  maxQuantity: string;
  /** Blank: the bakery's usual cut-off. */
  leadDays: string;
  /** Null until the owner chooses: a new product on offer needs the choice. */
  making: Making | null;
  formulaId: number | null;
  /** Blank: the formula's bake step and cool step. */
  bakeTempC: string;
  bakeMinutes: string;
  coolMinutes: string;
  components: ComponentRow[];
  /** The product's own allergens, added to what the formula and components bring (for a bought-in product: all of them). */
  allergens: AllergenCode[];
  mayContain: AllergenCode[];
  /** Anything in "may contain" that isn't an allergen code, kept as it was. */
  mayContainOther: string[];
}

/** The values typed as whole numbers. */
export type NumberKey = "piecesPerUnit" | "pieceGrams" | "panLengthMm" | "panWidthMm" | "unitsPerPan" | "minQuantity" | "maxQuantity" | "leadDays" | "bakeTempC" | "bakeMinutes" | "coolMinutes";

const FIELDS = ["name", "description", "saleUnit", "saleUnitPlural", "piecesPerUnit", "pieceGrams", "panName", "panLengthMm", "panWidthMm", "unitsPerPan", "priceCents", "minQuantity", "maxQuantity", "leadDays", "allergens", "mayContain", "formulaId", "boughtIn", "bakeTempC", "bakeMinutes", "coolMinutes", "components"] as const;
const COMPONENT_FIELDS = ["kind", "name", "ingredientId", "grams", "per", "note"] as const;
/** Every field the form shows a message beside, the component rows' included (up to the schema's 30). */
export const PRODUCT_FIELDS: readonly string[] = [...FIELDS, ...rowFields("components", 30, COMPONENT_FIELDS)];

export const EMPTY_PRODUCT: ProductValues = {
  name: "",
  description: "",
  saleUnit: "",
  saleUnitPlural: "",
  piecesPerUnit: "",
  pieceGrams: "",
  panName: "",
  panLengthMm: "",
  panWidthMm: "",
  unitsPerPan: "1",
  price: "",
  minQuantity: "1",
  maxQuantity: "100",
  leadDays: "",
  making: null,
  formulaId: null,
  bakeTempC: "",
  bakeMinutes: "",
  coolMinutes: "",
  components: [],
  allergens: [],
  mayContain: [],
  mayContainOther: [],
};

const text = (n: number | null) => (n === null ? "" : String(n));

export function valuesOf(p: ProductDto, currency = "USD"): ProductValues {
  const traces = mayContainParts(p.mayContain);
  return {
    name: p.name,
    description: p.description,
    saleUnit: p.saleUnit,
    saleUnitPlural: p.saleUnitPlural,
    piecesPerUnit: String(p.piecesPerUnit),
    pieceGrams: String(p.pieceGrams),
    panName: p.panName,
    panLengthMm: String(p.panLengthMm),
    panWidthMm: String(p.panWidthMm),
    unitsPerPan: String(p.unitsPerPan),
    price: toDecimal(p.listPriceCents, currency),
    minQuantity: String(p.minQuantity),
    maxQuantity: String(p.maxQuantity),
    leadDays: p.leadDays === null ? "" : String(p.leadDays),
    making: p.formulaId !== null ? "formula" : p.boughtIn ? "bought_in" : null,
    formulaId: p.formulaId,
    bakeTempC: text(p.bakeTempC),
    bakeMinutes: text(p.bakeMinutes),
    coolMinutes: text(p.coolMinutes),
    components: p.components.map((c) => newComponentRow({ kind: c.kind, name: c.name, ingredientId: c.ingredientId, grams: String(c.grams), per: c.per, note: c.note })),
    allergens: p.addedAllergens,
    mayContain: traces.codes,
    mayContainOther: traces.other,
  };
}

/** The plural follows the singular while it is blank or still the suggestion; once the owner writes their own it stays. */
export function withSaleUnit(v: Pick<ProductValues, "saleUnit" | "saleUnitPlural">, saleUnit: string): Pick<ProductValues, "saleUnit" | "saleUnitPlural"> {
  const following = v.saleUnitPlural.trim() === "" || v.saleUnitPlural === suggestPlural(v.saleUnit);
  return { saleUnit, saleUnitPlural: following ? suggestPlural(saleUnit) : v.saleUnitPlural };
}

/** The formula chosen, while "baked here from a formula" is. */
export function chosenFormula(values: Pick<ProductValues, "making" | "formulaId">, formulas: readonly FormulaDto[]): FormulaDto | undefined {
  return values.making === "formula" ? formulas.find((f) => f.id === values.formulaId) : undefined;
}

/**
 * What the product declares as the form stands: the chosen formula's allergens and the components' ingredients'
 * (which the owner cannot take off), plus the product's own additions — the same union the server computes
 * (shared/components.ts declaredAllergens).
 */
export function previewAllergens(values: ProductValues, formulas: readonly FormulaDto[], ingredients: readonly IngredientDto[]): DeclaredAllergens {
  const formula = chosenFormula(values, formulas);
  const byId = new Map(ingredients.map((i) => [i.id, i]));
  const rows = values.making === "bought_in" ? [] : values.components;
  return declaredAllergens({
    formulaName: formula?.name ?? null,
    formula: formula?.allergens ?? [],
    components: groupComponents(rows).map((g) => ({ name: g.name, allergens: g.lines.flatMap((l) => (l.ingredientId !== null ? byId.get(l.ingredientId)?.allergens ?? [] : [])) })),
    added: values.allergens,
  });
}

/** "Whole egg, Egg wash": where a derived allergen comes from, the bakery's own addition left out. */
export const derivedSources = (declared: DeclaredAllergens, code: AllergenCode) => (declared.sources[code] ?? []).filter((x) => x !== ADDED_BY_BAKERY).join(", ");

/** Hints for the blank bake fields: what the chosen formula's steps give. */
export function formulaDefaults(formula: FormulaDto | undefined): { temp: string; bake: string; cool: string } {
  if (!formula) return { temp: "Blank: the formula's.", bake: "Blank: the formula's.", cool: "Blank: the formula's." };
  const bake = formula.steps.find((s) => s.kind === "bake");
  const cool = formula.steps.find((s) => s.kind === "cool");
  return {
    temp: bake?.temperatureC != null ? `Blank: the formula's ${bake.temperatureC} °C.` : "The formula sets none.",
    bake: bake ? `Blank: the formula's ${bake.minutes} min.` : "The formula has no bake step.",
    cool: cool ? `Blank: the formula's ${cool.minutes} min.` : "The formula has no cool step.",
  };
}

const blankToNull = (s: string) => (s.trim() === "" ? null : s.trim());

/**
 * Check the form with the shared productInputSchema; the price is typed in dollars and read with
 * parseMoney. The allergens sent are the whole declaration: `derived` (from the formula and components) plus the
 * product's own. Returns the API body, or the messages per field.
 */
export function checkProduct(values: ProductValues, currency = "USD", opts: { derived?: readonly AllergenCode[]; active?: boolean } = {}): CheckResult<ProductInput> {
  const priceCents = parseMoney(values.price, currency);
  const made = values.making === "formula";
  const candidate = {
    name: values.name,
    description: values.description,
    saleUnit: values.saleUnit,
    saleUnitPlural: values.saleUnitPlural,
    piecesPerUnit: values.piecesPerUnit,
    pieceGrams: values.pieceGrams,
    panName: values.panName,
    panLengthMm: values.panLengthMm,
    panWidthMm: values.panWidthMm,
    unitsPerPan: values.unitsPerPan,
    priceCents: priceCents ?? 0,
    minQuantity: values.minQuantity,
    maxQuantity: values.maxQuantity,
    leadDays: values.leadDays.trim() === "" ? null : values.leadDays,
    allergens: sortAllergens([...(opts.derived ?? []), ...values.allergens]),
    mayContain: mayContainText(values.mayContain, values.mayContainOther),
    active: opts.active ?? true,
    formulaId: made ? values.formulaId : null,
    boughtIn: values.making === "bought_in",
    bakeTempC: made ? blankToNull(values.bakeTempC) : null,
    bakeMinutes: made ? blankToNull(values.bakeMinutes) : null,
    coolMinutes: made ? blankToNull(values.coolMinutes) : null,
    components: made ? values.components.map((c) => ({ kind: c.kind, name: c.name, ingredientId: c.ingredientId, grams: c.grams.trim() === "" ? undefined : c.grams.trim(), per: c.per, note: c.note })) : [],
  };
  const checked = productInputSchema.safeParse(candidate);
  const fields: FieldErrors = checked.success ? {} : fieldErrorsFrom(checked.error);
  for (const k of ["piecesPerUnit", "pieceGrams", "panLengthMm", "panWidthMm", "unitsPerPan", "minQuantity", "maxQuantity"] as const) {
    if (values[k].trim() === "") fields[k] = "Enter a whole number.";
  }
  if (priceCents === null) fields.priceCents = values.price.trim() ? "Write the list price in dollars and cents, like 18.00." : "Enter the list price.";
  if (made && values.formulaId === null) fields.formulaId = "Choose the formula it is baked from.";
  if (made) values.components.forEach((c, i) => { if (c.grams.trim() === "") fields[`components.${i}.grams`] = "Enter the grams, e.g. 2 or 1.5."; });
  if (Object.keys(fields).length || !checked.success) return { ok: false, fields };
  const { active: _active, ...input } = checked.data;
  return { ok: true, input };
}

// ---- the product in words (read-only view) -------------------------------------------------------

/** "16 min at 177 °C, then 30 min cooling" — the product's own values or its formula's. */
export function bakeText(p: Pick<ProductDto, "bake">): string {
  const { bakeTempC, bakeMinutes, coolMinutes } = p.bake;
  if (bakeMinutes === null && bakeTempC === null && coolMinutes === null) return "No bake step in the formula";
  const oven = [bakeMinutes !== null ? `${bakeMinutes} min` : null, bakeTempC !== null ? `at ${bakeTempC} °C` : null].filter(Boolean).join(" ");
  return [oven || null, coolMinutes !== null ? `then ${coolMinutes} min cooling` : null].filter(Boolean).join(", ");
}

/** "Egg wash: Whole egg 1.2 g, Whole milk 0.3 g per piece · Toasted sesame topping: …" */
export function componentsText(p: Pick<ProductDto, "components">): string {
  return groupComponents(p.components)
    .map((g) => `${g.name}: ${g.lines.map((l) => `${l.ingredientName} ${l.grams} g per ${l.per}`).join(", ")}`)
    .join(" · ");
}
