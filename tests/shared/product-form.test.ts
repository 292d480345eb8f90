/** The product form's pure module: values from a product and back, the plural that follows the sale unit, the bake hints. */
import { EMPTY_PRODUCT, PRODUCT_FIELDS, bakeText, checkProduct, componentsText, formulaDefaults, nextComponentRow, newComponentRow, valuesOf, withSaleUnit } from "../../components/screens/products/productForm";
import type { ProductDto } from "../../shared/schemas/catalog";
import type { FormulaDto } from "../../shared/schemas/production";

const PRODUCT = {
  id: 101, name: "Milk bread", description: "", saleUnit: "loaf", saleUnitPlural: "loaves", piecesPerUnit: 1, pieceGrams: 900,
  panName: "Pullman", panLengthMm: 330, panWidthMm: 100, unitsPerPan: 1, listPriceCents: 950, minQuantity: 1, maxQuantity: 40, leadDays: null,
  formulaId: 3, formulaName: "Brioche", boughtIn: false, bakeTempC: null, bakeMinutes: 35, coolMinutes: null, active: true,
  allergens: ["egg", "gluten", "milk", "sesame", "wheat"], addedAllergens: ["sesame"], allergenSources: {}, mayContain: "tree_nuts, shared fryer",
  components: [{ kind: "wash", name: "Egg wash", ingredientId: 5, ingredientName: "Whole egg", grams: 1.2, per: "piece", note: "" }],
  bake: { bakeTempC: 190, bakeMinutes: 35, coolMinutes: 30 }, photoUrl: null, photoThumbUrl: null,
} as unknown as ProductDto;

describe("product form values", () => {
  it("round-trips a product into the API's body", () => {
    const v = valuesOf(PRODUCT);
    expect(v).toMatchObject({ price: "9.50", leadDays: "", making: "formula", bakeMinutes: "35", bakeTempC: "", mayContain: ["tree_nuts"], mayContainOther: ["shared fryer"] });
    const r = checkProduct(v, "USD", { derived: ["egg", "gluten", "milk", "wheat"] });
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.input).toMatchObject({ priceCents: 950, leadDays: null, formulaId: 3, boughtIn: false, bakeTempC: null, bakeMinutes: 35, allergens: ["gluten", "wheat", "egg", "milk", "sesame"], components: [{ kind: "wash", grams: 1.2, per: "piece" }] });
  });

  it("a component line without grams is named on its row", () => {
    const v = { ...valuesOf(PRODUCT), components: [newComponentRow({ ingredientId: 5 })] };
    const r = checkProduct(v);
    expect(!r.ok && r.fields["components.0.grams"]).toBe("Enter the grams, e.g. 2 or 1.5.");
    expect(PRODUCT_FIELDS).toContain("components.29.note");
  });

  it("the next component line carries on the last one's kind, name and per", () => {
    expect(nextComponentRow([])).toMatchObject({ kind: "topping", name: "", per: "piece" });
    const row = nextComponentRow([newComponentRow({ kind: "wash", name: "Egg wash", per: "pan", grams: "3" })]);
    expect(row).toMatchObject({ kind: "wash", name: "Egg wash", per: "pan", grams: "" });
  });

  it("the plural follows the singular until the owner writes their own", () => {
    const a = withSaleUnit(EMPTY_PRODUCT, "loaf");
    expect(a.saleUnitPlural).toBe("loaves");
    const b = withSaleUnit(a, "tray of 15 rolls");
    expect(b.saleUnitPlural).toBe("trays of 15 rolls");
    expect(withSaleUnit({ saleUnit: "loaf", saleUnitPlural: "loafs please" }, "bun").saleUnitPlural).toBe("loafs please");
  });

  it("hints what a blank bake field takes from the formula", () => {
    expect(formulaDefaults(undefined).bake).toBe("Blank: the formula's.");
    const f = { steps: [{ kind: "bake", minutes: 16, temperatureC: 190 }] } as unknown as FormulaDto;
    expect(formulaDefaults(f)).toEqual({ temp: "Blank: the formula's 190 °C.", bake: "Blank: the formula's 16 min.", cool: "The formula has no cool step." });
  });

  it("says the bake and the components in words", () => {
    expect(bakeText(PRODUCT)).toBe("35 min at 190 °C, then 30 min cooling");
    expect(bakeText({ bake: { bakeTempC: null, bakeMinutes: null, coolMinutes: null } })).toBe("No bake step in the formula");
    expect(componentsText(PRODUCT)).toBe("Egg wash: Whole egg 1.2 g per piece");
  });
});
