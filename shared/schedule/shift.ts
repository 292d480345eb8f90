/** Pass E: does the day fit the shift? If not, a shift_start conflict and the earlier start that would fit. */
import type { Day } from "./context";
import { minutesText } from "./resources";
import type { DaySchedule, ScheduleEntry } from "./types";

export interface ShiftFit {
  /** The first same-day step, with its start in epoch minutes; null without steps. */
  first: (ScheduleEntry & { _start: number }) | null;
  earlierStart: DaySchedule["earlierStart"];
}

export function fitShift(day: Day, entries: ScheduleEntry[], startOf: number[]): ShiftFit {
  const { shiftStart, formulas, whenText, conflicts, iso } = day;
  // The retard itself runs overnight from the day before: the day's own work starts after it.
  let firstAt = -1;
  let count = 0;
  for (let i = 0; i < entries.length; i++) {
    if (entries[i].dayBefore || entries[i].step === "retard") continue;
    if (firstAt < 0) firstAt = i;
    if (startOf[i] < shiftStart) count++;
  }
  const first = firstAt >= 0 ? { ...entries[firstAt], _start: startOf[firstAt] } : null;
  let earlierStart: DaySchedule["earlierStart"] = null;
  if (first && first._start < shiftStart) {
    const minutes = shiftStart - first._start;
    const fname = first.formulaId ? formulas.get(first.formulaId)?.name : null;
    const what = `${first.label}${fname ? ` (${fname}${first.mix ? `, mix ${first.mix}` : ""}${first.load ? `, oven load ${first.load}` : ""})` : ""}`;
    const text = `Start ${minutesText(minutes)} earlier, at ${whenText(first._start)}.`;
    conflicts.unshift({
      kind: "shift_start",
      message: `The day does not fit the shift: ${what} has to start at ${whenText(first._start)}, ${minutesText(minutes)} before the shift starts at ${whenText(shiftStart)}${count > 1 ? ` (${count} steps start before the shift)` : ""}. ${text}`,
      minutes, entryId: first.id,
    });
    earlierStart = { minutes, startsAt: iso(first._start), text };
  }
  return { first, earlierStart };
}
