/** Production data shaped like the API's answers (plans, formulas, ingredients, the forecast). */
import type { PlanView, ForecastDto, ProductionSettingsDto } from "../../components/api/production";
import type { FormulaDto, IngredientDto } from "../../shared/schemas/production";
import type { FormulaVersionDto } from "../../components/api/formulas";

const COLD_ADVICE = "Colder than ice water can be: replace part of the liquid with crushed ice (weighed as liquid), let the paste cool further, or chill the flour.";

/** "2025-12-03T01:40:00.000-06:00": a time on the fixture's bake day, bakery time (CST). */
const at = (hhmm: string) => `2025-12-03T${hhmm}:00.000-06:00`;

type Entry = PlanView["timeline"][number];
const MIXER = { kind: "mixer" as const, id: 1, name: "Spiral mixer" };
const PLANETARY = { kind: "mixer" as const, id: 2, name: "60-qt planetary" };
const CREW = { kind: "crew" as const, id: 0, name: "Crew (3 people)" };
const DECK = { kind: "oven" as const, id: 1, name: "Deck oven" };
const CONVECTION = { kind: "oven" as const, id: 2, name: "Convection oven" };
const LABELS: Record<string, string> = { paste: "Cook and cool the paste", mix: "Mix", bulk: "Bulk ferment", divide: "Divide and round", shape: "Shape and pan", proof: "Final proof", wash: "Wash", cool: "Cool", heat: "Heat Convection oven" };
function step(id: string, kind: Entry["step"], from: string, to: string, over: Partial<Entry>): Entry {
  return { id, step: kind, label: LABELS[kind] ?? kind, resource: null, formulaId: null, mix: null, load: null, productIds: [], pans: 0, startsAt: at(from), endsAt: at(to), temperatureC: null, dayBefore: false, note: null, ...over };
}
const m11 = { formulaId: 1, mix: 1, productIds: [101], pans: 6 };
const m12 = { formulaId: 1, mix: 2, productIds: [101], pans: 1 };
const m31 = { formulaId: 3, mix: 1, productIds: [102], pans: 2 };

/**
 * The fixture day's one schedule (dispatch 06:30, packing 45 min from 05:45): milk bread mix 1 makes oven load 1
 * (6 pans, deck oven, 177 °C), mix 2 oven load 2 (1 pan, convection oven, 177 °C); the convection oven then
 * heats to 190 °C for the brioche, oven load 3 (2 pans). The mixes run on two mixers, dividing and shaping on
 * the crew, nothing overlapping.
 */
