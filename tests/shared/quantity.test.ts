import { pluralWord, quantityText, saleUnitFor, suggestPlural } from "../../shared/quantity";

// Expected plurals are those of common English usage (The Chicago Manual of Style, "Plurals": -s; -es after s, x, z,
// ch, sh; consonant + y → -ies; f → ves in the listed irregulars such as loaf → loaves; Merriam-Webster "dozen":
// after a number, "dozen" takes no -s).
describe("suggestPlural: the head noun of a sale unit takes the plural", () => {
  it.each([
    ["tray of 15 rolls", "trays of 15 rolls"],
    ["pack of 8 buns", "packs of 8 buns"],
    ["loaf", "loaves"],
    ["box", "boxes"],
    ["dozen buns", "dozen buns"],
    ["half dozen rolls", "half dozen rolls"],
    ["bag", "bags"],
    ["tray", "trays"],
    ["pastry", "pastries"],
    ["sandwich loaf", "sandwich loaves"],
    ["box of 6 muffins", "boxes of 6 muffins"],
    ["case of 24", "cases of 24"],
    ["batch", "batches"],
    ["Loaf", "Loaves"],
    ["  loaf  ", "loaves"],
    ["", ""],
  ])("%s → %s", (singular, plural) => {
    expect(suggestPlural(singular)).toBe(plural);
  });

  it("keeps an abbreviation's capitals and adds a lower-case s (common usage: \"POs\")", () => {
    expect(pluralWord("PO")).toBe("POs");
  });
});

describe("quantityText: a count in its sale unit", () => {
  const rolls = { saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls" };
  const loaf = { saleUnit: "loaf", saleUnitPlural: "loaves" };
  const buns = { saleUnit: "dozen buns", saleUnitPlural: "dozen buns" };
  it("uses the singular for exactly one and the stored plural otherwise", () => {
    expect(quantityText(1, loaf)).toBe("1 loaf");
    expect(quantityText(3, rolls)).toBe("3 trays of 15 rolls");
    expect(quantityText(2, buns)).toBe("2 dozen buns");
    expect(quantityText(0, loaf)).toBe("0 loaves");
    expect(quantityText(40, rolls)).toBe("40 trays of 15 rolls");
  });
  it("uses the owner's plural as stored, even where the suggestion differs", () => {
    expect(quantityText(2, { saleUnit: "brioche", saleUnitPlural: "brioche" })).toBe("2 brioche");
  });
  it("falls back to the suggestion for a row stored without a plural", () => {
    expect(saleUnitFor(2, { saleUnit: "loaf", saleUnitPlural: "" })).toBe("loaves");
    expect(quantityText(12, { saleUnit: "tray of 15 rolls" })).toBe("12 trays of 15 rolls");
  });
  it("writes the count with the formatter it is given", () => {
    expect(quantityText(10000, loaf, (n) => n.toLocaleString("en-US"))).toBe("10,000 loaves");
  });
});
