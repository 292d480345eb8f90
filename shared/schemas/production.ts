import { z } from "zod";
import { ALLERGEN_CODES, type AllergenCode } from "../allergens";
import { INGREDIENT_KINDS, STEP_KINDS, type FormulaFigures, type IngredientKind, type StepKind, type TimelineEntry } from "../production";
import { dateSchema } from "./calendar";
import type { ComponentCard } from "../components";

const num = (label: string, min: number, max: number) =>
  z.coerce.number({ invalid_type_error: `${label} must be a number.` }).min(min, `${label} must be at least ${min}.`).max(max, `${label} can be at most ${max}.`);

export const ingredientInputSchema = z.object({
  name: z.string().trim().min(1, "Name the ingredient.").max(120, "Use at most 120 characters."),
  kind: z.enum(INGREDIENT_KINDS, { errorMap: () => ({ message: "Choose a kind: flour, liquid, fat, sugar, salt, leavening, egg, inclusion or other." }) }),
  waterPercent: num("Water content", 0, 100),
  allergens: z.array(z.enum(ALLERGEN_CODES, { errorMap: () => ({ message: "Choose allergens from the list." }) })).default([]),
  packName: z.string().trim().min(1, "Describe the purchase pack, e.g. 25 kg sack.").max(60),
  packGrams: z.coerce.number().int("Whole grams.").min(0, "Cannot be negative.").max(1_000_000),
  packCostCents: z.coerce.number().int("Whole cents.").min(0, "Cannot be negative.").max(100_000_000).default(0),
});
export type IngredientInput = z.input<typeof ingredientInputSchema>;

export interface IngredientDto {
  id: number;
  name: string;
  kind: IngredientKind;
  waterPercent: number;
  allergens: AllergenCode[];
  packName: string;
  packGrams: number;
  packCostCents: number;
}

export const formulaInputSchema = z.object({
  name: z.string().trim().min(1, "Name the dough.").max(120, "Use at most 120 characters."),
  lossPercent: num("Loss allowance", 0, 49.9).default(2),
  ddtC: num("Desired dough temperature", 10, 40).default(26),
  frictionC: num("Friction factor", 0, 40).default(12),
  targetInternalC: num("Target internal temperature", 60, 100).nullable().default(null),
  paste: z
    .object({
      flourIngredientId: z.number().int().positive("Choose the flour to cook."),
      liquidIngredientId: z.number().int().positive("Choose the liquid to cook."),
      flourPercent: num("Share of flour cooked", 0.1, 100),
      liquidRatio: num("Liquid-to-flour ratio", 0.1, 20).default(5),
      cookToC: num("Cook-to temperature", 40, 100).default(65),
    })
    .nullable()
    .default(null),
  lines: z.array(z.object({ ingredientId: z.number().int().positive(), percent: z.number({ invalid_type_error: "Enter a percentage." }) })).max(40),
  steps: z.array(z.object({ kind: z.enum(STEP_KINDS), minutes: z.number().int("Whole minutes.").min(0).max(24 * 60), temperatureC: z.number().min(0).max(350).nullable().optional() })).max(30).default([]),
  note: z.string().trim().max(200).default(""),
});
export type FormulaInput = z.input<typeof formulaInputSchema>;

export interface FormulaDto {
  id: number;
  name: string;
  version: number;
  lossPercent: number;
  ddtC: number;
  frictionC: number;
  targetInternalC: number | null;
  paste: { flourIngredientId: number; liquidIngredientId: number; flourPercent: number; liquidRatio: number; cookToC: number } | null;
  lines: { ingredientId: number; name: string; kind: IngredientKind; percent: number }[];
  steps: { kind: StepKind; minutes: number; temperatureC?: number | null }[];
  figures: FormulaFigures;
  allergens: AllergenCode[];
  productIds: number[];
}

export const bakeDayInputSchema = z.object({
  extraPans: z.record(z.string().regex(/^\d+$/), z.number().int("Whole pans.").min(0, "Cannot be negative.").max(100)).default({}),
  roomC: num("Room temperature", -10, 50),
  flourC: num("Flour temperature", -10, 50),
  pasteC: num("Paste temperature", 0, 100),
});

export const planQuerySchema = z.object({ date: dateSchema });

export interface PlanDto {
  date: string;
  final: boolean;
  frozen: boolean;
  frozenAt: string | null;
  computedAt: string;
  cutoffAt: string;
  inputs: { roomC: number; flourC: number; pasteC: number; mixerCapacityKg: number; dispatchAt: string; ovenCapacityPans: number };
  products: {
    productId: number; name: string; units: number; extraPans: number; pans: number; pieces: number; pieceGrams: number; formulaId: number | null; panName: string; openUnits: number;
    /** Resolved per product (its own value, else its formula's bake/cool step; shared/components.ts resolveBake). Optional in plans frozen before they existed. */
    bakeTempC?: number | null; bakeMinutes?: number | null; coolMinutes?: number | null;
    /** The product's declared allergens (formula ∪ components ∪ its own additions). */
    allergens?: AllergenCode[];
  }[];
  doughs: {
    formulaId: number; name: string; formulaVersion: number; doughGrams: number; flourGrams: number; targetInternalC: number | null;
    paste: { flourGrams: number; liquidGrams: number; cookToC: number } | null;
    ingredients: { ingredientId: number; name: string; kind: IngredientKind; percent: number; grams: number; pasteGrams: number; finalMixGrams: number }[];
    mixes: { index: number; doughGrams: number; liquidTempC: number | null; liquidTempAdvice: string | null; ingredients: { ingredientId: number; grams: number; pasteGrams: number; finalMixGrams: number }[] }[];
  }[];
  /** Dough and components together; `componentGrams` is the part weighed for components. */
  ingredients: { ingredientId: number; name: string; grams: number; componentGrams?: number }[];
  /** One weigh-out card per component per product (toppings, washes, fillings, garnishes). */
  components?: ComponentCard[];
  timeline: TimelineEntry[];
  warnings: string[];
  progress: { mixes: string[]; waves: number[] };
}

export { dateSchema };