export const TIMELINE: Entry[] = [
  step("f1-m1-paste", "paste", "01:00", "01:40", m11),
  step("f1-m2-paste", "paste", "01:15", "01:55", m12),
  step("f1-m1-mix", "mix", "01:40", "01:55", { ...m11, resource: MIXER }),
  step("f1-m1-bulk", "bulk", "01:55", "02:55", m11),
  step("f1-m2-mix", "mix", "01:55", "02:10", { ...m12, resource: MIXER }),
  step("f3-m1-mix", "mix", "01:59", "02:19", { ...m31, resource: PLANETARY }),
  step("f1-m2-bulk", "bulk", "02:10", "03:10", m12),
  step("f3-m1-bulk", "bulk", "02:19", "03:34", m31),
  step("f1-m1-divide", "divide", "02:55", "03:10", { ...m11, resource: CREW }),
  step("f1-m2-divide", "divide", "03:10", "03:12", { ...m12, resource: CREW }),
  step("f1-m1-L1-shape", "shape", "03:12", "03:34", { ...m11, load: 1, resource: CREW }),
  step("f1-m1-L1-proof", "proof", "03:34", "04:45", { ...m11, load: 1, note: "21 min longer than the formula's 50 min: the crew is busy with other dough later." }),
  step("f3-m1-divide", "divide", "03:34", "03:40", { ...m31, resource: CREW }),
  step("f3-m1-L3-shape", "shape", "03:40", "03:46", { ...m31, load: 3, resource: CREW }),
  step("f1-m2-L2-shape", "shape", "03:46", "03:48", { ...m12, load: 2, resource: CREW }),
  step("f3-m1-L3-proof", "proof", "03:46", "04:58", { ...m31, load: 3 }),
  step("f1-m2-L2-proof", "proof", "03:48", "04:13", { ...m12, load: 2 }),
  step("f1-m2-L2-wash", "wash", "04:13", "04:18", { ...m12, load: 2 }),
  step("L2-bake", "bake", "04:20", "04:45", { formulaId: 1, load: 2, productIds: [101], pans: 1, resource: CONVECTION, label: "Bake 25 min", temperatureC: 177, note: "Convection oven: load 2 min before, unload 2 min after." }),
  step("f1-m1-L1-wash", "wash", "04:45", "04:47", { ...m11, load: 1 }),
  step("L2-cool-60", "cool", "04:47", "05:45", { formulaId: 1, load: 2, productIds: [101], pans: 1 }),
  step("heat-2-287", "heat", "04:47", "04:57", { load: 3, resource: CONVECTION, temperatureC: 190 }),
  step("L1-bake", "bake", "04:50", "05:17", { formulaId: 1, load: 1, productIds: [101], pans: 6, resource: DECK, label: "Bake 27 min", temperatureC: 177, note: "Deck oven: load 3 min before, unload 3 min after." }),
  step("f3-m1-L3-wash", "wash", "04:58", "05:03", { ...m31, load: 3 }),
  step("L3-bake", "bake", "05:05", "05:21", { formulaId: 3, load: 3, productIds: [102], pans: 2, resource: CONVECTION, label: "Bake 16 min", temperatureC: 190, note: "Convection oven: load 2 min before, unload 2 min after." }),
  step("L1-cool-25", "cool", "05:20", "05:45", { formulaId: 1, load: 1, productIds: [101], pans: 6 }),
  step("L3-cool-22", "cool", "05:23", "05:45", { formulaId: 3, load: 3, productIds: [102], pans: 2 }),
];

export const SCHEDULE: NonNullable<PlanView["schedule"]> = {
  ovenLoads: [
    { load: 1, ovenId: 1, ovenName: "Deck oven", temperatureC: 177, bakeMinutes: 27, startsAt: at("04:47"), endsAt: at("05:20"), bakeStartsAt: at("04:50"), bakeEndsAt: at("05:17"), items: [{ productId: 101, formulaId: 1, pans: 6, slots: [] }], pans: 6, usedAreaCm2: 4534, capacityAreaCm2: 9100, capacitySlots: null },
    { load: 2, ovenId: 2, ovenName: "Convection oven", temperatureC: 177, bakeMinutes: 25, startsAt: at("04:18"), endsAt: at("04:47"), bakeStartsAt: at("04:20"), bakeEndsAt: at("04:45"), items: [{ productId: 101, formulaId: 1, pans: 1, slots: ["Shelf 1"] }], pans: 1, usedAreaCm2: 756, capacityAreaCm2: null, capacitySlots: 5 },
    { load: 3, ovenId: 2, ovenName: "Convection oven", temperatureC: 190, bakeMinutes: 16, startsAt: at("05:03"), endsAt: at("05:23"), bakeStartsAt: at("05:05"), bakeEndsAt: at("05:21"), items: [{ productId: 102, formulaId: 3, pans: 2, slots: ["Shelf 1", "Shelf 2"] }], pans: 2, usedAreaCm2: 3016, capacityAreaCm2: null, capacitySlots: 5 },
  ],
  mixes: [
    { formulaId: 1, index: 1, mixerId: 1, mixerName: "Spiral mixer", startsAt: at("01:40"), endsAt: at("01:55"), pasteStartsAt: at("01:00"), dayBefore: false, pans: [{ productId: 101, pans: 6 }] },
    { formulaId: 1, index: 2, mixerId: 1, mixerName: "Spiral mixer", startsAt: at("01:55"), endsAt: at("02:10"), pasteStartsAt: at("01:15"), dayBefore: false, pans: [{ productId: 101, pans: 1 }] },
    { formulaId: 3, index: 1, mixerId: 2, mixerName: "60-qt planetary", startsAt: at("01:59"), endsAt: at("02:19"), pasteStartsAt: null, dayBefore: false, pans: [{ productId: 102, pans: 2 }] },
  ],
  conflicts: [],
  earlierStart: null,
  resources: [MIXER, PLANETARY, CREW, DECK, CONVECTION],
  dispatchAt: at("06:30"),
  packFrom: at("05:45"),
  shiftStartsAt: "2025-12-02T23:30:00.000-06:00",
  startsAt: at("01:00"),
};

