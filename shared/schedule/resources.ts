/** Constants and small rules about pans, ovens and bake times the scheduler and its callers share. */
import type { OvenSpec, ScheduleFormula, ScheduleProduct } from "./types";

export const EPS = 1e-9;
export const MS_PER_MIN = 60_000;
/** Retard window, common practice (no source): shaped rolls at about 2–4 °C for 8–16 h. */
export const RETARD_HOURS = { min: 8, max: 16 } as const;
/** A formula without a mix step still gets one on every card (common practice, no source). */
export const DEFAULT_MIX_MINUTES = 15;

/** "40 min", "1 h", "1 h 40 min". */
export function minutesText(n: number): string {
  const m = Math.round(n);
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  const r = m % 60;
  return r ? `${h} h ${r} min` : `${h} h`;
}

/** The area of a pan's footprint, cm² (mm × mm ÷ 100). */
export const panAreaCm2 = (lengthMm: number, widthMm: number) => (lengthMm * widthMm) / 100;

/** Does a pan fit one slot, either way round? */
export function panFitsSlot(lengthMm: number, widthMm: number, slotLengthMm: number, slotWidthMm: number): boolean {
  return (lengthMm <= slotLengthMm && widthMm <= slotWidthMm) || (lengthMm <= slotWidthMm && widthMm <= slotLengthMm);
}

/** Can one pan of this size go into this oven at all? */
export function panFitsOven(lengthMm: number, widthMm: number, oven: Pick<OvenSpec, "capacity">): boolean {
  const c = oven.capacity;
  if (c.kind === "area") return panAreaCm2(lengthMm, widthMm) <= c.areaCm2 + EPS;
  return c.slots.length > 0 && panFitsSlot(lengthMm, widthMm, c.slotLengthMm, c.slotWidthMm);
}

/** A product's bake temperature, bake minutes and cool minutes: its own, else its formula's bake and cool steps. */
export function resolveBake(p: Pick<ScheduleProduct, "bakeTempC" | "bakeMinutes" | "coolMinutes">, f: Pick<ScheduleFormula, "steps"> | undefined) {
  const bake = f?.steps.find((s) => s.kind === "bake");
  const cool = f?.steps.find((s) => s.kind === "cool");
  return {
    tempC: p.bakeTempC ?? bake?.temperatureC ?? null,
    bakeMinutes: p.bakeMinutes ?? (bake && bake.minutes > 0 ? bake.minutes : null),
    coolMinutes: p.coolMinutes ?? cool?.minutes ?? 0,
  };
}

export function capacityOf(o: OvenSpec): number {
  return o.capacity.kind === "area" ? o.capacity.areaCm2 : o.capacity.slots.length * panAreaCm2(o.capacity.slotLengthMm, o.capacity.slotWidthMm);
}

export function loadNote(o: OvenSpec): string | null {
  const parts = [o.loadMinutes > 0 ? `load ${minutesText(o.loadMinutes)} before` : "", o.unloadMinutes > 0 ? `unload ${minutesText(o.unloadMinutes)} after` : ""].filter(Boolean);
  return parts.length ? `${o.name}: ${parts.join(", ")}.` : null;
}
