import { DEFAULT_MILK_C, DEFAULT_TAP_C } from "../../shared/production";
import type { Units } from "../../shared/units";
import type { FieldErrors } from "../../shared/errors";
import type { CheckResult } from "../forms/checkedSchema";

/** The day's measured temperatures, in °C, as the bake day's PUT takes them. */
export type TempKey = "roomC" | "flourC" | "pasteC" | "tapC" | "milkC";
export type Temps = Record<TempKey, number>;
/** As typed, in the reader's units. */
export type TempValues = Record<TempKey, string>;

export const TEMP_FIELDS: { key: TempKey; label: string; hint: string; min: number; max: number; testID: string }[] = [
  { key: "roomC", label: "Room", hint: "The bakery, by the mixer.", min: -10, max: 50, testID: "temp-room" },
  { key: "flourC", label: "Flour", hint: "Stick the probe in the bin.", min: -10, max: 50, testID: "temp-flour" },
  { key: "pasteC", label: "Paste", hint: "When it goes into the mix.", min: 0, max: 100, testID: "temp-paste" },
  // Supply temperatures: what the liquid is before it is iced, chilled or warmed (shared/production.ts planLiquid).
  { key: "tapC", label: "Tap water", hint: "As it runs cold from the tap: for the ice.", min: 0, max: 60, testID: "temp-tap" },
  { key: "milkC", label: "Milk", hint: "Straight from the cooler.", min: -1, max: 40, testID: "temp-milk" },
];

/** The stored temperatures; supply temperatures a plan frozen before them does not carry are the shared defaults. */
export function storedTemps(inputs: { roomC: number; flourC: number; pasteC: number; tapC?: number | null; milkC?: number | null }): Temps {
  return { roomC: inputs.roomC, flourC: inputs.flourC, pasteC: inputs.pasteC, tapC: inputs.tapC ?? DEFAULT_TAP_C, milkC: inputs.milkC ?? DEFAULT_MILK_C };
}

/** The stored temperatures as the inputs show them, in the reader's units. */
export function shownTemps(stored: Temps, units: Pick<Units, "tempInput">): TempValues {
  return Object.fromEntries(TEMP_FIELDS.map((f) => [f.key, units.tempInput(stored[f.key])])) as TempValues;
}

/**
 * The typed temperatures read back to °C, each within its range. A field left as shown keeps its stored °C
 * (4 °C shows as 39 °F, which would read back as 3.9 °C).
 */
export function checkTemps(values: TempValues, shown: TempValues, stored: Temps, units: Pick<Units, "toCelsius" | "temp">): CheckResult<Temps> {
  const fields: FieldErrors = {};
  const out = {} as Temps;
  for (const f of TEMP_FIELDS) {
    const c = values[f.key] === shown[f.key] ? stored[f.key] : units.toCelsius(values[f.key]);
    if (Number.isNaN(c)) fields[f.key] = "Enter a temperature, e.g. 22.";
    else if (c < f.min || c > f.max) fields[f.key] = `Enter ${units.temp(f.min)} to ${units.temp(f.max)}.`;
    else out[f.key] = c;
  }
  return Object.keys(fields).length ? { ok: false, fields } : { ok: true, input: out };
}

/** Bread is probed between about 20 and 120 °C (the API refuses anything else). */
export const INTERNAL_MIN_C = 20;
export const INTERNAL_MAX_C = 120;

/** An internal temperature reached, as typed in the reader's units, read back to °C (keyed as the API names it). */
export function checkReading(typed: string, units: Pick<Units, "toCelsius" | "temp" | "tempInput">): CheckResult<number> {
  const c = units.toCelsius(typed);
  if (Number.isNaN(c)) return { ok: false, fields: { valueC: `Enter the temperature reached, e.g. ${units.tempInput(92)}.` } };
  if (c < INTERNAL_MIN_C || c > INTERNAL_MAX_C) return { ok: false, fields: { valueC: `Enter ${units.temp(INTERNAL_MIN_C)} to ${units.temp(INTERNAL_MAX_C)}.` } };
  return { ok: true, input: c };
}
