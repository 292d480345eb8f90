/** The liquid for a mix: its temperature from the desired dough temperature, and ice, chilling or warming. */
import { EPS, round, roundGrams, sum } from "./rounding";
import type { IngredientInfo } from "./types";

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
