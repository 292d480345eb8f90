import { DateTime } from "luxon";

/** ISO weekday numbers as luxon and ISO 8601 use them: 1 = Monday … 7 = Sunday. */
export const WEEKDAYS = [1, 2, 3, 4, 5, 6, 7] as const;
export type Weekday = (typeof WEEKDAYS)[number];
export const WEEKDAY_SHORT: Record<Weekday, string> = { 1: "Mon", 2: "Tue", 3: "Wed", 4: "Thu", 5: "Fri", 6: "Sat", 7: "Sun" };
export const WEEKDAY_LONG: Record<Weekday, string> = { 1: "Monday", 2: "Tuesday", 3: "Wednesday", 4: "Thursday", 5: "Friday", 6: "Saturday", 7: "Sunday" };

export interface CalendarSettings {
  timeZone: string;
  /** Weekdays the bakery delivers on. */
  deliveryWeekdays: Weekday[];
  /** Local time of the cut-off, "HH:mm". */
  cutoffTime: string;
  /** Days before delivery the cut-off falls on (1 = the day before). */
  leadDays: number;
  /** Dates the bakery is closed, YYYY-MM-DD. */
  closures: string[];
  /** How many days ahead orders may be placed. */
  horizonDays: number;
}

export type NotOrderableReason = "not_delivery_day" | "closed" | "past_cutoff" | "beyond_horizon";

export const REASON_TEXT: Record<NotOrderableReason, string> = {
  not_delivery_day: "No delivery on this day",
  closed: "The bakery is closed",
  past_cutoff: "Past the cut-off",
  beyond_horizon: "Too far ahead to order yet",
};

/** A strict calendar-date check: "2026-02-30" and "2026-2-3" are not dates. */
export function isCalendarDate(value: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  return DateTime.fromISO(value, { zone: "UTC" }).isValid;
}

export function weekdayOf(date: string): Weekday {
  return DateTime.fromISO(date, { zone: "UTC" }).weekday as Weekday;
}

export function addDays(date: string, days: number): string {
  return DateTime.fromISO(date, { zone: "UTC" }).plus({ days }).toISODate()!;
}

/** Dates from..to inclusive. */
export function dateRange(from: string, to: string): string[] {
  const out: string[] = [];
  for (let d = from; d <= to; d = addDays(d, 1)) out.push(d);
  return out;
}

/** Today's date in the bakery's zone at the given instant. */
export function localToday(now: Date, timeZone: string): string {
  return DateTime.fromJSDate(now, { zone: timeZone }).toISODate()!;
}

/**
 * The cut-off instant for a delivery date: the cut-off time, on the delivery date minus the lead days,
 * in the bakery's zone. luxon resolves the wall-clock time through the IANA rules, so the UTC offset
 * is right on either side of a daylight-saving change.
 */
export function cutoffFor(deliveryDate: string, settings: Pick<CalendarSettings, "timeZone" | "cutoffTime" | "leadDays">, productLeadDays?: number | null): DateTime {
  const lead = Math.max(settings.leadDays, productLeadDays ?? 0);
  const [hour, minute] = settings.cutoffTime.split(":").map(Number);
  return DateTime.fromISO(deliveryDate, { zone: settings.timeZone }).minus({ days: lead }).set({ hour, minute, second: 0, millisecond: 0 });
}

export interface DateStatus {
  date: string;
  orderable: boolean;
  reason: NotOrderableReason | null;
  /** ISO 8601 with the bakery's offset. */
  cutoffAt: string;
}

/** Why (or whether) an account can order for a date now. Route days null = every bakery delivery day. */
export function dateStatus(date: string, settings: CalendarSettings, now: Date, routeWeekdays?: Weekday[] | null): DateStatus {
  const cutoff = cutoffFor(date, settings);
  const weekday = weekdayOf(date);
  const today = localToday(now, settings.timeZone);
  let reason: NotOrderableReason | null = null;
  if (!settings.deliveryWeekdays.includes(weekday) || (routeWeekdays && !routeWeekdays.includes(weekday))) reason = "not_delivery_day";
  else if (settings.closures.includes(date)) reason = "closed";
  else if (now.getTime() >= cutoff.toMillis()) reason = "past_cutoff";
  else if (date > addDays(today, settings.horizonDays)) reason = "beyond_horizon";
  return { date, orderable: reason === null, reason, cutoffAt: cutoff.toISO()! };
}

/** "Tue 9 Jun, 14:00 CDT": a cut-off as the bakery's people read it. */
export function formatLocal(instant: string | DateTime, timeZone: string): string {
  const dt = typeof instant === "string" ? DateTime.fromISO(instant, { setZone: true }).setZone(timeZone) : instant.setZone(timeZone);
  return dt.toFormat("ccc d LLL, HH:mm ZZZZ");
}
