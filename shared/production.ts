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
  /**
   * Effective hydration by the usual convention: the water in the wet ingredients (liquids, egg, fats such
   * as butter, syrups such as honey: each line times its water content) over the flour weight, the paste's
   * flour included. The flour's own moisture (and that of other dry goods) is not counted.
   */
  effectiveHydrationPercent: number;
  /** The flour's own moisture over the flour, percent: shown apart, never inside the hydration. */
  flourMoisturePercent: number;
  /** Share of the flour cooked in the paste, percent (0 without a paste). */
  pasteSharePercent: number;
  /** The paste's weight as baker's percent (flour + liquid cooked). */
  pastePercent: number;
  /** Grams of dough from one kilogram of flour. */
  doughYieldPerKgFlour: number;
}

/**
 * The kinds whose water counts toward effective hydration: the usual convention counts the water brought by
 * liquids, egg, butter (fats) and honey or syrups (sugars), never the bound moisture of flour and other dry
 * goods (dry milk, oats, instant yeast). Common practice, no single source; water contents per ingredient are
 * the library's (USDA FoodData Central for dairy and egg).
 */
export const WET_KINDS: readonly IngredientKind[] = ["liquid", "egg", "fat", "sugar"];

export function formulaFigures(f: Pick<FormulaSpec, "lines" | "paste">, ingredients: Map<number, IngredientInfo>): FormulaFigures {
  const lines = f.lines.map((l) => ({ ...l, info: ingredients.get(l.ingredientId) }));
  const totalPercent = sum(lines.map((l) => l.percent));
  const flourPercent = sum(lines.filter((l) => l.info?.kind === "flour").map((l) => l.percent));
  const hydrationPercent = sum(lines.filter((l) => l.info?.kind === "liquid").map((l) => l.percent));
  const water = sum(lines.filter((l) => l.info && WET_KINDS.includes(l.info.kind)).map((l) => (l.percent * l.info!.waterPercent) / 100));
  const flourWater = sum(lines.filter((l) => l.info?.kind === "flour").map((l) => (l.percent * l.info!.waterPercent) / 100));
  const pasteSharePercent = f.paste ? f.paste.flourPercent : 0;
  const pasteFlourBp = f.paste ? (flourPercent * f.paste.flourPercent) / 100 : 0;
  return {
    totalPercent,
    flourPercent,
    hydrationPercent,
    effectiveHydrationPercent: flourPercent > 0 ? (water / flourPercent) * 100 : 0,
    flourMoisturePercent: flourPercent > 0 ? (flourWater / flourPercent) * 100 : 0,
    pasteSharePercent,
    pastePercent: f.paste ? pasteFlourBp * (1 + f.paste.liquidRatio) : 0,
    doughYieldPerKgFlour: flourPercent > 0 ? (totalPercent / flourPercent) * 1000 : 0,
  };
}

/**
 * The paste must reach wheat starch gelatinisation or it does not set: common practice cooks this flour-and-milk
 * paste to about 60–70 °C (65 °C is usual), so below 60 °C is refused. Common practice, no single source.
 */
export const PASTE_MIN_COOK_C = 60;
export const PASTE_COOK_MESSAGE = "Cook the paste to 60–100 °C: below about 60 °C the wheat starch does not gelatinize and the paste does not set (about 65 °C is usual).";

/**
 * The friction factor is in °C. Common practice, no single source: about 1–3 °C by hand and roughly 5–16 °C
 * in a spiral or planetary mixer, depending on the mix time; above 20 °C is implausible in °C and is most
 * likely a habitual °F factor (26 °F is the textbook example), which would make the liquid far too cold.
 */
export const FRICTION_PLAUSIBLE_MAX_C = 20;

/**
 * Values that can be saved but are probably a mistake (keys match the form's fields). Not refusals: the
 * baker decides, the screen says why it looks wrong.
 */
