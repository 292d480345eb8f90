/** Instants for the scheduler: the shift start in the bakery's zone and ISO instants written fast. */
import { DateTime, type Zone } from "luxon";
import { MS_PER_MIN } from "./resources";

/** The last instant at "HH:mm" in the zone at or before `before` (epoch ms). */
export function lastLocalTimeAtOrBefore(hhmm: string, before: DateTime): DateTime {
  const [h, m] = hhmm.split(":").map(Number);
  let t = before.set({ hour: h, minute: m, second: 0, millisecond: 0 });
  if (t > before) t = t.minus({ days: 1 }).set({ hour: h, minute: m });
  return t;
}

const pad2 = (n: number) => (n < 10 ? `0${n}` : String(n));
/** "00:00" … "23:59", for writing whole-minute instants without a Date each time. */
const CLOCK = Array.from({ length: 1440 }, (_, m) => `${pad2(Math.floor(m / 60))}:${pad2(m % 60)}`);

const SAMPLE_MS = 6 * 3600_000;

/**
 * The zone's UTC offset (minutes) at an instant, from luxon, asked rarely: sampled every 6 hours, and where two
 * samples differ the change is found to the minute by halving. No time zone changes its offset twice within
 * 6 hours.
 */
function offsetTable(zone: Zone) {
  const samples = new Map<number, number>();
  const changes = new Map<number, number>();
  const sample = (k: number) => {
    let o = samples.get(k);
    if (o === undefined) {
      o = zone.offset(k * SAMPLE_MS);
      samples.set(k, o);
    }
    return o;
  };
  return (ms: number): number => {
    const k = Math.floor(ms / SAMPLE_MS);
    const a = sample(k);
    const b = sample(k + 1);
    if (a === b) return a;
    let at = changes.get(k);
    if (at === undefined) {
      let lo = k * SAMPLE_MS;
      let hi = (k + 1) * SAMPLE_MS;
      while (hi - lo > MS_PER_MIN) {
        const mid = lo + Math.floor((hi - lo) / 2 / MS_PER_MIN) * MS_PER_MIN;
        if (zone.offset(mid) === a) lo = mid;
        else hi = mid;
      }
      at = hi;
      changes.set(k, at);
    }
    return ms < at ? a : b;
  };
}

/**
 * ISO instants in the bakery's zone, written as luxon's toISO() writes them ("2026-06-11T06:30:00.000-05:00"),
 * fast: offsets from offsetTable, each local date written once; the scheduler's instants are whole minutes.
 */
export function isoWriter(zone: Zone) {
  const offsetAt = offsetTable(zone);
  const days = new Map<number, string>();
  const utcStyle = DateTime.fromMillis(0, { zone }).toISO()?.endsWith("Z") ?? false;
  const offsetText = (off: number) => {
    if (off === 0 && utcStyle) return "Z";
    const a = Math.abs(off);
    return `${off < 0 ? "-" : "+"}${pad2(Math.floor(a / 60))}:${pad2(a % 60)}`;
  };
  return (minutes: number): string => {
    const ms = minutes * MS_PER_MIN;
    const off = offsetAt(ms);
    if (!Number.isInteger(minutes)) return `${new Date(ms + off * MS_PER_MIN).toISOString().slice(0, 23)}${offsetText(off)}`;
    const local = minutes + off;
    const day = Math.floor(local / 1440);
    let d = days.get(day);
    if (d === undefined) {
      d = new Date(day * 86_400_000).toISOString().slice(0, 10);
      days.set(day, d);
    }
    return `${d}T${CLOCK[local - day * 1440]}:00.000${offsetText(off)}`;
  };
}
