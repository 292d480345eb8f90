import { DateTime } from "luxon";
import { addDays, formatLocal, isSupportedDate } from "../../shared/calendar";

/** A calendar date (no time zone involved): "Thu 4 Dec". */
export function formatDay(date: string): string {
  const d = DateTime.fromISO(date, { zone: "UTC" });
  return d.isValid ? d.toFormat("ccc d LLL") : date;
}

/** "Thursday 4 December". */
export function formatDayLong(date: string): string {
  const d = DateTime.fromISO(date, { zone: "UTC" });
  return d.isValid ? d.toFormat("cccc d LLLL") : date;
}

/** "Thursday 4 December 2025". */
export function formatDayWithYear(date: string): string {
  const d = DateTime.fromISO(date, { zone: "UTC" });
  return d.isValid ? d.toFormat("cccc d LLLL yyyy") : date;
}

/** "Today", "Tomorrow" or null, by the bakery's today. */
export function relativeDay(date: string, today: string | undefined): string | null {
  if (!today) return null;
  if (date === today) return "Today";
  if (date === addDays(today, 1)) return "Tomorrow";
  return null;
}

/** "Tomorrow · Wed 3 Dec" or "Fri 5 Dec". */
export function dayHeading(date: string, today: string | undefined): string {
  const rel = relativeDay(date, today);
  return rel ? `${rel} · ${formatDay(date)}` : formatDay(date);
}

/** A cut-off instant in the bakery's zone, "Wed 3 Dec, 14:00 CST"; "" when unreadable. */
export function formatCutoff(iso: string, timeZone: string | undefined): string {
  try {
    const dt = DateTime.fromISO(iso, { setZone: true });
    if (!dt.isValid) return "";
    return formatLocal(iso, timeZone || dt.zoneName || "UTC");
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
