/** Production data shaped like the API's answers (plans, formulas, ingredients, the forecast). */
import type { PlanView, ForecastDto, ProductionSettingsDto } from "../../components/api/production";
import type { FormulaDto, IngredientDto } from "../../shared/schemas/production";
import type { FormulaVersionDto } from "../../components/api/formulas";

const COLD_ADVICE = "Colder than ice water can be: replace part of the liquid with crushed ice (weighed as liquid), let the paste cool further, or chill the flour.";

/**
 * The bake day for Wed 3 Dec 2025 (the fake bakery's tomorrow): not final, cut-off Tue 2 Dec 14:00 CST.
 * Milk bread (formula 1) has a cooked paste and two mixes; brioche (formula 3) one mix and no paste.
 * Mix 1 of the milk bread puts exactly 1000 g of milk in the final mix and wants its liquid at 26 °C.
 */
export function planView(overrides: Partial<PlanView> = {}): PlanView {
  return {
    date: "2025-12-03",
    final: false,
    frozen: false,
    frozenAt: null,
    computedAt: "2025-12-02T05:30:00.000-06:00",
    cutoffAt: "2025-12-02T14:00:00.000-06:00",
    inputs: { roomC: 22, flourC: 20, pasteC: 30, mixerCapacityKg: 20, dispatchAt: "2025-12-03T06:30:00.000-06:00", ovenCapacityPans: 6 },
    products: [
      { productId: 101, name: "Milk-bread dinner rolls", units: 7, extraPans: 0, pans: 7, pieces: 105, pieceGrams: 67, formulaId: 1, panName: "9×13 in pan", openUnits: 3 },
      { productId: 102, name: "Brioche burger buns", units: 4, extraPans: 0, pans: 2, pieces: 32, pieceGrams: 90, formulaId: 3, panName: "Half sheet pan", openUnits: 0 },
    ],
    doughs: [
      {
        formulaId: 1,
        name: "Milk bread",
        formulaVersion: 2,
        doughGrams: 7200,
        flourGrams: 3800,
        targetInternalC: 89,
        paste: { flourGrams: 190, liquidGrams: 950, cookToC: 65 },
        ingredients: [
          { ingredientId: 1, name: "Bread flour", kind: "flour", percent: 100, grams: 3800, pasteGrams: 190, finalMixGrams: 3610 },
          { ingredientId: 2, name: "Whole milk", kind: "liquid", percent: 58, grams: 2204, pasteGrams: 950, finalMixGrams: 1254 },
          { ingredientId: 4, name: "Unsalted butter", kind: "fat", percent: 10, grams: 380, pasteGrams: 0, finalMixGrams: 380 },
          { ingredientId: 7, name: "Fine sea salt", kind: "salt", percent: 1.8, grams: 68.4, pasteGrams: 0, finalMixGrams: 68.4 },
        ],
        mixes: [
          {
            index: 1,
            doughGrams: 3800,
            liquidTempC: 26,
            liquidTempAdvice: null,
            ingredients: [
              { ingredientId: 1, grams: 1900, pasteGrams: 95, finalMixGrams: 1805 },
              { ingredientId: 2, grams: 1475, pasteGrams: 475, finalMixGrams: 1000 },
              { ingredientId: 4, grams: 190, pasteGrams: 0, finalMixGrams: 190 },
              { ingredientId: 7, grams: 34.2, pasteGrams: 0, finalMixGrams: 34.2 },
            ],
          },
          {
            index: 2,
            doughGrams: 3400,
            liquidTempC: 1.5,
            liquidTempAdvice: COLD_ADVICE,
            ingredients: [
              { ingredientId: 1, grams: 1900, pasteGrams: 95, finalMixGrams: 1805 },
              { ingredientId: 2, grams: 729, pasteGrams: 475, finalMixGrams: 254 },
              { ingredientId: 4, grams: 190, pasteGrams: 0, finalMixGrams: 190 },
              { ingredientId: 7, grams: 34.2, pasteGrams: 0, finalMixGrams: 34.2 },
            ],
          },
        ],
      },
      {
        formulaId: 3,
        name: "Brioche",
        formulaVersion: 1,
        doughGrams: 2969,
        flourGrams: 1397,
        targetInternalC: 88,
        paste: null,
        ingredients: [
          { ingredientId: 1, name: "Bread flour", kind: "flour", percent: 100, grams: 1397, pasteGrams: 0, finalMixGrams: 1397 },
          { ingredientId: 5, name: "Whole egg", kind: "egg", percent: 45, grams: 629, pasteGrams: 0, finalMixGrams: 629 },
        ],
        mixes: [
          {
            index: 1,
            doughGrams: 2970,
            liquidTempC: 16,
            liquidTempAdvice: null,
            ingredients: [
              { ingredientId: 1, grams: 1397, pasteGrams: 0, finalMixGrams: 1397 },
              { ingredientId: 5, grams: 629, pasteGrams: 0, finalMixGrams: 629 },
            ],
          },
        ],
      },
    ],
    ingredients: [
      { ingredientId: 1, name: "Bread flour", grams: 5197 },
      { ingredientId: 2, name: "Whole milk", grams: 2204 },
      { ingredientId: 5, name: "Whole egg", grams: 629 },
    ],
    timeline: [
      { step: "paste", label: "Cook and cool the paste", wave: 1, formulaId: 1, productIds: [101], pans: 6, startsAt: "2025-12-03T01:00:00.000-06:00", endsAt: "2025-12-03T01:40:00.000-06:00", temperatureC: null },
      { step: "mix", label: "Mix", wave: 1, formulaId: 1, productIds: [101], pans: 6, startsAt: "2025-12-03T01:40:00.000-06:00", endsAt: "2025-12-03T01:55:00.000-06:00", temperatureC: null },
      { step: "divide", label: "Divide and round", wave: 1, formulaId: 1, productIds: [101], pans: 6, startsAt: "2025-12-03T02:55:00.000-06:00", endsAt: "2025-12-03T03:20:00.000-06:00", temperatureC: null },
      { step: "bake", label: "Bake", wave: 1, formulaId: 1, productIds: [101], pans: 6, startsAt: "2025-12-03T04:50:00.000-06:00", endsAt: "2025-12-03T05:17:00.000-06:00", temperatureC: 177 },
      { step: "cool", label: "Cool", wave: 1, formulaId: 1, productIds: [101], pans: 6, startsAt: "2025-12-03T05:17:00.000-06:00", endsAt: "2025-12-03T05:47:00.000-06:00", temperatureC: null },
      { step: "mix", label: "Mix", wave: 2, formulaId: 3, productIds: [102], pans: 2, startsAt: "2025-12-03T01:59:00.000-06:00", endsAt: "2025-12-03T02:19:00.000-06:00", temperatureC: null },
      { step: "bake", label: "Bake", wave: 2, formulaId: 3, productIds: [102], pans: 2, startsAt: "2025-12-03T05:44:00.000-06:00", endsAt: "2025-12-03T06:00:00.000-06:00", temperatureC: 190 },
    ],
    warnings: [`Milk bread, mix 2: liquid at 1.5 °C — ${COLD_ADVICE}`],
    progress: { mixes: [], waves: [] },
    changes: [],
    ...overrides,
  };
}

