import { DateTime } from "luxon";
import { addDays, formatLocal, isSupportedDate } from "../../shared/calendar";
import { formatCalendarDate } from "../../shared/format";
import { currentLocale } from "../format";

/** A calendar date (no time zone involved), in the bakery's locale: "Thu, Dec 4" (en-US). */
export function formatDay(date: string): string {
  return formatCalendarDate(date, "dayShort", currentLocale());
}

/** "Thursday, December 4" (en-US). */
export function formatDayLong(date: string): string {
  return formatCalendarDate(date, "dayLong", currentLocale());
}

/** "Thursday, December 4, 2025" (en-US). */
export function formatDayWithYear(date: string): string {
  return formatCalendarDate(date, "dayFull", currentLocale());
}

/** "Today", "Tomorrow" or null, by the bakery's today. */
export function relativeDay(date: string, today: string | undefined): string | null {
  if (!today) return null;
  if (date === today) return "Today";
  if (date === addDays(today, 1)) return "Tomorrow";
  return null;
}

/** "Tomorrow · Wed, Dec 3" or "Fri, Dec 5" (en-US). */
export function dayHeading(date: string, today: string | undefined): string {
  const rel = relativeDay(date, today);
  return rel ? `${rel} · ${formatDay(date)}` : formatDay(date);
}

/** A cut-off instant in the bakery's zone and locale, "Wed, Dec 3, 2:00 PM CST" (en-US); "" when unreadable. */
export function formatCutoff(iso: string, timeZone: string | undefined): string {
  try {
    const dt = DateTime.fromISO(iso, { setZone: true });
    if (!dt.isValid) return "";
    return formatLocal(iso, timeZone || dt.zoneName || "UTC", currentLocale());
  } catch {
    return "";
  }
}

/** A date typed by a person, if it is a real YYYY-MM-DD date. */
export function cleanDate(text: string): string | null {
  const t = text.trim();
  // Only the dates the server accepts (2000-01-01..2099-12-31): addDays refuses to step past 9999-12-31.
  return isSupportedDate(t) ? t : null;
}

export { addDays };
