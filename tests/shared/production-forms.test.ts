/**
 * The production forms' pure modules (no React): the check that becomes a form's schema, the ingredient and
 * settings values ↔ API bodies, the formula editor's draft changes and the day's temperatures read back to °C.
 * Unit conversions are checked against NIST SP 811 (°F = °C × 9/5 + 32; 1 in = 25.4 mm exactly).
 */
import { checkedSchema, rowFields } from "../../components/forms/checkedSchema";
import { EMPTY_INGREDIENT, checkIngredient, ingredientValues } from "../../components/production/ingredientForm";
import { SETTINGS_FIELDS, addOven, capacitySummary, formValues, mmToInchesText, removeMixer, retardIndex, setOven, setRetard, settingsBody, slotNames } from "../../components/production/settingsForm";
import { addLine, addStep, fahrenheitHint, ingredientOptions, linesOfKind, moveStep, removeLine, setPasteOn, setStepKind } from "../../components/production/formulaDraft";
import { FORMULA_FIELDS, emptyFormula, ingredientMap } from "../../components/production/formulaForm";
import { checkReading, checkTemps, shownTemps, storedTemps } from "../../components/production/temperatures";
import { productionSettingsSchema, type IngredientDto, type ProductionSettingsDto } from "../../shared/schemas/production";
import { DEFAULT_MILK_C, DEFAULT_TAP_C } from "../../shared/production";
import { unitsFor } from "../../shared/units";

const ingredient = (over: Partial<IngredientDto>): IngredientDto =>
  ({ id: 1, name: "Bread flour", kind: "flour", waterPercent: 12, allergens: ["gluten", "wheat"], packName: "25 kg sack", packGrams: 25000, packCostCents: 2450, ...over }) as IngredientDto;

describe("checkedSchema", () => {
  const schema = checkedSchema((v: { n: string }) => (/^\d+$/.test(v.n) ? { ok: true as const, input: Number(v.n) } : { ok: false as const, fields: { "rows.0.n": "Whole numbers." } }));

  it("outputs the check's body when it passes", () => {
    expect(schema.parse({ n: "12" })).toBe(12);
  });

  it("puts each message on its field's path, the way the API names it", () => {
    const r = schema.safeParse({ n: "x" });
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues.map((i) => [i.path.join("."), i.message])).toEqual([["rows.0.n", "Whole numbers."]]);
  });

  it("refuses a check that fails without naming a field", () => {
    const silent = checkedSchema(() => ({ ok: false as const, fields: {} }));
    expect(silent.safeParse({}).success).toBe(false);
  });

  it("rowFields names every field of every row up to the most", () => {
    expect(rowFields("lines", 2, ["a", "b"])).toEqual(["lines.0.a", "lines.0.b", "lines.1.a", "lines.1.b"]);
  });
});

describe("ingredient form", () => {
  it("round-trips an ingredient: the cost in dollars, the pack in grams", () => {
    const v = ingredientValues(ingredient({}));
    expect(v.packCost).toBe("24.50");
    const r = checkIngredient(v);
    expect(r).toEqual({ ok: true, input: expect.objectContaining({ name: "Bread flour", packGrams: 25000, packCostCents: 2450, waterPercent: 12 }) });
  });

  it("names the water, the cost and the shared schema's fields", () => {
    const r = checkIngredient({ ...EMPTY_INGREDIENT, waterPercent: " ", packCost: "24.5.0" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.fields.waterPercent).toBe("Enter the water content (0 for none).");
      expect(r.fields.packCostCents).toBe("Write the cost in dollars and cents, like 24.50.");
      expect(r.fields.name).toBeTruthy();
      expect(r.fields.kind).toBeTruthy();
    }
  });

  it("reads a decimal comma in the water content", () => {
    const r = checkIngredient({ ...ingredientValues(ingredient({})), waterPercent: "87,5" });
    expect(r.ok && r.input.waterPercent).toBe(87.5);
  });
});

