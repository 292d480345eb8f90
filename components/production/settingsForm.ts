import { formatNum } from "../format";
import { rowFields } from "../forms/checkedSchema";
import type { ProductionSettingsBody, ProductionSettingsDto } from "../api/production";

/** 1 in² = 6.4516 cm² exactly (1 in = 2.54 cm, NIST SP 811). */
export const CM2_PER_IN2 = 6.4516;
/** A half sheet pan, 457 × 330 mm (18 × 13 in): to put a shelf area into pans a baker knows. */
export const HALF_SHEET_CM2 = (457 * 330) / 100;

export interface MixerForm {
  name: string;
  capacityKg: string;
}
export interface OvenForm {
  name: string;
  kind: "area" | "slots";
  areaCm2: string;
  slots: string;
  slotLengthMm: string;
  slotWidthMm: string;
  tempChangeMinutes: string;
  loadMinutes: string;
  unloadMinutes: string;
}
/** The production settings as typed (no React): numbers stay text until the shared schema reads them. */
export interface SettingsFormValues {
  dispatchTime: string;
  shiftStart: string;
  packingMinutes: string;
  people: string;
  divide: string;
  shape: string;
  pan: string;
  mixers: MixerForm[];
  ovens: OvenForm[];
  /** formulaId → hours typed; absent = same-day schedule. */
  retard: Record<number, string>;
}
export type CrewKey = "people" | "divide" | "shape" | "pan";

export const NEW_MIXER: MixerForm = { name: "", capacityKg: "" };
export const NEW_OVEN: OvenForm = { name: "", kind: "area", areaCm2: "", slots: "", slotLengthMm: "460", slotWidthMm: "335", tempChangeMinutes: "15", loadMinutes: "2", unloadMinutes: "2" };
/** Hours a dough waits in the retarder when it is first ticked (common practice: 8–16 h, no source). */
export const RETARD_HOURS = "12";

const dec = (t: string) => t.trim().replace(",", ".");
/** A typed decimal ("1,5") as a number, NaN when it is none. */
export const decimal = (t: string) => Number(dec(t));

export function formValues(s: ProductionSettingsDto): SettingsFormValues {
  return {
    dispatchTime: s.dispatchTime,
    shiftStart: s.shiftStart ?? "",
    packingMinutes: String(s.packingMinutes),
    people: String(s.crew.people),
    divide: String(s.crew.divideMinutesPerPiece),
    shape: String(s.crew.shapeMinutesPerPiece),
    pan: String(s.crew.panMinutesPerPan),
    mixers: s.mixers.map((m) => ({ name: m.name, capacityKg: String(m.capacityKg) })),
    ovens: s.ovens.map((o) => ({
      name: o.name,
      kind: o.capacity.kind,
      areaCm2: o.capacity.kind === "area" ? String(o.capacity.areaCm2) : "",
      slots: o.capacity.kind === "slots" ? o.capacity.slots.join(", ") : "",
      slotLengthMm: o.capacity.kind === "slots" ? String(o.capacity.slotLengthMm) : "460",
      slotWidthMm: o.capacity.kind === "slots" ? String(o.capacity.slotWidthMm) : "335",
      tempChangeMinutes: String(o.tempChangeMinutes),
      loadMinutes: String(o.loadMinutes),
      unloadMinutes: String(o.unloadMinutes),
    })),
    retard: Object.fromEntries(s.retard.map((r) => [r.formulaId, String(r.hours)])),
  };
}

/** The slot names typed, separated by commas. */
export const slotNames = (typed: string) => typed.split(",").map((x) => x.trim()).filter(Boolean);

/** What the form sends: the API's body (numbers still as typed; the schema coerces them). */
export function settingsBody(v: SettingsFormValues): ProductionSettingsBody {
  return {
    dispatchTime: v.dispatchTime.trim(),
    shiftStart: v.shiftStart.trim() ? v.shiftStart.trim() : null,
    packingMinutes: v.packingMinutes.trim(),
    mixers: v.mixers.map((m) => ({ name: m.name, capacityKg: dec(m.capacityKg) })),
    ovens: v.ovens.map((o) => ({
      name: o.name,
      capacity:
        o.kind === "area"
          ? { kind: "area" as const, areaCm2: o.areaCm2.trim() }
          : { kind: "slots" as const, slots: slotNames(o.slots), slotLengthMm: o.slotLengthMm.trim(), slotWidthMm: o.slotWidthMm.trim() },
      tempChangeMinutes: o.tempChangeMinutes.trim(),
      loadMinutes: o.loadMinutes.trim(),
      unloadMinutes: o.unloadMinutes.trim(),
    })),
    crew: { people: v.people.trim(), divideMinutesPerPiece: dec(v.divide), shapeMinutesPerPiece: dec(v.shape), panMinutesPerPan: dec(v.pan) },
    retard: Object.entries(v.retard).map(([id, hours]) => ({ formulaId: Number(id), hours: dec(hours) })),
  } as unknown as ProductionSettingsBody;
}

