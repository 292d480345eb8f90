import { DateTime } from "luxon";
import { PRODUCTION_CAUTIONS } from "../../shared/cautions";
import { addDays, weekdayOf } from "../../shared/calendar";
import type { CalendarSettingsDto } from "../../shared/schemas/calendar";
import type { PlanView } from "../api/production";
import { mixKey } from "../api/production";

export type TimelineEntry = PlanView["timeline"][number];
export type Caution = (typeof PRODUCTION_CAUTIONS)[number];

/** "01:40": a time in the bakery's zone (the API writes its offset into every instant). */
export function localTime(iso: string): string {
  const dt = DateTime.fromISO(iso, { setZone: true });
  return dt.isValid ? dt.toFormat("HH:mm") : "";
}

/** "Tue 1 Dec, 14:00": an instant in the bakery's zone, without the zone name. */
export function localDayTime(iso: string): string {
  const dt = DateTime.fromISO(iso, { setZone: true });
  return dt.isValid ? dt.toFormat("ccc d LLL, HH:mm") : "";
}

export const timeRange = (e: Pick<TimelineEntry, "startsAt" | "endsAt">) => `${localTime(e.startsAt)}–${localTime(e.endsAt)}`;

/** The caution that goes beside a step, if there is one. */
export function cautionFor(step: string): Caution | undefined {
  return PRODUCTION_CAUTIONS.find((c) => c.step === step);
}

export interface WaveGroup {
  wave: number;
  formulaId: number;
  pans: number;
  productIds: number[];
  startsAt: string;
  endsAt: string;
  entries: TimelineEntry[];
}

/** The timeline by oven wave, each wave's steps in time order, waves in number order. */
export function groupByWave(timeline: TimelineEntry[]): WaveGroup[] {
  const map = new Map<number, TimelineEntry[]>();
  for (const e of timeline) map.set(e.wave, [...(map.get(e.wave) ?? []), e]);
  return [...map.entries()]
    .sort(([a], [b]) => a - b)
    .map(([wave, entries]) => {
      const sorted = [...entries].sort((a, b) => Date.parse(a.startsAt) - Date.parse(b.startsAt));
      return {
        wave,
        formulaId: sorted[0].formulaId,
        pans: sorted[0].pans,
        productIds: sorted[0].productIds,
        startsAt: sorted[0].startsAt,
        endsAt: sorted.reduce((end, e) => (Date.parse(e.endsAt) > Date.parse(end) ? e.endsAt : end), sorted[0].endsAt),
        entries: sorted,
      };
    });
}

/** Is the clock inside this step? */
export function isCurrent(e: Pick<TimelineEntry, "startsAt" | "endsAt">, now: number): boolean {
  return Date.parse(e.startsAt) <= now && now < Date.parse(e.endsAt);
}

/** The whole timeline's span, for the chart's scale. */
export function timelineSpan(timeline: TimelineEntry[]): { start: number; end: number } | null {
  if (timeline.length === 0) return null;
  const start = Math.min(...timeline.map((e) => Date.parse(e.startsAt)));
  const end = Math.max(...timeline.map((e) => Date.parse(e.endsAt)));
  return end > start ? { start, end } : null;
}

/** Whole hours inside a span, for the chart's grid lines: instants and their "02:00" labels. */
export function hourTicks(span: { start: number; end: number }, sampleIso: string): { at: number; label: string }[] {
  const zone = DateTime.fromISO(sampleIso, { setZone: true }).zone;
  let t = DateTime.fromMillis(span.start, { zone }).startOf("hour");
  if (t.toMillis() < span.start) t = t.plus({ hours: 1 });
  const out: { at: number; label: string }[] = [];
  while (t.toMillis() <= span.end && out.length < 48) {
    out.push({ at: t.toMillis(), label: t.toFormat("HH:mm") });
    t = t.plus({ hours: 1 });
  }
  return out;
}

export interface ProgressCount {
  mixesDone: number;
  mixes: number;
  wavesBaked: number;
  waves: number;
}

/** How far the day has got: mixes weighed and mixed, waves baked (only keys the plan still has count). */
export function progressCount(plan: Pick<PlanView, "doughs" | "timeline" | "progress">): ProgressCount {
  const mixKeys = new Set(plan.doughs.flatMap((d) => d.mixes.map((m) => mixKey(d.formulaId, m.index))));
  const waves = new Set(plan.timeline.map((e) => e.wave));
  return {
    mixesDone: plan.progress.mixes.filter((k) => mixKeys.has(k)).length,
    mixes: mixKeys.size,
    wavesBaked: plan.progress.waves.filter((w) => waves.has(w)).length,
    waves: waves.size,
  };
}

const plural = (n: number, one: string, many: string) => (n === 1 ? one : many);

/** "2 of 3 mixes done, 1 of 2 waves baked". */
export function progressText(p: ProgressCount): string {
  return `${p.mixesDone} of ${p.mixes} ${plural(p.mixes, "mix", "mixes")} done, ${p.wavesBaked} of ${p.waves} ${plural(p.waves, "wave", "waves")} baked`;
}

/**
 * The bake day before or after `date`: the nearest delivery weekday that is not a closure. Without the
 * calendar settings, simply the day before or after.
 */
export function stepBakeDay(date: string, direction: 1 | -1, settings?: Pick<CalendarSettingsDto, "deliveryWeekdays" | "closures"> | null): string {
  if (!settings || settings.deliveryWeekdays.length === 0) return addDays(date, direction);
  const closed = new Set(settings.closures.map((c) => c.date));
  let d = date;
  for (let i = 0; i < 21; i++) {
    d = addDays(d, direction);
    if (settings.deliveryWeekdays.includes(weekdayOf(d)) && !closed.has(d)) return d;
  }
  return addDays(date, direction);
}

/** The next `count` bake days from `from` (inclusive), for quick picking. */
export function upcomingBakeDays(from: string, count: number, settings?: Pick<CalendarSettingsDto, "deliveryWeekdays" | "closures"> | null): string[] {
  const out: string[] = [];
  let d = addDays(from, -1);
  while (out.length < count) {
    d = stepBakeDay(d, 1, settings);
    out.push(d);
  }
  return out;
}

/** The clock as "03:12" in the zone of an instant the plan gave (the bakery's). */
export function clockIn(now: number, sampleIso: string): string {
  const zone = DateTime.fromISO(sampleIso, { setZone: true }).zone;
  return DateTime.fromMillis(now, { zone }).toFormat("HH:mm");
}
