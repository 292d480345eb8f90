/**
 * Dates, times and numbers on the screens, always in the bakery's own locale and time zone when we know them.
 * Everything goes through shared/format.ts (Intl); the locale is the bakery's `locale` setting, learned from
 * the bakery query (components/api/bakery.ts sets it here when it loads) and en-US until then. Components that
 * must redraw when it changes use `useFormat()` (components/api/bakery.ts).
 */
import { DEFAULT_LOCALE, formatCalendarDate, formatInstant, formatNumber, hourIn, localeOr } from "../shared/format";

let displayLocale: string = DEFAULT_LOCALE;
/** The bakery's locale for every screen (the bakery query calls this when it loads). */
export function setDisplayLocale(tag: string | null | undefined): void {
  displayLocale = localeOr(tag);
}
/** The locale screens format with now: the bakery's, or en-US until the bakery has loaded. */
export function currentLocale(): string {
  return displayLocale;
}

/** A plain number in the bakery's locale: "1,200", "2.5". */
export function formatNum(n: number, minDecimals = 0, maxDecimals = minDecimals): string {
  return formatNumber(n, displayLocale, minDecimals, maxDecimals);
}

/** "Tuesday, December 2, 2025" for the bakery's today. */
export function formatBakeDay(today: string, now: string, timeZone: string): string {
  // No usable instant: the calendar date as given (no time zone, no day shift).
  return formatInstant(now, "dayFull", displayLocale, timeZone) || formatCalendarDate(today, "dayFull", displayLocale);
}

/** "5:42 AM" at the bakery. */
export function formatClock(now: string, timeZone: string): string {
  return formatInstant(now, "time", displayLocale, timeZone);
}

/** "Dec 2, 2025, 5:42 AM", or "Never" for no date. */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return "Never";
  return formatInstant(iso, "dateTime", displayLocale, timeZone) || "Unknown";
}

/** "Dec 2, 2025". */
export function formatDate(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return "Never";
  return formatInstant(iso, "date", displayLocale, timeZone) || "Unknown";
}

export function firstName(name: string): string {
  return name.trim().split(/\s+/)[0] || name;
}

/** "Good morning" / "Good afternoon" / "Good evening" by the clock in the given zone. */
export function greetingAt(now: string, timeZone?: string): string {
  const instant = new Date(now);
  if (Number.isNaN(instant.getTime())) return "Hello";
  const hour = hourIn(instant, timeZone);
  if (hour < 12) return "Good morning";
  if (hour < 18) return "Good afternoon";
  return "Good evening";
}
