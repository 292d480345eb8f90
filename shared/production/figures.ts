/** A formula's derived figures (hydration, paste share, yield) and the checks a formula must pass. */
import { EPS, round, sum } from "./rounding";
import type { FormulaSpec, IngredientInfo, IngredientKind } from "./types";

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
