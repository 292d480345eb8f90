/**
 * The one place numbers are written for a person: the production screens and the production PDFs both
 * format through here, so grams, pounds and ounces, °C and °F, counts and percentages read the same everywhere.
 *
 * Exact conversion factors from NIST SP 811 (2008), Appendix B, and NIST Handbook 44 Appendix C:
 * 1 avoirdupois pound = 453.592 37 g exactly; 1 ounce = 1/16 lb = 28.349 523 125 g exactly;
 * 1 inch = 25.4 mm exactly; t(°F) = t(°C) × 9/5 + 32.
 */
import { DEFAULT_LOCALE, formatNumber, localeOr } from "./format";

export const GRAMS_PER_POUND = 453.59237;
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND / 16; // 28.349523125
export const MM_PER_INCH = 25.4;

export const gramsToOunces = (g: number) => g / GRAMS_PER_OUNCE;
export const gramsToPounds = (g: number) => g / GRAMS_PER_POUND;
export const celsiusToFahrenheit = (c: number) => (c * 9) / 5 + 32;
export const fahrenheitToCelsius = (f: number) => ((f - 32) * 5) / 9;
export const mmToInches = (mm: number) => mm / MM_PER_INCH;

export type UnitSystem = "metric" | "us";

const EPS = 1e-9;
/** Half away from zero, with a nudge so 0.5 steps that binary floating point stores as 0.4999… still round up. */
const roundTo = (x: number, step: number) => Math.round((x + Math.sign(x) * EPS) / step) * step;
/**
 * Digits in the bakery's locale (shared/format.ts formatNumber, cached), min–max decimals. The sheet's locale is
 * set by `unitsFor(system, locale)`; the four English locales Panwise offers all group with "," and mark decimals
 * with ".", so a caller without one (the schemas' messages) writes the same digits.
 */
let unitLocale: string = DEFAULT_LOCALE;
const num = (x: number, min: number, max: number) => formatNumber(x, unitLocale, min, max);
/** Run fn with this locale's digits (unitsFor's formatters do). */
function inLocale<T>(locale: string, fn: () => T): T {
  const before = unitLocale;
  unitLocale = locale;
  try {
    return fn();
  } finally {
    unitLocale = before;
  }
}

/**
 * A weight to weigh out, at the sheet's resolution: 1 g, or 0.1 g under 50 g (salt, yeast for a small mix).
 * From 10 kg it is written in kilograms with all three decimals, "11.120 kg", so the kilogram form keeps the
 * same 1 g resolution (never "11.12 kg", which would be 10 g). In US units: pounds and ounces to 0.01 oz
 * (0.28 g, so no coarser than 1 g), the ounces rounded first and carried into pounds: 907.18474 g is exactly
 * 2 lb and reads "2 lb 0 oz", never "1 lb 16 oz".
 */
export function formatMass(grams: number, system: UnitSystem): string {
  if (!Number.isFinite(grams)) return "–";
  if (system === "metric") {
    if (Math.abs(grams) >= 10000) return `${num(roundTo(grams, 1) / 1000, 3, 3)} kg`;
    return Math.abs(grams) < 50 ? `${num(roundTo(grams, 0.1), 0, 1)} g` : `${num(roundTo(grams, 1), 0, 0)} g`;
  }
  return poundsOunces(grams, 0.01);
}

/**
 * One piece's scaled (unbaked) dough weight, as a divider or bench scale is set: whole grams, or ounces to 0.1 oz
 * (with pounds from 16 oz, carried the same way): 67 g is "67 g" or "2.4 oz".
 */
export function formatPieceWeight(grams: number, system: UnitSystem): string {
  if (!Number.isFinite(grams)) return "–";
  if (system === "metric") return `${num(roundTo(grams, 1), 0, 0)} g`;
  return poundsOunces(grams, 0.1);
}

function poundsOunces(grams: number, ozStep: number): string {
  const sign = grams < 0 ? "−" : "";
  const steps = Math.round((Math.abs(grams) / GRAMS_PER_OUNCE) / ozStep + EPS);
  const perPound = Math.round(16 / ozStep);
  const lb = Math.floor(steps / perPound);
  const oz = (steps - lb * perPound) * ozStep;
  const ozText = num(Math.round(oz * 100) / 100, 0, ozStep < 0.1 ? 2 : 1);
  return lb > 0 ? `${sign}${num(lb, 0, 0)} lb ${ozText} oz` : `${sign}${ozText} oz`;
}

