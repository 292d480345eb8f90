import { DateTime } from "luxon";
import { PRODUCTION_CAUTIONS } from "../../shared/cautions";
import { addDays, weekdayOf } from "../../shared/calendar";
import type { CalendarSettingsDto } from "../../shared/schemas/calendar";
import type { PlanView } from "../api/production";
import { mixKey, type ProductionSettingsDto } from "../api/production";
import type { Units } from "../../shared/units";
import { formatAtOwnOffset, formatNumber, formatTimeOfDay } from "../../shared/format";
import { currentLocale } from "../format";

export type TimelineEntry = PlanView["timeline"][number];
export type Caution = (typeof PRODUCTION_CAUTIONS)[number];

/** "1:40 AM" (en-US): a time in the bakery's zone (the API writes its offset into every instant) and locale. */
export function localTime(iso: string): string {
  return formatAtOwnOffset(iso, "time", currentLocale());
}

/** "Tue, Dec 1, 2:00 PM" (en-US): an instant in the bakery's zone and locale, without the zone name. */
export function localDayTime(iso: string): string {
  return formatAtOwnOffset(iso, "dayTime", currentLocale());
}

export const timeRange = (e: Pick<TimelineEntry, "startsAt" | "endsAt">) => `${localTime(e.startsAt)}–${localTime(e.endsAt)}`;

/** The caution that goes beside a step, if there is one. */
export function cautionFor(step: string): Caution | undefined {
  return PRODUCTION_CAUTIONS.find((c) => c.step === step);
}

export type OvenLoadView = NonNullable<PlanView["schedule"]>["ovenLoads"][number];

/** A block of the timeline: one weigh-out card's mix (paste to dividing), or one oven load (shaping to cooling). */
export interface TimelineGroup {
  key: string;
  kind: "mix" | "load";
  formulaId: number | null;
  /** The card's mix number (mix groups). */
  mix: number | null;
  /** The oven load's number (load groups). */
  load: number | null;
  ovenLoad: OvenLoadView | null;
  pans: number;
  productIds: number[];
  startsAt: string;
  endsAt: string;
  entries: TimelineEntry[];
}

/** The oven load an entry belongs to (plans frozen before oven loads called it a wave). */
const loadOf = (e: TimelineEntry): number | null => e.load ?? (e as { wave?: number }).wave ?? null;

/**
 * The timeline in blocks, in time order: each mix (its paste, mixing, bulk, dividing) and each oven load (the
 * shaping and proof of its pans, any temperature change before it, the bake and cooling). The blocks grow
 * with mixes and oven loads, never with pans.
 */
export function groupTimeline(plan: Pick<PlanView, "timeline"> & { schedule?: PlanView["schedule"] }): TimelineGroup[] {
  const groups = new Map<string, TimelineGroup>();
  for (const e of plan.timeline) {
    const load = loadOf(e);
    const key = load !== null ? `load-${load}` : `mix-${e.formulaId}-${e.mix ?? 0}`;
    let g = groups.get(key);
    if (!g) {
      const ovenLoad = load !== null ? plan.schedule?.ovenLoads.find((l) => l.load === load) ?? null : null;
      g = {
        key, kind: load !== null ? "load" : "mix", formulaId: e.formulaId ?? null, mix: load !== null ? null : e.mix ?? null, load, ovenLoad,
        pans: ovenLoad?.pans ?? e.pans, productIds: ovenLoad ? [...new Set(ovenLoad.items.map((i) => i.productId))] : e.productIds,
        startsAt: e.startsAt, endsAt: e.endsAt, entries: [],
      };
      groups.set(key, g);
    }
    g.entries.push(e);
    if (g.kind === "load" && e.step === "bake") {
      g.formulaId = e.formulaId ?? null;
      if (!g.ovenLoad) { g.pans = e.pans; g.productIds = e.productIds; }
    }
  }
  for (const g of groups.values()) {
    g.entries.sort((a, b) => Date.parse(a.startsAt) - Date.parse(b.startsAt));
    g.startsAt = g.entries[0].startsAt;
    g.endsAt = g.entries.reduce((end, e) => (Date.parse(e.endsAt) > Date.parse(end) ? e.endsAt : end), g.entries[0].endsAt);
  }
  return [...groups.values()].sort((a, b) => Date.parse(a.startsAt) - Date.parse(b.startsAt) || (a.load ?? 0) - (b.load ?? 0));
}

/** A bar on a resource lane: a mixer's or the crew's step, or an oven's load or temperature change. */
export interface LaneBar {
  key: string;
  startsAt: string;
  endsAt: string;
  label: string;
  step: string;
}

