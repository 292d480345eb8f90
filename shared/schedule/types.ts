/** The scheduler's inputs (the bakehouse, the day's formulas, products and mixes) and its outputs. */
import { STEP_LABELS, type StepKind, type StepSpec } from "../production";

// ---- inputs ------------------------------------------------------------------------------------

export interface MixerSpec {
  id: number;
  name: string;
  /** Dough per batch, kg. */
  capacityKg: number;
}

export type OvenCapacity =
  /** Usable shelf area of one load, cm²: the pans' footprints (length × width) must add up to no more. */
  | { kind: "area"; areaCm2: number }
  /** Named pan slots of one load: one pan per slot, and the pan must fit the slot (either way round). */
  | { kind: "slots"; slots: string[]; slotLengthMm: number; slotWidthMm: number };

export interface OvenSpec {
  id: number;
  name: string;
  capacity: OvenCapacity;
  /** Minutes to bring the oven from one load's temperature to a different one. */
  tempChangeMinutes: number;
  loadMinutes: number;
  unloadMinutes: number;
}

export interface CrewSpec {
  /** People on the shift who divide and shape. */
  people: number;
  /** Person-minutes to divide and round one piece (0: the formula's divide minutes per mix). */
  divideMinutesPerPiece: number;
  /** Person-minutes to shape one piece. */
  shapeMinutesPerPiece: number;
  /** Person-minutes to fill and set out one pan. */
  panMinutesPerPan: number;
}

export interface BakehouseResources {
  mixers: MixerSpec[];
  ovens: OvenSpec[];
  crew: CrewSpec;
  /** Minutes to pack and load the vans: the last cooling ends at least this long before dispatch. */
  packingMinutes: number;
  /** "03:00": when the shift starts, bakery time, the last such time before dispatch. */
  shiftStart: string;
}

export interface ScheduleFormula {
  id: number;
  name: string;
  steps: StepSpec[];
  /** Hours in the retarder when this dough is retarded overnight; null for a same-day schedule. */
  retardHours: number | null;
}

export interface ScheduleProduct {
  productId: number;
  name: string;
  formulaId: number | null;
  pans: number;
  pieces: number;
  pieceGrams: number;
  panLengthMm: number;
  panWidthMm: number;
  /** The product's own bake and cool; null takes the formula's bake step and cool step. */
  bakeTempC: number | null;
  bakeMinutes: number | null;
  coolMinutes: number | null;
}

export interface ScheduleMix {
  formulaId: number;
  /** 1-based, as on the weigh-out card. */
  index: number;
  doughGrams: number;
}

export interface ScheduleInput {
  /** The delivery date, YYYY-MM-DD. */
  date: string;
  timeZone: string;
  /** The bakery's locale for the times in notes and conflicts (shared/format.ts); en-US when left out. */
  locale?: string;
  /** "06:30", bakery time on the delivery date. */
  dispatchTime: string;
  resources: BakehouseResources;
  formulas: ScheduleFormula[];
  products: ScheduleProduct[];
  mixes: ScheduleMix[];
}

// ---- outputs -----------------------------------------------------------------------------------

export type ScheduleStep = StepKind | "retard" | "heat";
export const SCHEDULE_LABELS: Record<ScheduleStep, string> = {
  ...STEP_LABELS,
  retard: "Retard overnight",
  heat: "Change the oven temperature",
};

export type ResourceKind = "mixer" | "oven" | "crew";
export interface ResourceRef {
  kind: ResourceKind;
  id: number;
  name: string;
}

export interface ScheduleEntry {
  /** Stable key, e.g. "f1-m2-mix", "f1-m2-L3-shape", "L3-bake". */
  id: string;
  step: ScheduleStep;
  label: string;
  /** The mixer, oven or crew the step occupies; null for resting, proofing, cooling (no machine, no hands). */
  resource: ResourceRef | null;
  formulaId: number | null;
  /** The weigh-out card (mix number within its dough) the step belongs to, if any. */
  mix: number | null;
  /** The oven load the step belongs to, if any. */
  load: number | null;
  productIds: number[];
  pans: number;
  startsAt: string;
  endsAt: string;
  /** The oven temperature for a bake or a temperature change. */
  temperatureC: number | null;
  /** Done the day before (a retarded dough's mixing and shaping). */
  dayBefore: boolean;
  /** Why a resting step runs longer than the formula says, or similar. */
  note: string | null;
}

export interface OvenLoad {
  load: number;
  ovenId: number;
  ovenName: string;
  temperatureC: number;
  bakeMinutes: number;
  /** The oven is occupied from loading to the end of unloading. */
  startsAt: string;
  endsAt: string;
  bakeStartsAt: string;
  bakeEndsAt: string;
  items: { productId: number; formulaId: number; pans: number; slots: string[] }[];
  pans: number;
  usedAreaCm2: number;
  /** Area ovens: the usable shelf area; slot ovens: null. */
  capacityAreaCm2: number | null;
  /** Slot ovens: how many slots; area ovens: null. */
  capacitySlots: number | null;
}

export interface ScheduledMix {
  formulaId: number;
  index: number;
  mixerId: number;
  mixerName: string;
  startsAt: string;
  endsAt: string;
  /** When the paste for this mix is put on (null without a paste). */
  pasteStartsAt: string | null;
  dayBefore: boolean;
  /** Pans this mix's dough makes, per product. */
  pans: { productId: number; pans: number }[];
}

export interface ScheduleConflict {
  kind: "shift_start" | "no_oven" | "no_mixer" | "no_bake";
  message: string;
  /** By how much, minutes (shift start), else null. */
  minutes: number | null;
  entryId: string | null;
}

export interface DaySchedule {
  entries: ScheduleEntry[];
  ovenLoads: OvenLoad[];
  mixes: ScheduledMix[];
  conflicts: ScheduleConflict[];
  /** When the day does not fit the shift: the start that would fit. */
  earlierStart: { minutes: number; startsAt: string; text: string } | null;
  /** Lanes for the timeline: every mixer, the crew, every oven. */
  resources: ResourceRef[];
  dispatchAt: string;
  /** Packing starts here: every step ends by then. */
  packFrom: string;
  shiftStartsAt: string;
  /** The first same-day step (not counting a retarded dough's work the day before, nor its night in the retarder); null without steps. */
  startsAt: string | null;
  /** Things worth knowing that are not conflicts (a retard past 16 h, a dough with no bake step). */
  warnings: string[];
}
