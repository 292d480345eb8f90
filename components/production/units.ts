import { useSyncExternalStore } from "react";
import { sessionStore } from "../auth/storage";
import { celsiusToFahrenheit, fahrenheitToCelsius, formatMass, formatTemperature, type UnitSystem } from "../../shared/units";

/**
 * The kitchen's units: grams and °C, or pounds/ounces and °F. One choice for every production screen,
 * remembered on this device (localStorage on the web, memory elsewhere).
 */
export const UNITS_KEY = "panwise.units.v1";

let current: UnitSystem | null = null;
const listeners = new Set<() => void>();

function read(): UnitSystem {
  if (current) return current;
  try {
    current = sessionStore().getItem(UNITS_KEY) === "us" ? "us" : "metric";
  } catch {
    current = "metric";
  }
  return current;
}

export function setUnitSystem(system: UnitSystem): void {
  current = system;
  try {
    sessionStore().setItem(UNITS_KEY, system);
  } catch {
    // Not remembered after a reload; still used now.
  }
  listeners.forEach((l) => l());
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function useUnitSystem(): [UnitSystem, (system: UnitSystem) => void] {
  const system = useSyncExternalStore(subscribe, read, read);
  return [system, setUnitSystem];
}

/** Formatters bound to a unit system. */
export function unitsFor(system: UnitSystem) {
  return {
    system,
    mass: (grams: number) => formatMass(grams, system),
    temp: (celsius: number) => formatTemperature(celsius, system),
    /** "°C" or "°F". */
    tempUnit: system === "metric" ? "°C" : "°F",
    /** A stored °C value as the number typed in this system ("22", "72"). */
    tempInput: (celsius: number) => String(system === "metric" ? Math.round(celsius * 10) / 10 : Math.round(celsiusToFahrenheit(celsius))),
    /** A typed number in this system back to °C (to 0.1), or NaN. */
    toCelsius: (typed: string) => {
      const t = typed.trim().replace(",", ".");
      if (!/^-?\d+(\.\d+)?$/.test(t)) return Number.NaN;
      const n = Number(t);
      return Math.round((system === "metric" ? n : fahrenheitToCelsius(n)) * 10) / 10;
    },
  };
}

export type Units = ReturnType<typeof unitsFor>;

export function useUnits(): Units & { setSystem: (system: UnitSystem) => void } {
  const [system, setSystem] = useUnitSystem();
  return { ...unitsFor(system), setSystem };
}

/** Baker's percent as shown: "58 %", "1.8 %", "63.2 %". */
export function formatPercent(percent: number, digits = 1): string {
  if (!Number.isFinite(percent)) return "–";
  return `${percent.toLocaleString("en-US", { maximumFractionDigits: digits })} %`;
}
