/**
 * Production arithmetic: pans, doughs in baker's percentages, the cooked paste, mixes sized for the mixer,
 * liquid temperatures from the desired dough temperature. The day's schedule is shared/schedule.ts.
 * Pure functions: the server and the screens use the same ones.
 */

export const INGREDIENT_KINDS = ["flour", "liquid", "fat", "sugar", "salt", "leavening", "egg", "inclusion", "other"] as const;
export type IngredientKind = (typeof INGREDIENT_KINDS)[number];

export const STEP_KINDS = ["paste", "mix", "rest", "knead", "bulk", "divide", "bench", "shape", "proof", "wash", "bake", "cool"] as const;
export type StepKind = (typeof STEP_KINDS)[number];
export const STEP_LABELS: Record<StepKind, string> = {
  paste: "Cook and cool the paste",
  mix: "Mix",
  rest: "Rest",
  knead: "Knead",
  bulk: "Bulk ferment",
  divide: "Divide and round",
  bench: "Bench rest",
  shape: "Shape and pan",
  proof: "Final proof",
  wash: "Wash",
  bake: "Bake",
  cool: "Cool",
};

export interface IngredientInfo {
  id: number;
  name: string;
  kind: IngredientKind;
  /** Water content in percent of the ingredient's weight (for effective hydration). */
  waterPercent: number;
}

export interface PasteSpec {
  flourIngredientId: number;
  liquidIngredientId: number;
  /** Share of the formula's total flour that is cooked into the paste, percent. */
  flourPercent: number;
  /** Liquid to flour by weight (5 means 5:1). */
  liquidRatio: number;
  cookToC: number;
}

export interface StepSpec {
  kind: StepKind;
  minutes: number;
  /** For the bake: oven temperature. */
  temperatureC?: number | null;
}

export interface FormulaSpec {
  id: number;
  version: number;
  name: string;
  lossPercent: number;
  ddtC: number;
  frictionC: number;
  paste: PasteSpec | null;
  lines: { ingredientId: number; percent: number }[];
  steps: StepSpec[];
  targetInternalC?: number | null;
}

const EPS = 1e-9;
const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

// ---- derived figures -----------------------------------------------------------------------

export interface FormulaFigures {
  totalPercent: number;
  flourPercent: number;
  /** Liquid-kind lines over flour, percent. */
  hydrationPercent: number;
  /** Water from every ingredient (by its water content) over flour, percent. */
  effectiveHydrationPercent: number;
  /** Share of the flour cooked in the paste, percent (0 without a paste). */
  pasteSharePercent: number;
  /** The paste's weight as baker's percent (flour + liquid cooked). */
  pastePercent: number;
  /** Grams of dough from one kilogram of flour. */
  doughYieldPerKgFlour: number;
}

export function formulaFigures(f: Pick<FormulaSpec, "lines" | "paste">, ingredients: Map<number, IngredientInfo>): FormulaFigures {
  const lines = f.lines.map((l) => ({ ...l, info: ingredients.get(l.ingredientId) }));
  const totalPercent = sum(lines.map((l) => l.percent));
  const flourPercent = sum(lines.filter((l) => l.info?.kind === "flour").map((l) => l.percent));
  const hydrationPercent = sum(lines.filter((l) => l.info?.kind === "liquid").map((l) => l.percent));
  const water = sum(lines.map((l) => (l.percent * (l.info?.waterPercent ?? 0)) / 100));
  const pasteSharePercent = f.paste ? f.paste.flourPercent : 0;
  const pasteFlourBp = f.paste ? (flourPercent * f.paste.flourPercent) / 100 : 0;
  return {
    totalPercent,
    flourPercent,
    hydrationPercent,
    effectiveHydrationPercent: flourPercent > 0 ? (water / flourPercent) * 100 : 0,
    pasteSharePercent,
    pastePercent: f.paste ? pasteFlourBp * (1 + f.paste.liquidRatio) : 0,
    doughYieldPerKgFlour: flourPercent > 0 ? (totalPercent / flourPercent) * 1000 : 0,
  };
}

