/**
 * The cut-off countdown as a buyer reads it: "closes in 3 h 12 min". Pure, so it is tested on its own
 * (tests/app/countdown.test.tsx); the screens tick it once a second with useServerNow().
 */

/** Under this much time left the countdown turns urgent (red, with an alert icon). */
export const URGENT_MS = 60 * 60 * 1000;

const MINUTE = 60;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

/**
 * Whole seconds left, rounded up: 0.2 s left still reads "1 s", and 0 only once the cut-off is reached.
 */
export function secondsLeft(ms: number): number {
  if (!Number.isFinite(ms) || ms <= 0) return 0;
  return Math.ceil(ms / 1000);
}

/** "2 days 4 h", "3 h 12 min", "42 min 5 s", "35 s"; "" once it has run out. */
export function formatDuration(ms: number): string {
  const s = secondsLeft(ms);
  if (s <= 0) return "";
  if (s >= DAY) {
    const days = Math.floor(s / DAY);
    const hours = Math.floor((s % DAY) / HOUR);
    const d = days === 1 ? "1 day" : `${days} days`;
    return hours > 0 ? `${d} ${hours} h` : d;
  }
  if (s >= HOUR) {
    const hours = Math.floor(s / HOUR);
    const minutes = Math.floor((s % HOUR) / MINUTE);
    return minutes > 0 ? `${hours} h ${minutes} min` : `${hours} h`;
  }
  if (s >= MINUTE) {
    const minutes = Math.floor(s / MINUTE);
    const seconds = s % MINUTE;
    return seconds > 0 ? `${minutes} min ${seconds} s` : `${minutes} min`;
  }
  return `${s} s`;
}

/** "closes in 3 h 12 min", or "ordering has closed" once the cut-off is reached. */
export function formatCountdown(ms: number): string {
  const d = formatDuration(ms);
  return d ? `closes in ${d}` : "ordering has closed";
}

/** Less than an hour left, and not yet closed. */
export function isUrgent(ms: number): boolean {
  return secondsLeft(ms) > 0 && ms < URGENT_MS;
}

/** Milliseconds from `now` to an ISO instant (negative once it has passed; -Infinity when unreadable). */
export function msUntil(iso: string, now: number): number {
  const t = Date.parse(iso);
  return Number.isNaN(t) ? Number.NEGATIVE_INFINITY : t - now;
}
