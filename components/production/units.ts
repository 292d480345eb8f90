import { useSyncExternalStore } from "react";
import { sessionStore } from "../auth/storage";
import { unitsFor, type Units, type UnitSystem } from "../../shared/units";
import { currentLocale } from "../format";

// The formatters live in shared/units.ts (the PDFs use the same ones); this module only remembers the choice.
export { formatPercent, unitsFor, type Units } from "../../shared/units";

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

export function useUnits(): Units & { setSystem: (system: UnitSystem) => void } {
  const [system, setSystem] = useUnitSystem();
  return { ...unitsFor(system, currentLocale()), setSystem };
}