/** Field messages for a formula that cannot be baked as written (keys match the API's). */
export function validateFormula(f: Pick<FormulaSpec, "lines" | "paste" | "lossPercent">, ingredients: Map<number, IngredientInfo>): Record<string, string> {
  const errors: Record<string, string> = {};
  if (f.lines.length === 0) errors.lines = "Add the formula's ingredients.";
  const seen = new Set<number>();
  f.lines.forEach((l, i) => {
    if (!ingredients.has(l.ingredientId)) errors[`lines.${i}.ingredientId`] = "This ingredient is not in the library.";
    if (seen.has(l.ingredientId)) errors[`lines.${i}.ingredientId`] = "This ingredient is listed twice.";
    seen.add(l.ingredientId);
    if (l.percent === null || l.percent === undefined || Number.isNaN(l.percent)) errors[`lines.${i}.percent`] = "Enter a percentage.";
    else if (l.percent <= 0) errors[`lines.${i}.percent`] = "Percentages must be more than 0.";
  });
  if (Object.keys(errors).length) return errors;
  const figures = formulaFigures(f, ingredients);
  if (Math.abs(figures.flourPercent - 100) > 0.01) {
    errors.lines = `The flour lines add up to ${round(figures.flourPercent, 2)} %; in baker's percentages they must add up to 100 %.`;
  }
  if (f.lossPercent < 0 || f.lossPercent >= 50) errors.lossPercent = "The loss allowance must be from 0 to under 50 %.";
  if (f.paste) {
    const p = f.paste;
    const flourLine = f.lines.find((l) => l.ingredientId === p.flourIngredientId);
    const liquidLine = f.lines.find((l) => l.ingredientId === p.liquidIngredientId);
    if (!flourLine || ingredients.get(p.flourIngredientId)?.kind !== "flour") errors["paste.flourIngredientId"] = "Cook a flour that is in the formula.";
    if (!liquidLine || ingredients.get(p.liquidIngredientId)?.kind !== "liquid") errors["paste.liquidIngredientId"] = "Cook a liquid that is in the formula.";
    if (!(p.flourPercent > 0 && p.flourPercent <= 100)) errors["paste.flourPercent"] = "Cook between 0 and 100 % of the flour.";
    if (!(p.liquidRatio > 0 && p.liquidRatio <= 20)) errors["paste.liquidRatio"] = "Use a liquid-to-flour ratio above 0 and at most 20.";
    if (!(p.cookToC >= 40 && p.cookToC <= 100)) errors["paste.cookToC"] = "Cook the paste to between 40 and 100 °C.";
    if (flourLine && liquidLine && !errors["paste.flourPercent"] && !errors["paste.liquidRatio"]) {
      const pasteFlour = (figures.flourPercent * p.flourPercent) / 100;
      if (pasteFlour > flourLine.percent + EPS) {
        errors["paste.flourPercent"] = `The paste needs ${round(pasteFlour, 2)} % flour but the formula has ${flourLine.percent} % of that flour.`;
      }
      const pasteLiquid = pasteFlour * p.liquidRatio;
      if (pasteLiquid > liquidLine.percent + EPS) {
        errors["paste.liquidRatio"] = `The paste needs ${round(pasteLiquid, 2)} % liquid but the formula has only ${liquidLine.percent} % of that liquid.`;
      }
    }
  }
  return errors;
}

// ---- rounding --------------------------------------------------------------------------------

export const round = (x: number, dp = 0) => {
  const f = 10 ** dp;
  return Math.round((x + Math.sign(x) * EPS) * f) / f;
};

/** Grams as the plan shows them: to 1 g, or to 0.1 g under 50 g. */
export const roundGrams = (g: number) => (g < 50 ? round(g, 1) : round(g));

/**
 * Split a total into n parts that add up to it exactly, each a multiple of `step`
 * (largest-remainder method), so mix weights add up to the dough's totals.
 */
export function apportion(total: number, n: number, step: number): number[] {
  const units = Math.round(total / step);
  const base = Math.floor(units / n);
  const extra = units - base * n;
  return Array.from({ length: n }, (_, i) => round((base + (i < extra ? 1 : 0)) * step, step < 1 ? 1 : 0));
}

// ---- products, doughs, mixes ----------------------------------------------------------------

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
  liquidTempAdvice: string | null;
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

export interface TemperatureInputs {
  roomC: number;
  flourC: number;
  /** The paste's temperature when it goes into the mix. */
  pasteC: number;
}

/**
 * Liquid temperature for a desired dough temperature: liquid = DDT × n − (room + flour + friction [+ paste]),
 * where n counts the factors (3, or 4 with a paste). Below 2 °C or above 40 °C it is flagged with advice.
 */
export function liquidTemperature(ddtC: number, frictionC: number, t: TemperatureInputs, withPaste: boolean): { liquidC: number; advice: string | null } {
  const n = withPaste ? 4 : 3;
  const liquidC = ddtC * n - (t.roomC + t.flourC + frictionC + (withPaste ? t.pasteC : 0));
  let advice: string | null = null;
  if (liquidC < 2) {
    advice = withPaste
      ? "Colder than ice water can be: replace part of the liquid with crushed ice (weighed as liquid), let the paste cool further, or chill the flour."
      : "Colder than ice water can be: replace part of the liquid with crushed ice (weighed as liquid) or chill the flour.";
  } else if (liquidC > 40) {
    advice = withPaste
      ? "Liquid this warm stresses the yeast: add the paste warmer instead (it was cooked hot), or let the flour come up to room temperature."
      : "Liquid this warm stresses the yeast: let the flour come up to room temperature, or mix in a warmer spot.";
  }
  return { liquidC: round(liquidC, 1), advice };
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
  const mixes: Mix[] = Array.from({ length: nMixes }, (_, i) => ({ index: i + 1, doughGrams: 0, liquidTempC: mixTemp.liquidC, liquidTempAdvice: mixTemp.advice, ingredients: [] }));
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
