import {
  PASTE_COOK_MESSAGE, apportion, formulaFigures, formulaWarnings, iceGrams, liquidTemperature, mixLiquidLines, planDough, planLiquid, planProduct, roundGrams, validateFormula,
  type FormulaSpec, type IngredientInfo,
} from "../../shared/production";
import { liquidAdviceText } from "../../shared/cautions";
import { formulaInputSchema } from "../../shared/schemas/production";
import { GRAMS_PER_OUNCE, GRAMS_PER_POUND, celsiusToFahrenheit, fahrenheitToCelsius, formatMass, gramsToOunces, mmToInches, unitsFor } from "../../shared/units";

const lib = new Map<number, IngredientInfo>([
  [1, { id: 1, name: "Bread flour", kind: "flour", waterPercent: 12 }],
  [2, { id: 2, name: "Water", kind: "liquid", waterPercent: 100 }],
  [3, { id: 3, name: "Salt", kind: "salt", waterPercent: 0 }],
  [4, { id: 4, name: "Instant yeast", kind: "leavening", waterPercent: 5 }],
  [5, { id: 5, name: "Whole milk", kind: "liquid", waterPercent: 88 }],
  [6, { id: 6, name: "Butter", kind: "fat", waterPercent: 18 }],
  [7, { id: 7, name: "Whole egg", kind: "egg", waterPercent: 76 }],
  [8, { id: 8, name: "Sugar", kind: "sugar", waterPercent: 0 }],
]);

describe("baker's percentages against a published worked example", () => {
  /**
   * Source (from memory): the standard textbook worked example of baker's percentages (e.g. W. Gisslen,
   * Professional Baking, ch. on baker's math): flour 100 %, water 60 %, salt 2 %, yeast 1 % — with
   * 1,000 g of flour that is 600 g water, 20 g salt, 10 g yeast, 1,630 g of dough (total 163 %).
   */
  const lean: FormulaSpec = { id: 1, version: 1, name: "Lean", lossPercent: 0, ddtC: 24, frictionC: 14, paste: null, steps: [],
    lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 2, percent: 60 }, { ingredientId: 3, percent: 2 }, { ingredientId: 4, percent: 1 }] };

  it("works each ingredient out from the flour, and the flour back from the dough weight", () => {
    // 1,630 g of dough as 163 pieces of 10 g, no loss allowance.
    const products = [planProduct({ productId: 1, name: "x", units: 163, extraPans: 0, unitsPerPan: 1, piecesPerUnit: 1, pieceGrams: 10, formulaId: 1 })];
    const dough = planDough(lean, lib, products, 50, { roomC: 22, flourC: 20, pasteC: 30 });
    expect(dough.doughGrams).toBe(1630);
    expect(dough.flourGrams).toBe(1000);
    expect(dough.ingredients.map((i) => [i.name, i.grams])).toEqual([["Bread flour", 1000], ["Water", 600], ["Salt", 20], ["Instant yeast", 10]]);
    expect(formulaFigures(lean, lib)).toMatchObject({ totalPercent: 163, flourPercent: 100, hydrationPercent: 60, doughYieldPerKgFlour: 1630 });
  });

  it("adds the loss allowance on top: dough = pieces ÷ (1 − loss)", () => {
    const products = [planProduct({ productId: 1, name: "x", units: 98, extraPans: 0, unitsPerPan: 1, piecesPerUnit: 1, pieceGrams: 10, formulaId: 1 })];
    const dough = planDough({ ...lean, lossPercent: 2 }, lib, products, 50, { roomC: 22, flourC: 20, pasteC: 30 });
    expect(dough.doughGrams).toBe(1000); // 980 ÷ 0.98
  });
});

