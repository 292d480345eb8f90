import {
  GRAMS_PER_OUNCE, GRAMS_PER_POUND, celsiusToFahrenheit, fahrenheitToCelsius, formatCapacity, formatCount, formatMass, formatPercent,
  formatPieceWeight, formatTemperature, typedToCelsius, unitsFor,
} from "../../shared/units";

describe("masses in US units: NIST Handbook 44 / SP 811, 1 lb = 453.592 37 g exactly, 1 oz = 1/16 lb", () => {
  it("carries the ounces into pounds (907.18474 g is 2 lb exactly, 1,360.78 g is 3 lb to 0.01 oz)", () => {
    expect(formatMass(907.18474, "us")).toBe("2 lb 0 oz");
    expect(formatMass(2 * GRAMS_PER_POUND, "us")).toBe("2 lb 0 oz");
    expect(formatMass(1360.78, "us")).toBe("3 lb 0 oz");
    // Just under a pound rounds up to the pound rather than reading "16 oz".
    expect(formatMass(GRAMS_PER_POUND - 0.05, "us")).toBe("1 lb 0 oz");
    expect(formatMass(GRAMS_PER_POUND - 0.2, "us")).toBe("15.99 oz");
  });

  it("never shows 16 oz or more beside a pound count, for any whole number of grams up to 50 kg", () => {
    const bad: string[] = [];
    for (let g = 1; g <= 50000; g += 1) {
      const text = formatMass(g, "us");
      const m = /^(?:([\d,]+) lb )?([\d.]+) oz$/.exec(text);
      if (!m) { bad.push(`${g}: ${text}`); continue; }
      const oz = Number(m[2]);
      const lb = m[1] ? Number(m[1].replace(/,/g, "")) : 0;
      // Read back, it is within half the last digit (0.005 oz) of the grams: no resolution lost beyond 0.01 oz.
      if (oz >= 16 || Math.abs((lb * 16 + oz) * GRAMS_PER_OUNCE - g) > 0.005 * GRAMS_PER_OUNCE + 1e-9) bad.push(`${g}: ${text}`);
    }
    expect(bad).toEqual([]);
  });

  it("known conversions: 1000 g = 2 lb 3.27 oz, 67 g = 2.36 oz, a 67 g piece is set at 2.4 oz", () => {
    expect(formatMass(1000, "us")).toBe("2 lb 3.27 oz"); // 1000 ÷ 453.59237 = 2.2046 lb
    expect(formatMass(67, "us")).toBe("2.36 oz");
    expect(formatPieceWeight(67, "us")).toBe("2.4 oz");
    expect(formatPieceWeight(900, "us")).toBe("1 lb 15.7 oz");
    expect(formatPieceWeight(907.18474, "us")).toBe("2 lb 0 oz");
    expect(formatPieceWeight(67, "metric")).toBe("67 g");
  });
});

describe("masses in grams: 1 g resolution means 1 g everywhere", () => {
  it("writes every gram, in kilograms with three decimals from 10 kg", () => {
    expect(formatMass(1234, "metric")).toBe("1,234 g");
    expect(formatMass(9999.4, "metric")).toBe("9,999 g");
    expect(formatMass(11120, "metric")).toBe("11.120 kg");
    expect(formatMass(11121, "metric")).toBe("11.121 kg");
    expect(formatMass(11119.6, "metric")).toBe("11.120 kg");
    expect(formatMass(12.34, "metric")).toBe("12.3 g");
  });

  it("no two different whole-gram weights from 10 kg to 60 kg read the same", () => {
    const seen = new Set<string>();
    for (let g = 10000; g <= 60000; g++) seen.add(formatMass(g, "metric"));
    expect(seen.size).toBe(50001);
  });
});

describe("capacities, temperatures, counts", () => {
  it("a 20 kg mixer is 44 lb (20 000 ÷ 453.592 37 = 44.09)", () => {
    expect(formatCapacity(20, "metric")).toBe("20 kg");
    expect(formatCapacity(20, "us")).toBe("44 lb");
    expect(formatCapacity(25, "us")).toBe("55 lb");
  });

  it("temperatures by t(°F) = t(°C) × 9/5 + 32 (NIST SP 811 B.8): 65 °C = 149 °F, 57 → 135, 21 → 70, 5 → 41", () => {
    expect(formatTemperature(65, "us")).toBe("149 °F");
    expect(formatTemperature(57, "us")).toBe("135 °F"); // 134.6
    expect(formatTemperature(21, "us")).toBe("70 °F"); // 69.8
    expect(formatTemperature(5, "us")).toBe("41 °F");
    expect(formatTemperature(26.25, "metric")).toBe("26.3 °C");
    expect(formatTemperature(-0.01, "metric")).toBe("0 °C");
    expect(celsiusToFahrenheit(fahrenheitToCelsius(76))).toBeCloseTo(76, 10);
    expect(typedToCelsius("75", "us")).toBe(23.9);
    expect(typedToCelsius("22,5", "metric")).toBe(22.5);
    expect(typedToCelsius("warm", "metric")).toBeNaN();
  });

  it("plurals: 1 pan, 2 pans, 0 pans", () => {
    expect(formatCount(1, "pan", "pans")).toBe("1 pan");
    expect(formatCount(2, "pan", "pans")).toBe("2 pans");
    expect(formatCount(0, "pan", "pans")).toBe("0 pans");
    expect(formatCount(1200, "piece", "pieces")).toBe("1,200 pieces");
    expect(formatPercent(60.44)).toBe("60.4 %");
  });

  it("unitsFor binds one system for a screen or a sheet", () => {
    const us = unitsFor("us");
    expect([us.mass(907.18474), us.piece(67), us.capacity(20), us.temp(65), us.tempUnit]).toEqual(["2 lb 0 oz", "2.4 oz", "44 lb", "149 °F", "°F"]);
    const metric = unitsFor("metric");
    expect([metric.mass(11120), metric.piece(67), metric.capacity(20), metric.temp(65), metric.tempUnit]).toEqual(["11.120 kg", "67 g", "20 kg", "65 °C", "°C"]);
  });
});