/** Every mixer, the crew, every oven, with what occupies it when (the lanes of the wide timeline). */
export function resourceLanes(plan: Pick<PlanView, "timeline"> & { schedule?: PlanView["schedule"] }): { kind: string; id: number; name: string; bars: LaneBar[] }[] {
  if (!plan.schedule) return [];
  return plan.schedule.resources.map((r) => {
    const bars: LaneBar[] = [];
    if (r.kind === "oven") {
      for (const l of plan.schedule!.ovenLoads.filter((x) => x.ovenId === r.id)) bars.push({ key: `load-${l.load}`, startsAt: l.startsAt, endsAt: l.endsAt, label: `Oven load ${l.load}`, step: "bake" });
      for (const e of plan.timeline.filter((x) => x.step === "heat" && x.resource?.kind === "oven" && x.resource.id === r.id)) bars.push({ key: e.id, startsAt: e.startsAt, endsAt: e.endsAt, label: e.label, step: "heat" });
    } else {
      for (const e of plan.timeline.filter((x) => x.resource?.kind === r.kind && x.resource.id === r.id)) {
        bars.push({ key: e.id, startsAt: e.startsAt, endsAt: e.endsAt, label: `${e.label}${e.mix ? `, mix ${e.mix}` : ""}${e.load ? `, oven load ${e.load}` : ""}`, step: e.step });
      }
    }
    bars.sort((a, b) => Date.parse(a.startsAt) - Date.parse(b.startsAt));
    return { ...r, bars };
  });
}

/** "1:40 AM–1:55 AM" (en-US), with the weekday where a step falls on another day than the bake day ("Fri 11:50 PM–12:30 AM"). */
export function timeRangeOn(e: Pick<TimelineEntry, "startsAt" | "endsAt">, date: string): string {
  const day = (iso: string) => {
    const dt = DateTime.fromISO(iso, { setZone: true });
    return dt.isValid && dt.toISODate() !== date ? `${formatAtOwnOffset(iso, "weekday", currentLocale())} ` : "";
  };
  return `${day(e.startsAt)}${localTime(e.startsAt)}–${localTime(e.endsAt)}`;
}

/** Minutes as a baker reads them: "40 min", "1 h 40 min". */
export { minutesText } from "../../shared/schedule";

/** One line each for the bake-day footer: the mixers, the ovens, the crew and packing. */
export function settingsLines(s: ProductionSettingsDto, units: Pick<Units, "capacity">): { mixers: string; ovens: string; crew: string } {
  const ovens = s.ovens.map((o) => `${o.name} (${o.capacity.kind === "area" ? `${formatNumber(o.capacity.areaCm2, currentLocale())} cm² of shelf` : `${o.capacity.slots.length} pan ${o.capacity.slots.length === 1 ? "slot" : "slots"}`})`);
  return {
    mixers: s.mixers.map((m) => `${m.name}, ${units.capacity(m.capacityKg)}`).join("; "),
    ovens: ovens.join("; "),
    crew: `${s.crew.people === 1 ? "1 person" : `${s.crew.people} people`}${s.shiftStart ? ` from ${formatTimeOfDay(s.shiftStart, currentLocale())}` : ""} · packing ${s.packingMinutes} min before dispatch`,
  };
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

/** Whole hours inside a span, for the chart's grid lines: instants and their "2 AM" labels (en-US; "02" in en-GB). */
export function hourTicks(span: { start: number; end: number }, sampleIso: string): { at: number; label: string }[] {
  const zone = DateTime.fromISO(sampleIso, { setZone: true }).zone;
  let t = DateTime.fromMillis(span.start, { zone }).startOf("hour");
  if (t.toMillis() < span.start) t = t.plus({ hours: 1 });
  const out: { at: number; label: string }[] = [];
  while (t.toMillis() <= span.end && out.length < 48) {
    out.push({ at: t.toMillis(), label: formatAtOwnOffset(t.toISO()!, "hour", currentLocale()) });
    t = t.plus({ hours: 1 });
  }
  return out;
}

export interface ProgressCount {
  mixesDone: number;
  mixes: number;
  /** Oven loads baked (stored under the name "waves"). */
  wavesBaked: number;
  waves: number;
}

/** How far the day has got: mixes weighed and mixed, oven loads baked (only keys the plan still has count). */
export function progressCount(plan: Pick<PlanView, "doughs" | "timeline" | "progress">): ProgressCount {
  const mixKeys = new Set(plan.doughs.flatMap((d) => d.mixes.map((m) => mixKey(d.formulaId, m.index))));
  const waves = new Set(plan.timeline.map(loadOf).filter((n): n is number => n !== null));
  return {
    mixesDone: plan.progress.mixes.filter((k) => mixKeys.has(k)).length,
    mixes: mixKeys.size,
    wavesBaked: plan.progress.waves.filter((w) => waves.has(w)).length,
    waves: waves.size,
  };
}

const plural = (n: number, one: string, many: string) => (n === 1 ? one : many);

/** "2 of 3 mixes done, 1 of 2 oven loads baked". */
export function progressText(p: ProgressCount): string {
  return `${p.mixesDone} of ${p.mixes} ${plural(p.mixes, "mix", "mixes")} done, ${p.wavesBaked} of ${p.waves} ${plural(p.waves, "oven load", "oven loads")} baked`;
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

/** The clock as "3:12 AM" (en-US) in the zone of an instant the plan gave (the bakery's). */
export function clockIn(now: number, sampleIso: string): string {
  const zone = DateTime.fromISO(sampleIso, { setZone: true }).zone;
  return formatAtOwnOffset(DateTime.fromMillis(now, { zone }).toISO()!, "time", currentLocale());
}