export const PRODUCTION_SETTINGS: ProductionSettingsDto = { mixerCapacityKg: 20, dispatchTime: "06:30", ovens: 1, pansPerLoad: 6 };

export function ingredient(overrides: Partial<IngredientDto> = {}): IngredientDto {
  return { id: 1, name: "Bread flour", kind: "flour", waterPercent: 12, allergens: ["gluten", "wheat"], packName: "25 kg sack", packGrams: 25000, packCostCents: 2450, ...overrides };
}

export const INGREDIENTS: IngredientDto[] = [
  ingredient(),
  ingredient({ id: 2, name: "Whole milk", kind: "liquid", waterPercent: 87, allergens: ["milk"], packName: "1 gal jug", packGrams: 3900, packCostCents: 489 }),
  ingredient({ id: 4, name: "Unsalted butter", kind: "fat", waterPercent: 16, allergens: ["milk"], packName: "1 lb block", packGrams: 454, packCostCents: 520 }),
  ingredient({ id: 5, name: "Whole egg", kind: "egg", waterPercent: 76, allergens: ["egg"], packName: "5 lb liquid-egg carton", packGrams: 2268, packCostCents: 1295 }),
  ingredient({ id: 6, name: "Granulated sugar", kind: "sugar", waterPercent: 0, allergens: [], packName: "25 lb bag", packGrams: 11340, packCostCents: 1890 }),
  ingredient({ id: 7, name: "Fine sea salt", kind: "salt", waterPercent: 0, allergens: [], packName: "3 lb box", packGrams: 1361, packCostCents: 450 }),
  ingredient({ id: 8, name: "Instant yeast", kind: "leavening", waterPercent: 5, allergens: [], packName: "1 lb pack", packGrams: 454, packCostCents: 690 }),
  ingredient({ id: 10, name: "Water", kind: "liquid", waterPercent: 100, allergens: [], packName: "Tap", packGrams: 0, packCostCents: 0 }),
];