describe("desired dough temperature against a published worked example", () => {
  /**
   * Source (from memory): the usual three-factor worked example in bread-baking texts (e.g. J. Hamelman,
   * Bread): DDT 76 °F × 3 = 228; minus room 72 °F, flour 70 °F and friction 26 °F leaves water at 60 °F.
   * Panwise works in °C; the same example converted exactly must give 60 °F.
   */
  it("three factors without a paste", () => {
    const c = fahrenheitToCelsius;
    const { liquidC } = liquidTemperature(c(76), 26 * (5 / 9), { roomC: c(72), flourC: c(70), pasteC: 0 }, false);
    expect(celsiusToFahrenheit(liquidC)).toBeCloseTo(60, 0);
  });

  it("four factors with the paste", () => {
    // 26 × 4 − (24 + 22 + 12 + 30) = 16 °C
    expect(liquidTemperature(26, 12, { roomC: 24, flourC: 22, pasteC: 30 }, true)).toEqual({ liquidC: 16 });
    expect(liquidTemperature(26, 12, { roomC: 30, flourC: 28, pasteC: 60 }, true).liquidC).toBe(-26); // 104 − 130
    expect(liquidTemperature(26, 4, { roomC: 10, flourC: 8, pasteC: 20 }, true).liquidC).toBe(62); // 104 − 42
  });

  it("a °F friction habit typed as °C (26) turns 16 °C liquid into about 4 °C, and is warned", () => {
    // Demo milk bread: DDT 26 °C, room 24, flour 22, paste 30. Friction 12 °C gives 16 °C; 26 gives 2 °C.
    expect(liquidTemperature(26, 26, { roomC: 24, flourC: 22, pasteC: 30 }, true).liquidC).toBe(2);
    expect(formulaWarnings({ frictionC: 26 }).frictionC).toMatch(/26 is high for a friction factor in °C.*°F factor, in °C it is 14\.4/);
    expect(formulaWarnings({ frictionC: 12 })).toEqual({});
    expect(formulaWarnings({ frictionC: 20 })).toEqual({});
  });
});

