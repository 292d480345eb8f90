import { RRule, Weekday as RRuleWeekday } from "rrule";
import type { Weekday } from "./calendar";

/** RFC 5545 weekly recurrences through the rrule library. Dates are calendar dates (DTSTART at 00:00Z). */
const BYDAY: Record<Weekday, RRuleWeekday> = { 1: RRule.MO, 2: RRule.TU, 3: RRule.WE, 4: RRule.TH, 5: RRule.FR, 6: RRule.SA, 7: RRule.SU };

const toUtc = (date: string) => new Date(`${date}T00:00:00Z`);

export function weeklyRule(p: { startDate: string; endDate: string | null; intervalWeeks: number; weekdays: Weekday[] }): string {
  return new RRule({
    freq: RRule.WEEKLY,
    interval: p.intervalWeeks,
    byweekday: [...p.weekdays].sort().map((d) => BYDAY[d]),
    wkst: RRule.MO,
    dtstart: toUtc(p.startDate),
    until: p.endDate ? new Date(`${p.endDate}T23:59:59Z`) : null,
  }).toString();
}

/** Occurrences of a stored rule between two dates inclusive, as YYYY-MM-DD. */
export function expandRule(rule: string, from: string, to: string): string[] {
  const r = RRule.fromString(rule);
  return r.between(toUtc(from), new Date(`${to}T23:59:59Z`), true).map((d) => d.toISOString().slice(0, 10));
}
