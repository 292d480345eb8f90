/**
 * Exact conversion factors from NIST SP 811 (2008), Appendix B, and NIST Handbook 44 Appendix C:
 * 1 avoirdupois pound = 453.592 37 g exactly; 1 ounce = 1/16 lb = 28.349 523 125 g exactly;
 * 1 inch = 25.4 mm exactly; t(°F) = t(°C) × 9/5 + 32.
 */
export const GRAMS_PER_POUND = 453.59237;
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND / 16; // 28.349523125
export const MM_PER_INCH = 25.4;

export const gramsToOunces = (g: number) => g / GRAMS_PER_OUNCE;
export const gramsToPounds = (g: number) => g / GRAMS_PER_POUND;
export const celsiusToFahrenheit = (c: number) => (c * 9) / 5 + 32;
export const fahrenheitToCelsius = (f: number) => ((f - 32) * 5) / 9;
export const mmToInches = (mm: number) => mm / MM_PER_INCH;

export type UnitSystem = "metric" | "us";

/** Grams shown the way the baker reads them: "1,234 g" / "2 lb 11.5 oz" (or "0.7 oz" under a pound). */
export function formatMass(grams: number, system: UnitSystem): string {
  if (system === "metric") {
    if (grams >= 10000) return `${(grams / 1000).toLocaleString("en-US", { maximumFractionDigits: 2 })} kg`;
    return `${grams.toLocaleString("en-US", { maximumFractionDigits: grams < 50 ? 1 : 0 })} g`;
  }
  const lb = Math.floor(gramsToPounds(grams));
  const oz = gramsToOunces(grams - lb * GRAMS_PER_POUND);
  const ozText = oz.toLocaleString("en-US", { maximumFractionDigits: oz < 10 ? 2 : 1 });
  return lb > 0 ? `${lb} lb ${ozText} oz` : `${ozText} oz`;
}

export function formatTemperature(celsius: number, system: UnitSystem): string {
  return system === "metric" ? `${Math.round(celsius * 10) / 10} °C` : `${Math.round(celsiusToFahrenheit(celsius))} °F`;
}