describe("ice for the liquid (common practice: ice = W × (T_supply − T_wanted) ÷ (T_supply + 80) in °C, + 112 in °F)", () => {
  it("worked example: 10 kg water, 20 °C supply, 10 °C wanted → 1.0 kg ice; the °F form gives the same ice", () => {
    expect(iceGrams(10000, 20, 10)).toBeCloseTo(1000, 9);
    // The same temperatures in °F: 68 °F supply, 50 °F wanted: 10 000 × 18 ÷ 180 = 1000 g.
    expect(iceGrams(10000, celsiusToFahrenheit(20), celsiusToFahrenheit(10), "F")).toBeCloseTo(1000, 9);
    // And for other temperatures the two forms agree too (80 cal/g ⇔ 144 BTU/lb; 112 = 144 − 32).
    for (const [s, w] of [[24, 3], [15, 8], [30, 0]]) {
      expect(iceGrams(5000, celsiusToFahrenheit(s), celsiusToFahrenheit(w), "F")).toBeCloseTo(iceGrams(5000, s, w), 6);
    }
    expect(iceGrams(10000, 10, 20)).toBe(0);
  });

  it("a water dough: the ice replaces part of the water, by the formula", () => {
    const l = planLiquid(10, [{ ingredientId: 2, grams: 10000, water: true }], { tapC: 20 });
    expect(l).toMatchObject({ action: "ice", iceGrams: 1000, waterIngredientId: 2, chillToC: null });
    const text = liquidAdviceText(l, unitsFor("metric"), (id) => lib.get(id)!.name, false)!;
    expect(text).toBe("Weigh the water as 9,000 g of water from the tap (20 °C) + 1,000 g of crushed ice. Ice replaces water only.");
    expect(liquidAdviceText(l, unitsFor("us"), (id) => lib.get(id)!.name, false)).toBe("Weigh the water as 19 lb 13.47 oz of water from the tap (68 °F) + 2 lb 3.27 oz of crushed ice. Ice replaces water only.");
  });

  it("a milk dough without water: chill the milk, never turn it into ice or water", () => {
    const l = planLiquid(2, [{ ingredientId: 5, grams: 3000, water: false }], { tapC: 18, milkC: 4 });
    expect(l).toMatchObject({ action: "chill", iceGrams: 0, chillToC: 2, waterIngredientId: null });
    const text = liquidAdviceText(l, "metric", (id) => lib.get(id)!.name, true)!;
    expect(text).toMatch(/^Chill the whole milk to 2 °C before weighing \(it comes at 4 °C\)/);
    expect(text).not.toMatch(/crushed ice \(weighed|ice as part of the (whole )?milk|replace part of the liquid/i);
    // Colder than milk can be: as cold as it goes, never ice; the other factors come down (the paste cools further).
    const cold = planLiquid(-5, [{ ingredientId: 5, grams: 3000, water: false }], { milkC: 4 });
    expect(cold).toMatchObject({ action: "too_cold", iceGrams: 0, chillToC: 1 });
    expect(liquidAdviceText(cold, "metric", (id) => lib.get(id)!.name, true)).toMatch(/never replace it with ice or water.*let the paste cool further/);
  });

  it("milk and water: ice only the water line, by the heat balance, the milk straight from the cooler", () => {
    // W (T_tap − T) + M (T_milk − T) = I (T_tap + 80): 800 × (16 − 6) + 2000 × (4 − 6) = 4000 → I = 4000 ÷ 96 = 41.7 g
    const l = planLiquid(6, [{ ingredientId: 5, grams: 2000, water: false }, { ingredientId: 2, grams: 800, water: true }], { tapC: 16, milkC: 4 });
    expect(l).toMatchObject({ action: "ice", iceGrams: 41.7, waterIngredientId: 2, otherIngredientIds: [5] });
    expect(liquidAdviceText(l, "metric", (id) => lib.get(id)!.name, true)).toBe("Weigh the water as 758 g of water from the tap (16 °C) + 41.7 g of crushed ice and the whole milk straight from the cooler (4 °C). Ice replaces water only.");
    // Not enough water to carry the cooling: all of it as ice, and the milk chilled to T + W (80 + T) ÷ M.
    const more = planLiquid(1, [{ ingredientId: 5, grams: 5000, water: false }, { ingredientId: 2, grams: 50, water: true }], { tapC: 16, milkC: 8 });
    expect(more).toMatchObject({ action: "ice_and_chill", iceGrams: 50, chillToC: 1.8 }); // 1 + 50 × 81 ÷ 5000 = 1.81
  });

  it("too warm: never a hotter paste, never liquid above 40 °C, but a longer mix or proof", () => {
    const l = planLiquid(62, [{ ingredientId: 5, grams: 3000, water: false }], { milkC: 4 });
    expect(l).toMatchObject({ action: "too_warm", warmToC: 40 });
    const text = liquidAdviceText(l, "metric", (id) => lib.get(id)!.name, true)!;
    expect(text).toMatch(/no more than 40 °C/);
    expect(text).toMatch(/longer mix, or a longer bulk ferment and proof/);
    expect(text).not.toMatch(/paste (warmer|hotter) instead|add the paste warmer/i);
    expect(text).toMatch(/Add the paste cooled, as always, not hotter/);
    expect(liquidAdviceText(l, "us", (id) => lib.get(id)!.name, true)).toMatch(/^144 °F is warmer.*no more than 104 °F/);
  });

  it("right as it comes: nothing to say; colder supply than wanted: warm it", () => {
    expect(planLiquid(15.5, [{ ingredientId: 2, grams: 1000, water: true }], { tapC: 15 }).action).toBe("as_is");
    const warm = planLiquid(30, [{ ingredientId: 2, grams: 1000, water: true }], { tapC: 15 });
    expect(warm).toMatchObject({ action: "warm", warmToC: 30 });
    expect(liquidAdviceText(warm, "us", () => "Water", false)).toBe("Warm the liquid to 86 °F; never above 104 °F.");
  });

  it("planDough works the ice out per mix from its own final-mix water", () => {
    const lean: FormulaSpec = { id: 1, version: 1, name: "Lean", lossPercent: 0, ddtC: 24, frictionC: 14, paste: null, steps: [],
      lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 2, percent: 60 }, { ingredientId: 3, percent: 2 }, { ingredientId: 4, percent: 1 }] };
    // 16,300 g of dough in 2 mixes (10 kg mixer): 3,000 g water each. Liquid 24 × 3 − (26 + 22 + 14) = 10 °C; tap 20 °C.
    const products = [planProduct({ productId: 1, name: "x", units: 1630, extraPans: 0, unitsPerPan: 1, piecesPerUnit: 1, pieceGrams: 10, formulaId: 1 })];
    const dough = planDough(lean, lib, products, 10, { roomC: 26, flourC: 22, pasteC: 0, tapC: 20 });
    expect(dough.mixes).toHaveLength(2);
    expect(dough.mixes.map((m) => m.liquidTempC)).toEqual([10, 10]);
    expect(mixLiquidLines(dough.mixes[0].ingredients, lib)).toEqual([{ ingredientId: 2, grams: 3000, water: true }]);
    expect(dough.mixes.map((m) => m.liquid!.iceGrams)).toEqual([300, 300]); // 3000 × 10 ÷ 100
  });
});