/** The same day with a shift that starts at 01:40: 40 min short. */
export const LATE_SHIFT: Partial<PlanView> = {
  schedule: {
    ...SCHEDULE,
    shiftStartsAt: at("01:40"),
    conflicts: [{ kind: "shift_start", message: "The day does not fit the shift: Cook and cool the paste (Milk bread, mix 1) has to start at 1:00 AM, 40 min before the shift starts at 1:40 AM (2 steps start before the shift). Start 40 min earlier, at 1:00 AM.", minutes: 40, entryId: "f1-m1-paste" }],
    earlierStart: { minutes: 40, startsAt: at("01:00"), text: "Start 40 min earlier, at 1:00 AM." },
  },
};

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
    inputs: { roomC: 22, flourC: 20, pasteC: 30, mixerCapacityKg: 20, dispatchAt: "2025-12-03T06:30:00.000-06:00", packingMinutes: 45, packFrom: "2025-12-03T05:45:00.000-06:00", crewPeople: 3, shiftStartAt: "2025-12-02T23:30:00.000-06:00" },
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
            scheduled: { startsAt: at("01:40"), endsAt: at("01:55"), mixerName: "Spiral mixer", pasteStartsAt: at("01:00"), dayBefore: false },
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
            scheduled: { startsAt: at("01:55"), endsAt: at("02:10"), mixerName: "Spiral mixer", pasteStartsAt: at("01:15"), dayBefore: false },
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
            scheduled: { startsAt: at("01:59"), endsAt: at("02:19"), mixerName: "60-qt planetary", pasteStartsAt: null, dayBefore: false },
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
    timeline: TIMELINE,
    schedule: SCHEDULE,
    warnings: [`Milk bread, mix 2: liquid at 1.5 °C — ${COLD_ADVICE}`],
    progress: { mixes: [], waves: [] },
    changes: [],
    ...overrides,
  };
}

export const PRODUCTION_SETTINGS: ProductionSettingsDto = {
  dispatchTime: "06:30",
  shiftStart: "23:30",
  packingMinutes: 45,
  mixers: [{ id: 1, name: "Spiral mixer", capacityKg: 20 }, { id: 2, name: "60-qt planetary", capacityKg: 12 }],
  ovens: [
    { id: 1, name: "Deck oven", capacity: { kind: "area", areaCm2: 9100 }, tempChangeMinutes: 20, loadMinutes: 3, unloadMinutes: 3 },
    { id: 2, name: "Convection oven", capacity: { kind: "slots", slots: ["Shelf 1", "Shelf 2", "Shelf 3", "Shelf 4", "Shelf 5"], slotLengthMm: 460, slotWidthMm: 335 }, tempChangeMinutes: 10, loadMinutes: 2, unloadMinutes: 2 },
  ],
  crew: { people: 3, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
  retard: [],
};

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
    figures: { totalPercent: 191.1, flourPercent: 100, hydrationPercent: 58, effectiveHydrationPercent: 59.66, flourMoisturePercent: 12, pasteSharePercent: 5, pastePercent: 30, doughYieldPerKgFlour: 1911 },
    allergens: ["gluten", "wheat", "egg", "milk"],
    productIds: [101],
    ...overrides,
  };
}

export const HISTORY: FormulaVersionDto[] = [
  { version: 2, note: "More milk", editedById: 1, createdAt: "2025-12-01T15:00:00.000Z" },
  { version: 1, note: "First written", editedById: null, createdAt: "2025-11-20T15:00:00.000Z" },
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
