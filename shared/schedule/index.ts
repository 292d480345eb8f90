/**
 * One schedule for the bake day: every mix (one weigh-out card each) on a mixer, dividing and shaping on the
 * crew, the shaped pans in oven loads on the ovens, cooling, all worked backwards from dispatch less the
 * packing time, so that no mixer, oven or the crew is booked twice at once.
 *
 * Pure: no I/O. Inside, instants are epoch minutes; the bakery's IANA zone (through luxon) decides dispatch,
 * the shift start and the offsets written into the ISO instants that come out.
 *
 * The model, in the baker's words:
 * - A dough's mixes are the weigh-out cards (planDough splits it by the largest mixer). Each mix is one mix
 *   step on one mixer that holds it; the paste is cooked and cooled for that mix and goes in at its start.
 *   Steps that stay in the bowl right after mixing (a rest before kneading, kneading) keep the mixer busy.
 * - Each mix's dough is bulk fermented and divided as one; its pans are shaped in portions, one per oven load
 *   they go into, so each portion's proof ends as its load goes in.
 * - One oven load = pans that fit one oven's usable shelf area (or its named pan slots, each pan in a slot it
 *   fits) at one temperature and bake time. Loading and unloading take the oven's own minutes; a load at a
 *   different temperature from the next one on that oven leaves the oven's temperature-change time between.
 * - The crew works as one team: dividing and shaping take person-minutes per piece (and per pan for panning),
 *   divided by the people on the shift; one such step at a time.
 * - Cooling follows the bake (per product); every cooling ends by dispatch less the packing time.
 * - A formula set to retard overnight is mixed and shaped the day before; the shaped pans go into the retarder
 *   and are proofed and baked from it (common practice, no source: about 2–4 °C for 8–16 h).
 * Where a resource is busy, a step moves earlier and the resting step after it runs longer (said in its note).
 * The schedule is the latest one this greedy placement finds; if it starts before the shift, the plan names
 * the first step that does and by how much, and offers the earlier start.
 */
import { placeChains } from "./backward";
import { startDay } from "./context";
import { writeEntries } from "./output";
import { planOvenLoads } from "./ovens";
import { portionMixes } from "./portions";
import { fitShift } from "./shift";
import type { DaySchedule, ResourceRef, ScheduleInput } from "./types";

export * from "./types";
export { RETARD_HOURS, minutesText, panAreaCm2, panFitsOven, panFitsSlot, resolveBake } from "./resources";

export function scheduleDay(input: ScheduleInput): DaySchedule {
  const day = startDay(input);
  const { drafts, heats, loadNo } = planOvenLoads(day);
  const { mixPortions, mixesByFormula } = portionMixes(input, drafts);
  const { done, assumed } = placeChains(day, mixesByFormula, mixPortions, loadNo);
  const { entries, startOf, ovenLoads, scheduledMixes } = writeEntries(day, { done, assumed, mixPortions, drafts, heats, loadNo });
  const { first, earlierStart } = fitShift(day, entries, startOf);

  const { iso, crewRef, mixerRefs, ovenRefs } = day;
  const lanes: ResourceRef[] = [...mixerRefs.values(), crewRef, ...ovenRefs.values()];
  return {
    entries,
    ovenLoads,
    mixes: scheduledMixes.sort((a, b) => a.formulaId - b.formulaId || a.index - b.index),
    conflicts: day.conflicts,
    earlierStart,
    resources: lanes,
    dispatchAt: iso(day.dispatch),
    packFrom: iso(day.packFrom),
    shiftStartsAt: iso(day.shiftStart),
    startsAt: first ? first.startsAt : null,
    warnings: day.warnings,
  };
}