describe("unit conversions with exact factors (NIST SP 811 Appendix B / Handbook 44)", () => {
  it("uses 1 lb = 453.592 37 g, 1 oz = 28.349 523 125 g, 1 in = 25.4 mm, °F = °C × 9/5 + 32", () => {
    expect(GRAMS_PER_POUND).toBe(453.59237);
    expect(GRAMS_PER_OUNCE).toBe(28.349523125);
    expect(gramsToOunces(453.59237)).toBe(16);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(celsiusToFahrenheit(65)).toBe(149);
    expect(mmToInches(330)).toBeCloseTo(12.99, 2);
    expect(formatMass(1000, "us")).toBe("2 lb 3.27 oz"); // 1000 g = 2.2046 lb
    expect(formatMass(67, "us")).toBe("2.36 oz");
    expect(formatMass(1234, "metric")).toBe("1,234 g");
    expect(formatMass(12.34, "metric")).toBe("12.3 g");
  });
});

describe("trade facts (common practice, no source)", () => {
  /**
   * Common practice, no source: a cooked paste of about 1 part flour to 5 parts liquid, heated to about 65 °C;
   * dinner rolls of 65–70 g, 15 to a 9 × 13 in pan (3 × 5); baked at about 177 °C (350 °F) for 25–30 min;
   * about 88–90 °C inside when done. Water contents of whole milk (~88 %), butter (~16 %) and whole egg (~76 %)
   * are USDA FoodData Central values, from memory.
   */
  const rolls: FormulaSpec = {
    id: 7, version: 3, name: "Milk bread", lossPercent: 2, ddtC: 26, frictionC: 12, targetInternalC: 89,
    paste: { flourIngredientId: 1, liquidIngredientId: 5, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
    lines: [
      { ingredientId: 1, percent: 100 }, { ingredientId: 5, percent: 60 }, { ingredientId: 7, percent: 10 },
      { ingredientId: 6, percent: 10 }, { ingredientId: 8, percent: 10 }, { ingredientId: 3, percent: 2 }, { ingredientId: 4, percent: 1.5 },
    ],
    steps: [
      { kind: "paste", minutes: 40 }, { kind: "mix", minutes: 15 }, { kind: "bulk", minutes: 60 }, { kind: "divide", minutes: 20 },
      { kind: "bench", minutes: 10 }, { kind: "shape", minutes: 20 }, { kind: "proof", minutes: 50 }, { kind: "wash", minutes: 5 },
      { kind: "bake", minutes: 27, temperatureC: 177 }, { kind: "cool", minutes: 30 },
    ],
  };

  it("a plan for trays of 15 rolls at 67 g is consistent with them", () => {
    expect(rolls.paste!.liquidRatio).toBe(5);
    expect(rolls.paste!.cookToC).toBe(65);
    expect(Math.abs(celsiusToFahrenheit(177) - 350)).toBeLessThan(1); // 177 °C = 350.6 °F
    const bake = rolls.steps.find((s) => s.kind === "bake")!;
    expect(bake.minutes).toBeGreaterThanOrEqual(25);
    expect(bake.minutes).toBeLessThanOrEqual(30);
    expect(rolls.targetInternalC).toBeGreaterThanOrEqual(88);
    expect(rolls.targetInternalC).toBeLessThanOrEqual(90);

    const product = planProduct({ productId: 1, name: "Dinner rolls", units: 10, extraPans: 1, unitsPerPan: 1, piecesPerUnit: 15, pieceGrams: 67, formulaId: 7 });
    expect(product.pans).toBe(11);
    expect(product.pieces).toBe(165); // 3 × 5 rolls in each 9×13 pan
    expect(product.pieceGrams).toBeGreaterThanOrEqual(65);
    expect(product.pieceGrams).toBeLessThanOrEqual(70);

    const dough = planDough(rolls, lib, [product], 20, { roomC: 24, flourC: 22, pasteC: 30 });
    // 165 × 67 g = 11,055 g of pieces ÷ 0.98 = 11,280.6 g of dough; total 193.5 % → 5,829.8 g of flour.
    expect(dough.doughGrams).toBe(11281);
    expect(dough.flourGrams).toBe(5830);
    expect(dough.paste).toEqual({ flourGrams: 291, liquidGrams: 1457, cookToC: 65 }); // 5 % of the flour, × 5 in milk
    expect(dough.paste!.liquidGrams / dough.paste!.flourGrams).toBeCloseTo(5, 1);
    const milk = dough.ingredients.find((i) => i.name === "Whole milk")!;
    expect(milk.pasteGrams + milk.finalMixGrams).toBe(milk.grams);
    const flour = dough.ingredients.find((i) => i.name === "Bread flour")!;
    expect(flour.pasteGrams + flour.finalMixGrams).toBe(flour.grams);
    // Mixer holds 20 kg: one mix. With an 8 kg mixer: two mixes that add up to the totals exactly.
    expect(dough.mixes).toHaveLength(1);
    const split = planDough(rolls, lib, [product], 8, { roomC: 24, flourC: 22, pasteC: 30 });
    expect(split.mixes).toHaveLength(2);
    for (const ing of split.ingredients) {
      const parts = split.mixes.map((m) => m.ingredients.find((i) => i.ingredientId === ing.ingredientId)!.grams);
      expect(Math.round(parts.reduce((a, b) => a + b, 0) * 10) / 10).toBe(ing.grams);
    }
    // Liquid temperature with the paste as a fourth factor: 26 × 4 − (24 + 22 + 12 + 30) = 16 °C.
    expect(dough.mixes[0].liquidTempC).toBe(16);
  });

  it("effective hydration by the usual convention: water in milk, egg and butter over flour, not the flour's own moisture", () => {
    const f = formulaFigures(rolls, lib);
    // Water contents from USDA FoodData Central (from memory): whole milk 88 %, unsalted butter 18 %, whole egg 76 %.
    // milk 60×0.88 + egg 10×0.76 + butter 10×0.18 = 62.2 over flour 100. Flour (12 %) and dry yeast are not counted.
    expect(f.effectiveHydrationPercent).toBeCloseTo(62.2, 6);
    expect(f.flourMoisturePercent).toBeCloseTo(12, 6);
    expect(f.hydrationPercent).toBe(60);
    expect(f.pasteSharePercent).toBe(5);
    expect(f.pastePercent).toBeCloseTo(30, 6); // 5 % flour + 25 % milk
  });
});

describe("formula checks", () => {
  it("refuses flour not adding to 100 %, bad percents, and a paste that needs more than the formula holds", () => {
    const errs = validateFormula({ lossPercent: 2, paste: null, lines: [{ ingredientId: 1, percent: 90 }, { ingredientId: 2, percent: 60 }] }, lib);
    expect(errs.lines).toMatch(/add up to 90 %.*100 %/);
    expect(validateFormula({ lossPercent: 2, paste: null, lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 2, percent: -5 }] }, lib)["lines.1.percent"]).toMatch(/more than 0/);
    expect(validateFormula({ lossPercent: 2, paste: null, lines: [{ ingredientId: 99, percent: 100 }] }, lib)["lines.0.ingredientId"]).toMatch(/not in the library/);
    const paste = validateFormula({ lossPercent: 2, paste: { flourIngredientId: 1, liquidIngredientId: 5, flourPercent: 20, liquidRatio: 5, cookToC: 65 }, lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 5, percent: 60 }] }, lib);
    expect(paste["paste.liquidRatio"]).toMatch(/needs 100 % liquid.*only 60 %/);
  });

  it("refuses a paste cooked below about 60 °C, where wheat starch does not gelatinise (common practice: 60–70 °C)", () => {
    const withCook = (cookToC: number) => validateFormula({ lossPercent: 2, paste: { flourIngredientId: 1, liquidIngredientId: 5, flourPercent: 5, liquidRatio: 5, cookToC }, lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 5, percent: 60 }] }, lib)["paste.cookToC"];
    expect(withCook(40)).toMatch(/60–100 °C.*gelatinize/);
    expect(withCook(59.9)).toBeDefined();
    expect(withCook(60)).toBeUndefined();
    expect(withCook(65)).toBeUndefined();
    // The API's schema (what the form checks too) says the same, whatever the value.
    const parsed = formulaInputSchema.safeParse({ name: "X", paste: { flourIngredientId: 1, liquidIngredientId: 5, flourPercent: 5, liquidRatio: 5, cookToC: 40 }, lines: [] });
    expect(parsed.success).toBe(false);
    expect(parsed.success ? null : parsed.error.issues.find((i) => i.path.join(".") === "paste.cookToC")?.message).toBe(PASTE_COOK_MESSAGE);
  });

  it("rounds grams to 1 g, or 0.1 g under 50 g, and apportions exactly", () => {
    expect(roundGrams(1234.5)).toBe(1235);
    expect(roundGrams(12.34)).toBe(12.3);
    expect(roundGrams(49.96)).toBe(50);
    expect(apportion(1001, 3, 1)).toEqual([334, 334, 333]);
    expect(apportion(17.5, 2, 0.1)).toEqual([8.8, 8.7]);
  });
});
