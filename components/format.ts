/** Dates and times, always in the bakery's own time zone when we know it. */
export const LOCALE = "en-US";

function safeFormat(date: Date, options: Intl.DateTimeFormatOptions): string {
  try {
    return new Intl.DateTimeFormat(LOCALE, options).format(date);
  } catch {
    // Unknown time zone on this device: fall back to the device's own.
    const { timeZone: _dropped, ...rest } = options;
    return new Intl.DateTimeFormat(LOCALE, rest).format(date);
  }
}

/** "Tuesday, December 2, 2025" for the bakery's today. */
export function formatBakeDay(today: string, now: string, timeZone: string): string {
  const instant = new Date(now);
  if (!Number.isNaN(instant.getTime())) {
    return safeFormat(instant, { timeZone, weekday: "long", year: "numeric", month: "long", day: "numeric" });
  }
  // No usable instant: show the calendar date as given (noon UTC avoids any day shift).
  const date = new Date(`${today}T12:00:00Z`);
  return safeFormat(date, { timeZone: "UTC", weekday: "long", year: "numeric", month: "long", day: "numeric" });
}

/** "5:42 AM" at the bakery. */
export function formatClock(now: string, timeZone: string): string {
  const instant = new Date(now);
  if (Number.isNaN(instant.getTime())) return "";
  return safeFormat(instant, { timeZone, hour: "numeric", minute: "2-digit" });
}

/** "Dec 2, 2025, 5:42 AM", or "Never" for no date. */
export function formatDateTime(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return "Never";
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return "Unknown";
  return safeFormat(d, { timeZone, year: "numeric", month: "short", day: "numeric", hour: "numeric", minute: "2-digit" });
}

/** "Dec 2, 2025". */
export function formatDate(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return "Never";
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return "Unknown";
  return safeFormat(d, { timeZone, year: "numeric", month: "short", day: "numeric" });
}

export function firstName(name: string): string {
  return name.trim().split(/\s+/)[0] || name;
}

/** "Good morning" / "Good afternoon" / "Good evening" by the clock in the given zone. */
export function greetingAt(now: string, timeZone?: string): string {
  const instant = new Date(now);
  if (Number.isNaN(instant.getTime())) return "Hello";
  let hour: number;
  try {
    hour = Number(new Intl.DateTimeFormat("en-GB", { timeZone, hour: "2-digit", hourCycle: "h23" }).format(instant));
  } catch {
    hour = instant.getHours();
  }
  if (hour < 12) return "Good morning";
  if (hour < 18) return "Good afternoon";
  return "Good evening";
}
