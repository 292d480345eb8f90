/** Products to pans and pieces, and a formula's dough for the day split into mixes the mixer holds. */
import { liquidTemperature, mixLiquidLines, planLiquid, type LiquidPlan, type TemperatureInputs } from "./liquid";
import { EPS, apportion, round, roundGrams, sum } from "./rounding";
import type { FormulaSpec, IngredientInfo, IngredientKind } from "./types";

export interface ProductDemand {
  productId: number;
  name: string;
  units: number;
  extraPans: number;
  unitsPerPan: number;
  piecesPerUnit: number;
  pieceGrams: number;
  formulaId: number | null;
  /**
   * The product's bake, resolved (shared/components.ts resolveBake): its own oven temperature (°C), bake minutes and
   * cool minutes, or else its formula's bake and cool steps. The plan service always sets them; null = none known.
   */
  bakeTempC?: number | null;
  bakeMinutes?: number | null;
  coolMinutes?: number | null;
}

export interface PlannedProduct extends ProductDemand {
  pans: number;
  pieces: number;
}

/** pans = ceil(units / unitsPerPan) + extraPans; pieces = pans × unitsPerPan × piecesPerUnit. */
export function planProduct(d: ProductDemand): PlannedProduct {
  const pans = Math.ceil(d.units / d.unitsPerPan) + d.extraPans;
  return { ...d, pans, pieces: pans * d.unitsPerPan * d.piecesPerUnit };
}

export interface DoughIngredient {
  ingredientId: number;
  name: string;
  kind: IngredientKind;
  percent: number;
  grams: number;
  pasteGrams: number;
  finalMixGrams: number;
}

export interface Mix {
  index: number;
  doughGrams: number;
  liquidTempC: number | null;
  /** The advice in words (metric), when the liquid needs attention; the screens and PDFs word `liquid` in their units. */
  liquidTempAdvice: string | null;
  /** What to do with the liquid: ice, chill, warm (absent on plans frozen before it existed). */
  liquid?: LiquidPlan | null;
  ingredients: { ingredientId: number; grams: number; pasteGrams: number; finalMixGrams: number }[];
}

export interface DoughPlan {
  formulaId: number;
  name: string;
  formulaVersion: number;
  doughGrams: number;
  flourGrams: number;
  paste: { flourGrams: number; liquidGrams: number; cookToC: number } | null;
  ingredients: DoughIngredient[];
  mixes: Mix[];
}

export function planDough(
  formula: FormulaSpec,
  ingredients: Map<number, IngredientInfo>,
  products: PlannedProduct[],
  mixerCapacityKg: number,
  temps: TemperatureInputs,
): DoughPlan {
  const pieceGrams = sum(products.map((p) => p.pieces * p.pieceGrams));
  const doughExact = pieceGrams / (1 - formula.lossPercent / 100);
  const totalPercent = sum(formula.lines.map((l) => l.percent));
  const flourExact = doughExact / (totalPercent / 100);
  const pasteFlourExact = formula.paste ? (flourExact * formula.paste.flourPercent) / 100 : 0;
  const pasteLiquidExact = formula.paste ? pasteFlourExact * formula.paste.liquidRatio : 0;
  const nMixes = doughExact > 0 ? Math.max(1, Math.ceil(doughExact / (mixerCapacityKg * 1000) - EPS)) : 0;

  const lines = formula.lines.map((l) => {
    const info = ingredients.get(l.ingredientId)!;
    const exact = (flourExact * l.percent) / 100;
    let pasteExact = 0;
    if (formula.paste && l.ingredientId === formula.paste.flourIngredientId) pasteExact = pasteFlourExact;
    if (formula.paste && l.ingredientId === formula.paste.liquidIngredientId) pasteExact = pasteLiquidExact;
    const grams = roundGrams(exact);
    const pasteGrams = roundGrams(pasteExact);
    return { ingredientId: l.ingredientId, name: info.name, kind: info.kind, percent: l.percent, grams, pasteGrams, finalMixGrams: round(grams - pasteGrams, grams < 50 ? 1 : 0), exact };
  });

  const mixTemp = liquidTemperature(formula.ddtC, formula.frictionC, temps, !!formula.paste);
  const mixes: Mix[] = Array.from({ length: nMixes }, (_, i) => ({ index: i + 1, doughGrams: 0, liquidTempC: mixTemp.liquidC, liquidTempAdvice: null, liquid: null, ingredients: [] }));
  for (const l of lines) {
    const step = (g: number) => (g < 50 * nMixes ? 0.1 : 1);
    const parts = apportion(l.grams, nMixes, step(l.grams));
    const pasteParts = apportion(l.pasteGrams, nMixes, step(l.grams));
    parts.forEach((g, i) => {
      const pasteG = pasteParts[i];
      mixes[i].ingredients.push({ ingredientId: l.ingredientId, grams: g, pasteGrams: pasteG, finalMixGrams: round(g - pasteG, 1) });
    });
  }
  for (const m of mixes) m.doughGrams = roundGrams(sum(m.ingredients.map((i) => i.grams)));
  for (const m of mixes) m.liquid = planLiquid(mixTemp.liquidC, mixLiquidLines(m.ingredients, ingredients), temps);

  return {
    formulaId: formula.id,
    name: formula.name,
    formulaVersion: formula.version,
    doughGrams: roundGrams(doughExact),
    flourGrams: roundGrams(flourExact),
    paste: formula.paste ? { flourGrams: roundGrams(pasteFlourExact), liquidGrams: roundGrams(pasteLiquidExact), cookToC: formula.paste.cookToC } : null,
    ingredients: lines.map(({ exact: _exact, ...rest }) => rest),
    mixes,
  };
}
