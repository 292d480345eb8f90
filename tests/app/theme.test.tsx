import { contrastRatio, relativeLuminance, AA_NORMAL_TEXT } from "../../components/a11y";
import { colors, layout, textPairs } from "../../components/theme";

describe("contrast ratio (WCAG 2.1, 1.4.3)", () => {
  it("matches known values", () => {
    expect(relativeLuminance("#000000")).toBe(0);
    expect(relativeLuminance("#ffffff")).toBeCloseTo(1, 10);
    expect(contrastRatio("#000", "#fff")).toBeCloseTo(21, 5);
    expect(contrastRatio("#fff", "#000")).toBeCloseTo(21, 5);
    expect(contrastRatio("#777777", "#777777")).toBe(1);
    // The classic borderline grey: #767676 on white is just above 4.5:1.
    expect(contrastRatio("#767676", "#ffffff")).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio("#777777", "#ffffff")).toBeLessThan(4.5);
  });

  it("rejects what is not a colour", () => {
    expect(() => contrastRatio("cream", "#fff")).toThrow(/Not a hex colour/);
  });
});

describe("theme", () => {
  it.each(textPairs.map((p) => [p.fg, p.bg, p.use]))("%s on %s (%s) passes AA for normal text", (fg, bg) => {
    const ratio = contrastRatio(colors[fg as keyof typeof colors], colors[bg as keyof typeof colors]);
    expect(ratio).toBeGreaterThanOrEqual(AA_NORMAL_TEXT);
  });

  it("lists every text colour it defines", () => {
    const used = new Set(textPairs.map((p) => p.fg));
    for (const fg of ["ink", "muted", "crust", "onPrimary", "navInk", "navMuted", "sageInk", "amberInk", "dangerInk", "crustInk", "neutralInk"]) {
      expect(used.has(fg as keyof typeof colors)).toBe(true);
    }
  });

  it("keeps touch targets at 44 px or more", () => {
    expect(layout.minTouch).toBeGreaterThanOrEqual(44);
    expect(layout.tabBarHeight).toBeGreaterThanOrEqual(44);
  });

  it("form control borders stand out 3:1 from the surfaces they sit on (WCAG 1.4.11)", () => {
    expect(contrastRatio(colors.inputBorder, colors.surface)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(colors.inputBorder, colors.page)).toBeGreaterThanOrEqual(3);
  });
});