const SETTINGS: ProductionSettingsDto = {
  dispatchTime: "06:30",
  shiftStart: null,
  packingMinutes: 30,
  crew: { people: 3, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
  mixers: [{ name: "Spiral", capacityKg: 60 }, { name: "Planetary", capacityKg: 20 }],
  ovens: [{ name: "Deck", capacity: { kind: "slots", slots: ["Shelf 1", "Shelf 2"], slotLengthMm: 460, slotWidthMm: 335 }, tempChangeMinutes: 15, loadMinutes: 2, unloadMinutes: 2 }],
  retard: [{ formulaId: 7, hours: 14 }],
} as unknown as ProductionSettingsDto;

describe("production settings form", () => {
  it("gives back a body the API's schema takes, equal to what was loaded", () => {
    const parsed = productionSettingsSchema.parse(settingsBody(formValues(SETTINGS)));
    expect(parsed).toMatchObject({ dispatchTime: "06:30", shiftStart: null, packingMinutes: 30, mixers: SETTINGS.mixers, retard: [{ formulaId: 7, hours: 14 }] });
    expect(parsed.ovens[0].capacity).toEqual({ kind: "slots", slots: ["Shelf 1", "Shelf 2"], slotLengthMm: 460, slotWidthMm: 335 });
  });

  it("reads slot names and decimal commas as typed", () => {
    expect(slotNames(" Top, ,Middle ,Bottom")).toEqual(["Top", "Middle", "Bottom"]);
    const v = { ...formValues(SETTINGS), divide: "0,25" };
    expect(productionSettingsSchema.parse(settingsBody(v)).crew.divideMinutesPerPiece).toBe(0.25);
  });

  it("adds, changes and removes rows without touching the others", () => {
    const v = formValues(SETTINGS);
    const more = { ...v, ...addOven(v) };
    expect(more.ovens).toHaveLength(2);
    expect(more.ovens[1]).toMatchObject({ kind: "area", slotLengthMm: "460", tempChangeMinutes: "15" });
    const changed = { ...more, ...setOven(more, 1, "areaCm2", "9100") };
    expect(changed.ovens[0]).toBe(more.ovens[0]);
    expect(capacitySummary(changed)).toBe("2 mixers, 2 ovens (2 pan slots; 9,100 cm² of shelf) per load, 3 people on the shift.");
    expect(removeMixer(v, 0).mixers.map((m) => m.name)).toEqual(["Planetary"]);
  });

  it("retards a formula at 12 h when ticked and knows its row in the body", () => {
    const v = formValues(SETTINGS);
    const on = { ...v, ...setRetard(v, 3, true) };
    expect(on.retard[3]).toBe("12");
    expect(retardIndex(on, 7)).toBe(1);
    expect(setRetard(on, 7, false).retard).toEqual({ 3: "12" });
  });

  it("shows slot sides in inches (1 in = 25.4 mm) and names every field the API may send", () => {
    expect(mmToInchesText("254")).toBe("10 in");
    expect(mmToInchesText("")).toBe("—");
    expect(SETTINGS_FIELDS).toContain("ovens.19.capacity.slots.0");
    expect(SETTINGS_FIELDS).toContain("retard.49.hours");
  });
});

describe("formula draft", () => {
  const lib = [ingredient({ id: 2, name: "Whole milk", kind: "liquid", waterPercent: 87 }), ingredient({ id: 1 }), ingredient({ id: 3, name: "All-purpose flour" })];

  it("adds and removes lines and steps with fresh keys", () => {
    const v = emptyFormula();
    const lines = { ...v, ...addLine(v) }.lines;
    expect(lines).toHaveLength(2);
    expect(lines[1].key).not.toBe(lines[0].key);
    expect(removeLine({ ...v, lines }, 0).lines).toEqual([lines[1]]);
    expect({ ...v, ...addStep(v) }.steps.at(-1)).toMatchObject({ kind: "rest", minutes: "" });
  });

  it("moves a step within the list and not past its ends", () => {
    const v = emptyFormula();
    expect(moveStep(v, 0, -1)).toBeNull();
    expect(moveStep(v, v.steps.length - 1, 1)).toBeNull();
    expect(moveStep(v, 0, 1)!.steps!.slice(0, 2).map((s) => s.kind)).toEqual(["bulk", "mix"]);
  });

  it("a step turned into a bake gets 180 °C unless it has a temperature", () => {
    const v = emptyFormula();
    expect(setStepKind(v, 0, "bake").steps![0]).toMatchObject({ kind: "bake", temperatureC: "180" });
    const bake = v.steps.findIndex((s) => s.kind === "bake");
    const hot = { ...v, steps: v.steps.map((s, i) => (i === bake ? { ...s, temperatureC: "220" } : s)) };
    expect(setStepKind(hot, bake, "bake").steps![bake].temperatureC).toBe("220");
  });

  it("turning the paste off forgets it", () => {
    const v = { ...emptyFormula(), pasteOn: true, paste: { flourIngredientId: 1, liquidIngredientId: 2, flourPercent: "7", liquidRatio: "4", cookToC: "66" } };
    expect(setPasteOn(v, false).paste).toEqual({ flourIngredientId: null, liquidIngredientId: null, flourPercent: "5", liquidRatio: "5", cookToC: "65" });
  });

  it("offers flour first, then by name; the paste picks from the formula's own lines of a kind", () => {
    const options = ingredientOptions(lib);
    expect(options.map((o) => o.label)).toEqual(["All-purpose flour", "Bread flour", "Whole milk"]);
    const v = { ...emptyFormula(), lines: [{ key: "a", ingredientId: 1, percent: "100" }, { key: "b", ingredientId: 2, percent: "60" }] };
    expect(linesOfKind(v, ingredientMap(lib), options, "liquid").map((o) => o.value)).toEqual([2]);
    expect(linesOfKind(v, ingredientMap(lib), options, "flour").map((o) => o.value)).toEqual([1]);
  });

  it("hints °F under a °C field (°F = °C × 9/5 + 32)", () => {
    expect(fahrenheitHint("180")).toBe("= 356 °F");
    expect(fahrenheitHint("26,5")).toBe("= 80 °F");
    expect(fahrenheitHint(" ")).toBeUndefined();
  });

  it("names every field the API may send for a formula", () => {
    expect(FORMULA_FIELDS).toContain("lines.39.percent");
    expect(FORMULA_FIELDS).toContain("steps.29.temperatureC");
    expect(FORMULA_FIELDS).toContain("paste.cookToC");
  });
});

describe("the day's temperatures", () => {
  const us = unitsFor("us");
  const stored = storedTemps({ roomC: 22, flourC: 20, pasteC: 60, tapC: 4, milkC: null });

  it("takes the shared supply defaults a plan set before them does not carry", () => {
    expect(storedTemps({ roomC: 22, flourC: 20, pasteC: 60 })).toEqual({ roomC: 22, flourC: 20, pasteC: 60, tapC: DEFAULT_TAP_C, milkC: DEFAULT_MILK_C });
  });

  it("keeps a field left as shown at its stored °C (4 °C shows as 39 °F, which reads back as 3.9 °C)", () => {
    const shown = shownTemps(stored, us);
    expect(shown.tapC).toBe("39");
    expect(checkTemps(shown, shown, stored, us)).toEqual({ ok: true, input: stored });
    const typed = checkTemps({ ...shown, roomC: "77" }, shown, stored, us);
    expect(typed.ok && typed.input.roomC).toBe(25);
  });

  it("says the range in the reader's units and asks for a number", () => {
    const shown = shownTemps(stored, us);
    const r = checkTemps({ ...shown, tapC: "150", flourC: "warm" }, shown, stored, us);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.fields.tapC).toBe("Enter 32 °F to 140 °F.");
      expect(r.fields.flourC).toBe("Enter a temperature, e.g. 22.");
    }
  });

  it("reads an internal temperature reached back to °C, within what bread is probed at", () => {
    expect(checkReading("189", us)).toEqual({ ok: true, input: 87.2 });
    expect(checkReading("500", us)).toEqual({ ok: false, fields: { valueC: "Enter 68 °F to 248 °F." } });
    expect(checkReading("", unitsFor("metric"))).toEqual({ ok: false, fields: { valueC: "Enter the temperature reached, e.g. 92." } });
  });
});