// ---- changes to the draft -------------------------------------------------------------------------

export function setMixer(v: SettingsFormValues, i: number, key: keyof MixerForm, text: string): Pick<SettingsFormValues, "mixers"> {
  return { mixers: v.mixers.map((m, j) => (j === i ? { ...m, [key]: text } : m)) };
}
export function setOven<K extends keyof OvenForm>(v: SettingsFormValues, i: number, key: K, value: OvenForm[K]): Pick<SettingsFormValues, "ovens"> {
  return { ovens: v.ovens.map((o, j) => (j === i ? { ...o, [key]: value } : o)) };
}
export const addMixer = (v: SettingsFormValues) => ({ mixers: [...v.mixers, { ...NEW_MIXER }] });
export const removeMixer = (v: SettingsFormValues, i: number) => ({ mixers: v.mixers.filter((_, j) => j !== i) });
export const addOven = (v: SettingsFormValues) => ({ ovens: [...v.ovens, { ...NEW_OVEN }] });
export const removeOven = (v: SettingsFormValues, i: number) => ({ ovens: v.ovens.filter((_, j) => j !== i) });

/** Retard a formula overnight (from RETARD_HOURS) or not. */
export function setRetard(v: SettingsFormValues, formulaId: number, on: boolean): Pick<SettingsFormValues, "retard"> {
  const retard = { ...v.retard };
  if (on) retard[formulaId] = RETARD_HOURS;
  else delete retard[formulaId];
  return { retard };
}
/** Where a formula's retard row is in the body (the API names its errors "retard.<index>.hours"). */
export const retardIndex = (v: SettingsFormValues, formulaId: number) => Object.keys(v.retard).map(Number).indexOf(formulaId);

// ---- words ----------------------------------------------------------------------------------------

export function mmToInchesText(mm: string): string {
  const n = Number(mm);
  return n > 0 ? `${formatNum(n / 25.4, 0, 1)} in` : "—";
}

/** "2 mixers, 2 ovens (9,100 cm² of shelf; 5 pan slots), 3 people." */
export function capacitySummary(v: SettingsFormValues): string {
  const ovens = v.ovens.map((o) => {
    if (o.kind === "area") return `${Number(o.areaCm2) > 0 ? formatNum(Number(o.areaCm2)) : "?"} cm² of shelf`;
    const n = slotNames(o.slots).length;
    return `${n} pan ${n === 1 ? "slot" : "slots"}`;
  });
  const people = Number(v.people);
  return `${v.mixers.length === 1 ? "1 mixer" : `${v.mixers.length} mixers`}, ${v.ovens.length === 1 ? "1 oven" : `${v.ovens.length} ovens`} (${ovens.join("; ")}) per load, ${people === 1 ? "1 person" : `${people > 0 ? people : "?"} people`} on the shift.`;
}

/** Every field key the API may name (up to the schema's most mixers, ovens and retarded formulas), for putting its messages beside the right inputs. */
export const SETTINGS_FIELDS: readonly string[] = [
  "dispatchTime", "shiftStart", "packingMinutes", "mixers", "ovens", "retard",
  "crew.people", "crew.divideMinutesPerPiece", "crew.shapeMinutesPerPiece", "crew.panMinutesPerPan",
  ...rowFields("mixers", 10, ["name", "capacityKg"]),
  ...rowFields("ovens", 20, ["name", "capacity.areaCm2", "capacity.slots", "capacity.slots.0", "capacity.slotLengthMm", "capacity.slotWidthMm", "tempChangeMinutes", "loadMinutes", "unloadMinutes"]),
  ...rowFields("retard", 50, ["hours"]),
];
