/** One bake day's fixed facts for the scheduler's passes: resources, the instants that bound the day, the lanes. */
import { DateTime } from "luxon";
import { formatAtOwnOffset, localeOr } from "../format";
import { MS_PER_MIN } from "./resources";
import { isoWriter, lastLocalTimeAtOrBefore } from "./time";
import type { BakehouseResources, ResourceRef, ScheduleConflict, ScheduleFormula, ScheduleInput } from "./types";

export interface Day {
  input: ScheduleInput;
  res: BakehouseResources;
  /** Epoch minutes written as an ISO instant in the bakery's zone. */
  iso: (minutes: number) => string;
  /** Epoch minutes: dispatch, the start of packing (every step ends by then) and the shift start. */
  dispatch: number;
  packFrom: number;
  shiftStart: number;
  /** "4:10 AM", or "Mon 11:50 PM" on another day than the bake day (en-US). */
  whenText: (minutes: number) => string;
  formulas: Map<number, ScheduleFormula>;
  /** Filled by the passes in turn. */
  conflicts: ScheduleConflict[];
  warnings: string[];
  crewRef: ResourceRef;
  people: number;
  mixerRefs: Map<number, ResourceRef>;
  ovenRefs: Map<number, ResourceRef>;
}

export function startDay(input: ScheduleInput): Day {
  const { resources: res } = input;
  const zone = DateTime.fromISO(input.date, { zone: input.timeZone }).zone;
  const iso = isoWriter(zone);
  const [dh, dm] = input.dispatchTime.split(":").map(Number);
  const dispatchDt = DateTime.fromISO(input.date, { zone }).set({ hour: dh, minute: dm });
  const dispatch = Math.round(dispatchDt.toMillis() / MS_PER_MIN);
  const packFrom = dispatch - Math.max(0, res.packingMinutes);
  const shiftDt = lastLocalTimeAtOrBefore(res.shiftStart, dispatchDt);
  const shiftStart = Math.round(shiftDt.toMillis() / MS_PER_MIN);
  const locale = localeOr(input.locale);
  const dayOf = (min: number) => iso(min).slice(0, 10);
  const whenText = (min: number) => formatAtOwnOffset(iso(min), dayOf(min) === input.date ? "time" : "weekdayTime", locale);

  const formulas = new Map(input.formulas.map((f) => [f.id, f]));
  const crewRef: ResourceRef = { kind: "crew", id: 0, name: `Crew (${res.crew.people} ${res.crew.people === 1 ? "person" : "people"})` };
  const people = Math.max(1, Math.floor(res.crew.people));
  const mixerRefs = new Map(res.mixers.map((m) => [m.id, { kind: "mixer" as const, id: m.id, name: m.name }]));
  const ovenRefs = new Map(res.ovens.map((o) => [o.id, { kind: "oven" as const, id: o.id, name: o.name }]));
  return { input, res, iso, dispatch, packFrom, shiftStart, whenText, formulas, conflicts: [], warnings: [], crewRef, people, mixerRefs, ovenRefs };
}
