import { z } from "zod";
import { ALLERGEN_CODES, type AllergenCode } from "../allergens";
import { INGREDIENT_KINDS, PASTE_COOK_MESSAGE, PASTE_MIN_COOK_C, STEP_KINDS, type FormulaFigures, type IngredientKind, type StepKind, type LiquidPlan } from "../production";
import { RETARD_HOURS, type DaySchedule, type OvenSpec, type ScheduleEntry } from "../schedule";
import { dateSchema } from "./calendar";
import type { ComponentCard } from "../components";

const num = (label: string, min: number, max: number) =>
  z.coerce.number({ error: (issue) => (issue.input === undefined ? undefined : `${label} must be a number.`) }).min(min, `${label} must be at least ${min}.`).max(max, `${label} can be at most ${max}.`);

export const ingredientInputSchema = z.object({
  name: z.string().trim().min(1, "Name the ingredient.").max(120, "Use at most 120 characters."),
  kind: z.enum(INGREDIENT_KINDS, { error: "Choose a kind: flour, liquid, fat, sugar, salt, leavening, egg, inclusion or other." }),
  waterPercent: num("Water content", 0, 100),
  allergens: z.array(z.enum(ALLERGEN_CODES, { error: "Choose allergens from the list." })).default([]),
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
      cookToC: z.coerce.number({ error: (issue) => (issue.input === undefined ? undefined : "Cook-to temperature must be a number.") }).min(PASTE_MIN_COOK_C, PASTE_COOK_MESSAGE).max(100, PASTE_COOK_MESSAGE).default(65),
    })
    .nullable()
    .default(null),
  lines: z.array(z.object({ ingredientId: z.number().int().positive(), percent: z.number({ error: (issue) => (issue.input === undefined ? undefined : "Enter a percentage.") }) })).max(40),
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
  /** Supply temperatures for the ice (optional: unchanged when absent). Water stays liquid from 0 °C. */
  tapC: num("Tap water temperature", 0, 60).optional(),
  milkC: num("Milk temperature", -1, 40).optional(),
});

export const planQuerySchema = z.object({ date: dateSchema });
/** GET /api/production/plan.pdf?date=&units= (metric unless "us"). */
export const planPdfQuerySchema = planQuerySchema.extend({ units: z.enum(["metric", "us"]).default("metric") });
/** GET /api/production/forecast?from=: the first of the 7 days. */
export const forecastQuerySchema = z.object({ from: dateSchema });
/** GET /api/formulas/:id?version=: an earlier version to read (the current one when left out). */
export const formulaVersionQuerySchema = z.object({ version: z.coerce.number().int().positive().optional() });

export interface PlanDto {
  date: string;
  final: boolean;
  frozen: boolean;
  frozenAt: string | null;
  computedAt: string;
  cutoffAt: string;
  /** mixerCapacityKg: the largest mixer (doughs are split to fit it); packFrom: dispatch less the packing time. */
  inputs: { roomC: number; flourC: number; pasteC: number; /** Absent in plans frozen before them. */ tapC?: number; milkC?: number; mixerCapacityKg: number; dispatchAt: string; packingMinutes: number; packFrom: string; crewPeople: number; shiftStartAt: string | null };
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
    mixes: {
      index: number; doughGrams: number; liquidTempC: number | null; liquidTempAdvice: string | null;
      /** Ice, chilling or warming for the liquid (shared/production/liquid.ts planLiquid); absent in plans frozen before it. */
      liquid?: LiquidPlan | null;
      ingredients: { ingredientId: number; grams: number; pasteGrams: number; finalMixGrams: number }[];
      /** When and on which mixer this card is mixed (shared/schedule/); absent in plans frozen before the schedule. */
      scheduled?: { startsAt: string; endsAt: string; mixerName: string; pasteStartsAt: string | null; dayBefore: boolean } | null;
    }[];
  }[];
  /** Dough and components together; `componentGrams` is the part weighed for components. */
  ingredients: { ingredientId: number; name: string; grams: number; componentGrams?: number; /** The ingredient's kind (for the cautions: raw egg in a wash). */ kind?: IngredientKind }[];
  /** One weigh-out card per component per product (toppings, washes, fillings, garnishes). */
  components?: ComponentCard[];
  /** Every step of the day on its mixer, oven or the crew (shared/schedule/), in time order. */
  timeline: ScheduleEntry[];
  /** The schedule around the timeline: oven loads, conflicts with the day, the earlier start that would fit. */
  schedule?: Omit<DaySchedule, "entries" | "warnings">;
  warnings: string[];
  progress: PlanProgressDto;
}