/**
 * A capacity or a limit rather than a weigh-out (the mixer's bowl, a sack): whole kilograms, or whole pounds.
 * 20 kg reads "20 kg" or "44 lb" (20 kg = 44.09 lb).
 */
export function formatCapacity(kg: number, system: UnitSystem): string {
  if (!Number.isFinite(kg)) return "–";
  if (system === "metric") return `${num(roundTo(kg, 0.1), 0, 1)} kg`;
  return `${num(roundTo(gramsToPounds(kg * 1000), 1), 0, 0)} lb`;
}

/** A temperature: °C to 0.1 (as measured), °F to the whole degree. 65 °C reads "65 °C" or "149 °F". */
export function formatTemperature(celsius: number, system: UnitSystem): string {
  if (!Number.isFinite(celsius)) return "–";
  if (system === "metric") return `${num(roundTo(celsius, 0.1) + 0, 0, 1)} °C`;
  return `${num(roundTo(celsiusToFahrenheit(celsius), 1) + 0, 0, 0)} °F`;
}

/** A temperature in both systems, the chosen one first: "65 °C (149 °F)" or "149 °F (65 °C)". */
export function formatTemperatureBoth(celsius: number, system: UnitSystem): string {
  const other: UnitSystem = system === "metric" ? "us" : "metric";
  return `${formatTemperature(celsius, system)} (${formatTemperature(celsius, other)})`;
}

export const tempUnitOf = (system: UnitSystem) => (system === "metric" ? "°C" : "°F");

/** A stored °C value as the number typed in this system ("22", "72"). */
export function temperatureInput(celsius: number, system: UnitSystem): string {
  return String(system === "metric" ? Math.round(celsius * 10) / 10 : Math.round(celsiusToFahrenheit(celsius)));
}

/** A typed number in this system back to °C (to 0.1), or NaN. Accepts a decimal comma. */
export function typedToCelsius(typed: string, system: UnitSystem): number {
  const t = typed.trim().replace(",", ".");
  if (!/^-?\d+(\.\d+)?$/.test(t)) return Number.NaN;
  const n = Number(t);
  return Math.round((system === "metric" ? n : fahrenheitToCelsius(n)) * 10) / 10;
}

/** Baker's percent as shown: "58 %", "1.8 %", "63.2 %". */
export function formatPercent(percent: number, digits = 1): string {
  if (!Number.isFinite(percent)) return "–";
  return `${num(percent, 0, digits)} %`;
}

/** A count and its noun, singular for exactly one: "1 pan", "2 pans", "1,200 pieces". */
export function formatCount(n: number, one: string, many: string): string {
  return `${num(n, 0, 0)} ${n === 1 ? one : many}`;
}

/** Formatters bound to a unit system and the bakery's locale (the screens hold one, the PDF makes one per sheet). */
export function unitsFor(system: UnitSystem, locale: string = DEFAULT_LOCALE) {
  const l = localeOr(locale);
  return {
    system,
    locale: l,
    mass: (grams: number) => inLocale(l, () => formatMass(grams, system)),
    piece: (grams: number) => inLocale(l, () => formatPieceWeight(grams, system)),
    capacity: (kg: number) => inLocale(l, () => formatCapacity(kg, system)),
    temp: (celsius: number) => inLocale(l, () => formatTemperature(celsius, system)),
    /** "°C" or "°F". */
    tempUnit: tempUnitOf(system),
    /** A stored °C value as the number typed in this system ("22", "72"). */
    tempInput: (celsius: number) => temperatureInput(celsius, system),
    /** A typed number in this system back to °C (to 0.1), or NaN. */
    toCelsius: (typed: string) => typedToCelsius(typed, system),
    count: (n: number, one: string, many: string) => inLocale(l, () => formatCount(n, one, many)),
    percent: (percent: number, digits = 1) => inLocale(l, () => formatPercent(percent, digits)),
    /** A plain number in the locale: "1,200". */
    number: (n: number, minDecimals = 0, maxDecimals = minDecimals) => formatNumber(n, l, minDecimals, maxDecimals),
  };
}

export type Units = ReturnType<typeof unitsFor>;