/**
 * Milk bread, version 2: flour 100, milk 58, egg 10, butter 10, sugar 10, salt 1.8, yeast 1.3 (= 191.1 %),
 * 5 % of the flour cooked with 5 times its weight of milk.
 */
export function formulaDto(overrides: Partial<FormulaDto> = {}): FormulaDto {
  return {
    id: 1,
    name: "Milk bread",
    version: 2,
    lossPercent: 2,
    ddtC: 26,
    frictionC: 12,
    targetInternalC: 89,
    paste: { flourIngredientId: 1, liquidIngredientId: 2, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
    lines: [
      { ingredientId: 1, name: "Bread flour", kind: "flour", percent: 100 },
      { ingredientId: 2, name: "Whole milk", kind: "liquid", percent: 58 },
      { ingredientId: 5, name: "Whole egg", kind: "egg", percent: 10 },
      { ingredientId: 4, name: "Unsalted butter", kind: "fat", percent: 10 },
      { ingredientId: 6, name: "Granulated sugar", kind: "sugar", percent: 10 },
      { ingredientId: 7, name: "Fine sea salt", kind: "salt", percent: 1.8 },
      { ingredientId: 8, name: "Instant yeast", kind: "leavening", percent: 1.3 },
    ],
    steps: [
      { kind: "paste", minutes: 40 },
      { kind: "mix", minutes: 15 },
      { kind: "bulk", minutes: 60 },
      { kind: "bake", minutes: 27, temperatureC: 177 },
      { kind: "cool", minutes: 30 },
    ],
    figures: { totalPercent: 191.1, flourPercent: 100, hydrationPercent: 58, effectiveHydrationPercent: 71.725, pasteSharePercent: 5, pastePercent: 30, doughYieldPerKgFlour: 1911 },
    allergens: ["gluten", "wheat", "egg", "milk"],
    productIds: [101],
    ...overrides,
  };
}

export const HISTORY: FormulaVersionDto[] = [
  { version: 2, note: "More milk", createdAt: "2025-12-01T15:00:00.000Z" },
  { version: 1, note: "First written", createdAt: "2025-11-20T15:00:00.000Z" },
];

export const FORECAST: ForecastDto = {
  from: "2025-12-03",
  to: "2025-12-09",
  days: [
    { date: "2025-12-03", doughGrams: 10169, orderedUnits: 11 },
    { date: "2025-12-04", doughGrams: 5204, orderedUnits: 6 },
    { date: "2025-12-05", doughGrams: 18995, orderedUnits: 20 },
    { date: "2025-12-06", doughGrams: 28836, orderedUnits: 31 },
    { date: "2025-12-07", doughGrams: 0, orderedUnits: 0 },
    { date: "2025-12-08", doughGrams: 0, orderedUnits: 0 },
    { date: "2025-12-09", doughGrams: 5939, orderedUnits: 6 },
  ],
  items: [
    { ingredientId: 1, name: "Bread flour", grams: 35345, packName: "25 kg sack", packGrams: 25000, packs: 2, costCents: 4900, byDay: { "2025-12-03": 5602, "2025-12-04": 2667, "2025-12-05": 9525, "2025-12-06": 14507, "2025-12-09": 3044 } },
    { ingredientId: 2, name: "Whole milk", grams: 17477, packName: "1 gal jug", packGrams: 3900, packs: 5, costCents: 2445, byDay: { "2025-12-03": 2607, "2025-12-05": 7807, "2025-12-06": 7063 } },
    { ingredientId: 10, name: "Water", grams: 348, packName: "Tap", packGrams: 0, packs: 0, costCents: 0, byDay: { "2025-12-05": 348 } },
  ],
  totalCostCents: 7345,
};