/**
 * What the baker ticks off and records on the day: mixes weighed and mixed, oven loads baked, and the internal
 * temperature probed in each oven load (°C, with when it was recorded; by load number).
 */
export interface PlanProgressDto {
  mixes: string[];
  waves: number[];
  internal?: Record<string, { c: number; at: string }>;
}

/** POST /api/production/bake-days/:date/progress: a tick, or an internal temperature reading (null clears it). */
export const progressInputSchema = z.union([
  z.object({ kind: z.enum(["mix", "wave"]), key: z.string().min(1).max(40), done: z.boolean() }),
  z.object({
    kind: z.literal("internal"),
    key: z.string().regex(/^\d{1,4}$/, "Name the oven load by its number."),
    valueC: z.number({ error: (issue) => (issue.input === undefined ? undefined : "Enter the temperature reached, e.g. 92.") }).min(20, "Enter the temperature reached inside the bread: 20 to 120 °C.").max(120, "Enter the temperature reached inside the bread: 20 to 120 °C.").nullable(),
  }),
]);
export type ProgressBody = z.output<typeof progressInputSchema>;

// ---- production settings: the bakehouse's resources ----------------------------------------------

const hhmm = z.string().trim().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time such as 06:30.");
const whole = (label: string, min: number, max: number) =>
  z.coerce.number({ error: (issue) => (issue.input === undefined ? undefined : `${label}: enter a whole number.`) }).int(`${label}: whole numbers only.`).min(min, `${label}: at least ${min}.`).max(max, `${label}: at most ${max}.`);

const ovenCapacitySchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("area"), areaCm2: whole("Usable shelf area (cm²)", 100, 1_000_000) }),
  z.object({
    kind: z.literal("slots"),
    slots: z.array(z.string().trim().min(1, "Name every slot.").max(30, "Slot names: at most 30 characters.")).min(1, "Name at least one pan slot.").max(200, "At most 200 slots."),
    slotLengthMm: whole("Slot length (mm)", 50, 3000),
    slotWidthMm: whole("Slot width (mm)", 50, 3000),
  }),
], { error: "Choose shelf area or pan slots." });

/**
 * PUT /api/production/settings (the owner's settings screen checks with the same schema). Retard hours are
 * limited to the usual window (common practice, no source: shaped rolls at about 2–4 °C for 8–16 h).
 */
export const productionSettingsSchema = z.object({
  dispatchTime: hhmm,
  shiftStart: hhmm.nullable().default(null),
  packingMinutes: whole("Packing and loading minutes", 0, 240),
  mixers: z.array(z.object({
    name: z.string().trim().min(1, "Name the mixer.").max(60, "Use at most 60 characters."),
    capacityKg: num("Mixer capacity (kg)", 1, 500),
  })).min(1, "Add at least one mixer.").max(10, "At most 10 mixers."),
  ovens: z.array(z.object({
    name: z.string().trim().min(1, "Name the oven.").max(60, "Use at most 60 characters."),
    capacity: ovenCapacitySchema,
    tempChangeMinutes: whole("Minutes to change temperature", 0, 240),
    loadMinutes: whole("Minutes to load", 0, 60),
    unloadMinutes: whole("Minutes to unload", 0, 60),
  })).min(1, "Add at least one oven.").max(20, "At most 20 ovens."),
  crew: z.object({
    people: whole("People on the shift", 1, 50),
    divideMinutesPerPiece: num("Dividing (person-minutes per piece)", 0, 10),
    shapeMinutesPerPiece: num("Shaping (person-minutes per piece)", 0, 10),
    panMinutesPerPan: num("Panning (person-minutes per pan)", 0, 30),
  }),
  retard: z.array(z.object({
    formulaId: z.number().int().positive(),
    hours: num("Hours in the retarder", RETARD_HOURS.min, RETARD_HOURS.max),
  })).max(50).default([])
    .refine((r) => new Set(r.map((x) => x.formulaId)).size === r.length, "Each dough once."),
});
export type ProductionSettingsInput = z.output<typeof productionSettingsSchema>;

export interface ProductionSettingsDto {
  /** "06:30", bakery time: when the vans leave. */
  dispatchTime: string;
  /** "03:00", bakery time, or null: when the shift starts (the plan says when a day does not fit it). */
  shiftStart: string | null;
  packingMinutes: number;
  mixers: { id: number; name: string; capacityKg: number }[];
  ovens: OvenSpec[];
  crew: { people: number; divideMinutesPerPiece: number; shapeMinutesPerPiece: number; panMinutesPerPan: number };
  /** Doughs retarded overnight: mixed and shaped the day before, baked from the retarder. */
  retard: { formulaId: number; hours: number }[];
}

export { dateSchema };