export function formulaWarnings(f: { frictionC: number }): Record<string, string> {
  const out: Record<string, string> = {};
  if (Number.isFinite(f.frictionC) && f.frictionC > FRICTION_PLAUSIBLE_MAX_C) {
    const asC = round((f.frictionC * 5) / 9, 1);
    out.frictionC = `${f.frictionC} is high for a friction factor in °C (usually about 1–16 °C in a mixer). If it is a °F factor, in °C it is ${asC}; as it stands the liquid comes out about ${round(f.frictionC - asC, 1)} °C colder.`;
  }
  return out;
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
    if (!(p.cookToC >= PASTE_MIN_COOK_C && p.cookToC <= 100)) errors["paste.cookToC"] = PASTE_COOK_MESSAGE;
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

export interface TemperatureInputs {
  roomC: number;
  flourC: number;
  /** The paste's temperature when it goes into the mix. */
  pasteC: number;
  /** Tap water as it comes from the tap (for the ice). Default DEFAULT_TAP_C. */
  tapC?: number;
  /** Milk (and any other liquid kept cold) as it comes out of the cooler. Default DEFAULT_MILK_C. */
  milkC?: number;
}

/** Tap water varies with the season (roughly 5–25 °C, from memory); 15 °C until the baker measures it. */
export const DEFAULT_TAP_C = 15;
/** Milk from a cooler held at 5 °C or below (FDA Food Code 3-501.16(A)(2): cold holding at 5 °C / 41 °F or less). */
export const DEFAULT_MILK_C = 4;
/** Liquid no colder than ice water: the ice-and-water mix sits at 0 °C. */
export const ICE_WATER_C = 0;
/** Milk can be chilled to about 1 °C before it starts to freeze (milk freezes near −0.5 °C; from memory). */
export const COLDEST_MILK_C = 1;
/**
 * Warmest liquid to add: common practice keeps liquid for a yeasted dough at or below about 40 °C (yeast is
 * stressed above about 43 °C and killed near 55–60 °C; from memory). Above it the advice is never "hotter".
 */
export const WARMEST_LIQUID_C = 40;
/** Differences this small are left alone (a thermometer reads to about ±1 °C). */
const LIQUID_TOLERANCE_C = 1;

/**
 * Liquid temperature for a desired dough temperature: liquid = DDT × n − (room + flour + friction [+ paste]),
 * where n counts the factors (3, or 4 with a paste). Common practice (the desired-dough-temperature method).
 */
export function liquidTemperature(ddtC: number, frictionC: number, t: TemperatureInputs, withPaste: boolean): { liquidC: number } {
  const n = withPaste ? 4 : 3;
  return { liquidC: round(ddtC * n - (t.roomC + t.flourC + frictionC + (withPaste ? t.pasteC : 0)), 1) };
}

/**
 * Ice to bring water from its supply temperature down to the wanted temperature, weighed in place of that much
 * water (common practice): ice = W × (T_supply − T_wanted) ÷ (T_supply + 80) in °C, or ÷ (T_supply + 112) in °F.
 * 80 is the latent heat of melting ice in calories per gram (334 J/g ÷ 4.19 J/g·K); 112 = 144 BTU/lb − 32 °F.
 * Nothing when the supply is not warmer than wanted.
 */
export function iceGrams(waterGrams: number, supply: number, wanted: number, scale: "C" | "F" = "C"): number {
  if (!(supply > wanted) || waterGrams <= 0) return 0;
  return (waterGrams * (supply - wanted)) / (supply + (scale === "C" ? 80 : 112));
}

export type LiquidAction =
  /** Liquid as it comes is right (within a degree). */
  | "as_is"
  /** Part of the water line weighed as crushed ice; the milk straight from the cooler. */
  | "ice"
  /** Chill the milk (no water line: never replace milk by ice or water). */
  | "chill"
  /** All of the water line as ice and the milk chilled further. */
  | "ice_and_chill"
  /** Warm the liquid (it comes colder than wanted), at most WARMEST_LIQUID_C. */
  | "warm"
  /** Wanted colder than liquid can be: as cold as it goes, and bring the other factors down. */
  | "too_cold"
  /** Wanted warmer than liquid should be: warm to WARMEST_LIQUID_C and give the dough longer. */
  | "too_warm";

/** What to do with one mix's liquid so the dough comes out at its target. All temperatures °C, weights g. */
export interface LiquidPlan {
  /** What the liquid must be (the desired-dough-temperature method). */
  wantedC: number;
  action: LiquidAction;
  tapC: number;
  milkC: number;
  /** The mix's water line(s) in the final mix, and its other liquids (milk…). */
  waterGrams: number;
  otherLiquidGrams: number;
  /** The water line the ice replaces part of (the largest water line), if any. */
  waterIngredientId: number | null;
  /** The other liquid lines (milk…), chilled or warmed but never iced. */
  otherIngredientIds: number[];
  /** Crushed ice weighed as part of the water line (0 when none). */
  iceGrams: number;
  /** Chill the milk to this (null: straight from the cooler). */
  chillToC: number | null;
  /** Warm the liquid to this (null: no warming). */
  warmToC: number | null;
}

/** A liquid line of one mix: pure water (≥ 99.5 % water) is the tap line; anything else (milk) comes from the cooler. */
export interface MixLiquidLine {
  ingredientId: number;
  grams: number;
  water: boolean;
}

/**
 * Turn the wanted liquid temperature into what the baker does. Heat balance with every liquid treated as water
 * (milk's specific heat is about 93 % of water's, from memory: close enough for a thermometer's degree):
 * water W at T_tap, milk M at T_milk, ice I at 0 °C melting (80 cal/g) then warming to T:
 *   (W − I)(T_tap − T) + M(T_milk − T) = I (80 + T)  ⇒  I = [W (T_tap − T) + M (T_milk − T)] ÷ (T_tap + 80),
 * which is the common-practice formula when there is no milk. Ice only ever replaces water; milk is chilled.
 */
export function planLiquid(wantedC: number, lines: MixLiquidLine[], t: Pick<TemperatureInputs, "tapC" | "milkC">): LiquidPlan {
  const tapC = t.tapC ?? DEFAULT_TAP_C;
  const milkC = t.milkC ?? DEFAULT_MILK_C;
  const water = lines.filter((l) => l.water && l.grams > 0);
  const W = sum(water.map((l) => l.grams));
  const M = sum(lines.filter((l) => !l.water && l.grams > 0).map((l) => l.grams));
  const waterIngredientId = water.length ? [...water].sort((a, b) => b.grams - a.grams)[0].ingredientId : null;
  const otherIngredientIds = lines.filter((l) => !l.water && l.grams > 0).map((l) => l.ingredientId);
  const base: LiquidPlan = { wantedC, action: "as_is", tapC, milkC, waterGrams: round(W, 1), otherLiquidGrams: round(M, 1), waterIngredientId, otherIngredientIds, iceGrams: 0, chillToC: null, warmToC: null };
  if (wantedC > WARMEST_LIQUID_C) return { ...base, action: "too_warm", warmToC: WARMEST_LIQUID_C };
  if (W + M <= 0) return wantedC < ICE_WATER_C ? { ...base, action: "too_cold" } : base;
  const supplyC = (W * tapC + M * milkC) / (W + M);
  if (Math.abs(supplyC - wantedC) <= LIQUID_TOLERANCE_C && wantedC >= ICE_WATER_C) return base;
  if (wantedC > supplyC) return { ...base, action: "warm", warmToC: round(wantedC, 1) };
  // Colder than it comes. Liquid cannot go below ice water: aim for 0 °C and say the rest must come from elsewhere.
  const target = Math.max(wantedC, ICE_WATER_C);
  const tooCold = wantedC < ICE_WATER_C;
  if (W > 0) {
    const ice = (W * (tapC - target) + M * (milkC - target)) / (tapC + 80);
    if (ice <= W + EPS) return { ...base, action: tooCold ? "too_cold" : "ice", iceGrams: roundGrams(Math.max(0, ice)) };
    // All the water as ice is not enough: the milk takes the rest, M (T_milk' − T) = W (80 + T).
    const chill = target + (W * (80 + target)) / M;
    const reachable = chill >= COLDEST_MILK_C;
    return { ...base, action: tooCold || !reachable ? "too_cold" : "ice_and_chill", iceGrams: roundGrams(W), chillToC: round(Math.max(chill, COLDEST_MILK_C), 1) };
  }
  // Milk only: chill it, never ice it.
  if (target < COLDEST_MILK_C) return { ...base, action: "too_cold", chillToC: COLDEST_MILK_C };
  return { ...base, action: "chill", chillToC: round(target, 1) };
}

/** The final-mix liquid lines of a mix, water lines told apart from milk and other cold-kept liquids. */
export function mixLiquidLines(lines: { ingredientId: number; finalMixGrams: number }[], ingredients: Map<number, IngredientInfo>): MixLiquidLine[] {
  return lines
    .filter((l) => ingredients.get(l.ingredientId)?.kind === "liquid" && l.finalMixGrams > 0)
    .map((l) => ({ ingredientId: l.ingredientId, grams: l.finalMixGrams, water: (ingredients.get(l.ingredientId)?.waterPercent ?? 0) >= 99.5 }));
}

/** Is the liquid plan a problem to put in front of the baker (the plan's warnings), not just an instruction? */
export const liquidNeedsAttention = (l: Pick<LiquidPlan, "action">) => l.action === "too_cold" || l.action === "too_warm";

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
