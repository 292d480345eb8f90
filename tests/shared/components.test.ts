import { componentCards, declaredAllergens, missingDerived, resolveBake } from "../../shared/components";

describe("declaredAllergens (US FALCPA as amended by the FASTER Act of 2021; EU 1169/2011 Art. 9(1)(c) and Annex II)", () => {
  const parts = { formulaName: "Brioche", formula: ["wheat", "gluten", "egg", "milk"], components: [{ name: "Toasted sesame topping", allergens: ["sesame"] }], added: [] as string[] };

  it("is the union of the dough, the components and the product's own, in the fixed list's order", () => {
    const d = declaredAllergens({ ...parts, added: ["mustard"] });
    expect(d.declared).toEqual(["gluten", "wheat", "egg", "milk", "mustard", "sesame"]);
    expect(d.derived).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
    expect(d.added).toEqual(["mustard"]);
    expect(d.sources).toMatchObject({ sesame: ["Toasted sesame topping"], egg: ["Brioche dough"], mustard: ["Added by the bakery"] });
  });

  it("an own list never replaces the derived one, and repeating a derived allergen adds nothing", () => {
    expect(declaredAllergens({ ...parts, added: ["milk"] }).declared).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
    expect(declaredAllergens({ ...parts, added: ["milk"] }).added).toEqual([]);
    expect(declaredAllergens({ ...parts, added: [] }).declared).toContain("sesame");
  });

  it("missingDerived names what a declaration leaves out and where it comes from", () => {
    const d = declaredAllergens(parts);
    expect(missingDerived(["gluten", "wheat", "egg", "milk", "sesame", "soy"], d)).toBeNull();
    expect(missingDerived(["gluten", "wheat", "milk"], d)).toEqual({
      missing: ["egg", "sesame"],
      message: "Egg (from Brioche dough); Sesame (from Toasted sesame topping) cannot be taken off: they come from the product's ingredients. Change the formula or the component instead.",
    });
  });
});

describe("resolveBake", () => {
  const steps = [{ kind: "mix" as const, minutes: 15 }, { kind: "bake" as const, minutes: 27, temperatureC: 177 }, { kind: "cool" as const, minutes: 60 }];
  it("takes each value from the product when set, else from the formula's bake and cool steps", () => {
    expect(resolveBake({ bakeTempC: null, bakeMinutes: 16, coolMinutes: null }, steps)).toEqual({ bakeTempC: 177, bakeMinutes: 16, coolMinutes: 60 });
    expect(resolveBake({ bakeTempC: 190, bakeMinutes: null, coolMinutes: 90 }, steps)).toEqual({ bakeTempC: 190, bakeMinutes: 27, coolMinutes: 90 });
    expect(resolveBake({ bakeTempC: null, bakeMinutes: null, coolMinutes: null }, null)).toEqual({ bakeTempC: null, bakeMinutes: null, coolMinutes: null });
  });
});

describe("componentCards", () => {
  it("weighs pieces × grams per piece and pans × grams per pan, one card per kind and name", () => {
    const cards = componentCards(
      [{ productId: 1, name: "Honey-oat rolls", pieces: 150, pans: 10 }, { productId: 2, name: "Not baked today", pieces: 0, pans: 0 }],
      [
        { productId: 1, kind: "topping", name: "Honey-oat topping", ingredientId: 7, grams: 0.5, per: "piece", note: "" },
        { productId: 1, kind: "topping", name: "Honey-oat topping", ingredientId: 8, grams: 1.5, per: "piece", note: "" },
        { productId: 1, kind: "wash", name: "", ingredientId: 9, grams: 12, per: "pan", note: "" },
        { productId: 2, kind: "wash", name: "", ingredientId: 9, grams: 12, per: "pan", note: "" },
      ],
      (id) => `ingredient ${id}`,
    );
    expect(cards.map((c) => [c.key, c.totalGrams])).toEqual([["1:topping:Honey-oat topping", 300], ["1:wash:Wash", 120]]);
    expect(cards[0].lines.map((l) => [l.count, l.gramsEach, l.grams])).toEqual([[150, 0.5, 75], [150, 1.5, 225]]);
    expect(cards[1].lines[0]).toMatchObject({ per: "pan", count: 10, grams: 120 });
  });
});
