import { DateTime } from "luxon";
import { DEFAULT_LOCALE, formatDateTimeIn } from "./format";

/** ISO weekday numbers as luxon and ISO 8601 use them: 1 = Monday … 7 = Sunday. */
export const WEEKDAYS = [1, 2, 3, 4, 5, 6, 7] as const;
export type Weekday = (typeof WEEKDAYS)[number];
export const WEEKDAY_SHORT: Record<Weekday, string> = { 1: "Mon", 2: "Tue", 3: "Wed", 4: "Thu", 5: "Fri", 6: "Sat", 7: "Sun" };
export const WEEKDAY_LONG: Record<Weekday, string> = { 1: "Monday", 2: "Tuesday", 3: "Wednesday", 4: "Thursday", 5: "Friday", 6: "Saturday", 7: "Sunday" };

export interface CalendarSettings {
  timeZone: string;
  /** The bakery's locale, for the words only (shared/format.ts); en-US when left out. */
  locale?: string;
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

/**
 * The dates Panwise works with anywhere (API input, forms): 2000-01-01 to 2099-12-31. A bakery orders
 * weeks ahead and keeps a few years of history, so a century is ample; everything outside is a typo
 * or an attack, and refusing it keeps every date four-digit and every range small.
 */
export const DATE_MIN = "2000-01-01";
export const DATE_MAX = "2099-12-31";
/** The longest run of dates dateRange builds (a hard ceiling; the calendar asks for at most 120 days). */
export const MAX_RANGE_DAYS = 400;

const DAY_MS = 86_400_000;

function utcDate(date: string): DateTime {
  if (!isCalendarDate(date)) throw new RangeError(`Not a YYYY-MM-DD calendar date: ${JSON.stringify(String(date).slice(0, 40))}`);
  return DateTime.fromISO(date, { zone: "UTC" });
}

/** Whole days from one YYYY-MM-DD date to another (negative when `to` is earlier): arithmetic on UTC midnights. */
export function daysBetween(from: string, to: string): number {
  return Math.round((utcDate(to).toMillis() - utcDate(from).toMillis()) / DAY_MS);
}

/** Within DATE_MIN..DATE_MAX, compared as day counts. */
export function isSupportedDate(date: string): boolean {
  return isCalendarDate(date) && daysBetween(DATE_MIN, date) >= 0 && daysBetween(date, DATE_MAX) >= 0;
}

export function weekdayOf(date: string): Weekday {
  return DateTime.fromISO(date, { zone: "UTC" }).weekday as Weekday;
}

/**
 * The date `days` days later (or earlier). Past 9999-12-31 luxon writes "+010000-01-01", which sorts
 * before "9999-12-31" as a string (from memory of ISO 8601's expanded years; seen on this machine), so a
 * result outside the years 0000–9999 is refused rather than returned.
 */
export function addDays(date: string, days: number): string {
  if (!Number.isSafeInteger(days)) throw new RangeError(`Not a whole number of days: ${days}`);
  const d = utcDate(date).plus({ days });
  if (!d.isValid || d.year < 0 || d.year > 9999) throw new RangeError(`${date} ${days < 0 ? "-" : "+"} ${Math.abs(days)} days is outside the years 0000–9999.`);
  return d.toISODate()!;
}

/**
 * Dates from..to inclusive; empty when `to` is before `from`. The length is worked out first from day
 * counts, and a span longer than `maxDays` throws before anything is built.
 */
export function dateRange(from: string, to: string, maxDays: number = MAX_RANGE_DAYS): string[] {
  const span = daysBetween(from, to);
  if (span < 0) return [];
  if (span + 1 > maxDays) throw new RangeError(`${from} to ${to} is ${span + 1} days, more than the ${maxDays} days a range may hold.`);
  const start = utcDate(from);
  return Array.from({ length: span + 1 }, (_, i) => start.plus({ days: i }).toISODate()!);
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
  else if (daysBetween(today, date) > settings.horizonDays) reason = "beyond_horizon";
  return { date, orderable: reason === null, reason, cutoffAt: cutoff.toISO()! };
}

/** "Tue, Jun 9, 2:00 PM CDT" (en-US; "Tue 9 Jun, 14:00 GMT-5" in en-GB): a cut-off as the bakery's people read it, in the bakery's locale. */
export function formatLocal(instant: string | DateTime, timeZone: string, locale: string = DEFAULT_LOCALE): string {
  const dt = typeof instant === "string" ? DateTime.fromISO(instant, { setZone: true }).setZone(timeZone) : instant.setZone(timeZone);
  return formatDateTimeIn(dt, "dayTimeZone", locale);
}
