/**
 * One schedule for the bake day: every mix (one weigh-out card each) on a mixer, dividing and shaping on the
 * crew, the shaped pans in oven loads on the ovens, cooling, all worked backwards from dispatch less the
 * packing time, so that no mixer, oven or the crew is booked twice at once.
 *
 * Pure: no I/O. Inside, instants are epoch minutes; the bakery's IANA zone (through luxon) decides dispatch,
 * the shift start and the offsets written into the ISO instants that come out.
 *
 * The model, in the baker's words:
 * - A dough's mixes are the weigh-out cards (planDough splits it by the largest mixer). Each mix is one mix
 *   step on one mixer that holds it; the paste is cooked and cooled for that mix and goes in at its start.
 *   Steps that stay in the bowl right after mixing (a rest before kneading, kneading) keep the mixer busy.
 * - Each mix's dough is bulk fermented and divided as one; its pans are shaped in portions, one per oven load
 *   they go into, so each portion's proof ends as its load goes in.
 * - One oven load = pans that fit one oven's usable shelf area (or its named pan slots, each pan in a slot it
 *   fits) at one temperature and bake time. Loading and unloading take the oven's own minutes; a load at a
 *   different temperature from the next one on that oven leaves the oven's temperature-change time between.
 * - The crew works as one team: dividing and shaping take person-minutes per piece (and per pan for panning),
 *   divided by the people on the shift; one such step at a time.
 * - Cooling follows the bake (per product); every cooling ends by dispatch less the packing time.
 * - A formula set to retard overnight is mixed and shaped the day before; the shaped pans go into the retarder
 *   and are proofed and baked from it (common practice, no source: about 2–4 °C for 8–16 h).
 * Where a resource is busy, a step moves earlier and the resting step after it runs longer (said in its note).
 * The schedule is the latest one this greedy placement finds; if it starts before the shift, the plan names
 * the first step that does and by how much, and offers the earlier start.
 */
import { DateTime, type Zone } from "luxon";
import { formatAtOwnOffset, localeOr } from "./format";
import { STEP_LABELS, type StepKind, type StepSpec } from "./production";

// ---- inputs ------------------------------------------------------------------------------------

export interface MixerSpec {
  id: number;
  name: string;
  /** Dough per batch, kg. */
  capacityKg: number;
}

export type OvenCapacity =
  /** Usable shelf area of one load, cm²: the pans' footprints (length × width) must add up to no more. */
  | { kind: "area"; areaCm2: number }
  /** Named pan slots of one load: one pan per slot, and the pan must fit the slot (either way round). */
  | { kind: "slots"; slots: string[]; slotLengthMm: number; slotWidthMm: number };

export interface OvenSpec {
  id: number;
  name: string;
  capacity: OvenCapacity;
  /** Minutes to bring the oven from one load's temperature to a different one. */
  tempChangeMinutes: number;
  loadMinutes: number;
  unloadMinutes: number;
}

export interface CrewSpec {
  /** People on the shift who divide and shape. */
  people: number;
  /** Person-minutes to divide and round one piece (0: the formula's divide minutes per mix). */
  divideMinutesPerPiece: number;
  /** Person-minutes to shape one piece. */
  shapeMinutesPerPiece: number;
  /** Person-minutes to fill and set out one pan. */
  panMinutesPerPan: number;
}

export interface BakehouseResources {
  mixers: MixerSpec[];
  ovens: OvenSpec[];
  crew: CrewSpec;
  /** Minutes to pack and load the vans: the last cooling ends at least this long before dispatch. */
  packingMinutes: number;
  /** "03:00": when the shift starts, bakery time, the last such time before dispatch. */
  shiftStart: string;
}

export interface ScheduleFormula {
  id: number;
  name: string;
  steps: StepSpec[];
  /** Hours in the retarder when this dough is retarded overnight; null for a same-day schedule. */
  retardHours: number | null;
}

export interface ScheduleProduct {
  productId: number;
  name: string;
  formulaId: number | null;
  pans: number;
  pieces: number;
  pieceGrams: number;
  panLengthMm: number;
  panWidthMm: number;
  /** The product's own bake and cool; null takes the formula's bake step and cool step. */
  bakeTempC: number | null;
  bakeMinutes: number | null;
  coolMinutes: number | null;
}

export interface ScheduleMix {
  formulaId: number;
  /** 1-based, as on the weigh-out card. */
  index: number;
  doughGrams: number;
}

export interface ScheduleInput {
  /** The delivery date, YYYY-MM-DD. */
  date: string;
  timeZone: string;
  /** The bakery's locale for the times in notes and conflicts (shared/format.ts); en-US when left out. */
  locale?: string;
  /** "06:30", bakery time on the delivery date. */
  dispatchTime: string;
  resources: BakehouseResources;
  formulas: ScheduleFormula[];
  products: ScheduleProduct[];
  mixes: ScheduleMix[];
}

// ---- outputs -----------------------------------------------------------------------------------

export type ScheduleStep = StepKind | "retard" | "heat";
export const SCHEDULE_LABELS: Record<ScheduleStep, string> = {
  ...STEP_LABELS,
  retard: "Retard overnight",
  heat: "Change the oven temperature",
};

export type ResourceKind = "mixer" | "oven" | "crew";
export interface ResourceRef {
  kind: ResourceKind;
  id: number;
  name: string;
}

export interface ScheduleEntry {
  /** Stable key, e.g. "f1-m2-mix", "f1-m2-L3-shape", "L3-bake". */
  id: string;
  step: ScheduleStep;
  label: string;
  /** The mixer, oven or crew the step occupies; null for resting, proofing, cooling (no machine, no hands). */
  resource: ResourceRef | null;
  formulaId: number | null;
  /** The weigh-out card (mix number within its dough) the step belongs to, if any. */
  mix: number | null;
  /** The oven load the step belongs to, if any. */
  load: number | null;
  productIds: number[];
  pans: number;
  startsAt: string;
  endsAt: string;
  /** The oven temperature for a bake or a temperature change. */
  temperatureC: number | null;
  /** Done the day before (a retarded dough's mixing and shaping). */
  dayBefore: boolean;
  /** Why a resting step runs longer than the formula says, or similar. */
  note: string | null;
}

export interface OvenLoad {
  load: number;
  ovenId: number;
  ovenName: string;
  temperatureC: number;
  bakeMinutes: number;
  /** The oven is occupied from loading to the end of unloading. */
  startsAt: string;
  endsAt: string;
  bakeStartsAt: string;
  bakeEndsAt: string;
  items: { productId: number; formulaId: number; pans: number; slots: string[] }[];
  pans: number;
  usedAreaCm2: number;
  /** Area ovens: the usable shelf area; slot ovens: null. */
  capacityAreaCm2: number | null;
  /** Slot ovens: how many slots; area ovens: null. */
  capacitySlots: number | null;
}

export interface ScheduledMix {
  formulaId: number;
  index: number;
  mixerId: number;
  mixerName: string;
  startsAt: string;
  endsAt: string;
  /** When the paste for this mix is put on (null without a paste). */
  pasteStartsAt: string | null;
  dayBefore: boolean;
  /** Pans this mix's dough makes, per product. */
  pans: { productId: number; pans: number }[];
}

export interface ScheduleConflict {
  kind: "shift_start" | "no_oven" | "no_mixer" | "no_bake";
  message: string;
  /** By how much, minutes (shift start), else null. */
  minutes: number | null;
  entryId: string | null;
}

export interface DaySchedule {
  entries: ScheduleEntry[];
  ovenLoads: OvenLoad[];
  mixes: ScheduledMix[];
  conflicts: ScheduleConflict[];
  /** When the day does not fit the shift: the start that would fit. */
  earlierStart: { minutes: number; startsAt: string; text: string } | null;
  /** Lanes for the timeline: every mixer, the crew, every oven. */
  resources: ResourceRef[];
  dispatchAt: string;
  /** Packing starts here: every step ends by then. */
  packFrom: string;
  shiftStartsAt: string;
  /** The first same-day step (not counting a retarded dough's work the day before, nor its night in the retarder); null without steps. */
  startsAt: string | null;
  /** Things worth knowing that are not conflicts (a retard past 16 h, a dough with no bake step). */
  warnings: string[];
}

// ---- helpers -----------------------------------------------------------------------------------

const EPS = 1e-9;
const MS_PER_MIN = 60_000;
/** Retard window, common practice (no source): shaped rolls at about 2–4 °C for 8–16 h. */
export const RETARD_HOURS = { min: 8, max: 16 } as const;
/** A formula without a mix step still gets one on every card (common practice, no source). */
const DEFAULT_MIX_MINUTES = 15;

/** "40 min", "1 h", "1 h 40 min". */
export function minutesText(n: number): string {
  const m = Math.round(n);
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  const r = m % 60;
  return r ? `${h} h ${r} min` : `${h} h`;
}

/** The area of a pan's footprint, cm² (mm × mm ÷ 100). */
export const panAreaCm2 = (lengthMm: number, widthMm: number) => (lengthMm * widthMm) / 100;

/** Does a pan fit one slot, either way round? */
export function panFitsSlot(lengthMm: number, widthMm: number, slotLengthMm: number, slotWidthMm: number): boolean {
  return (lengthMm <= slotLengthMm && widthMm <= slotWidthMm) || (lengthMm <= slotWidthMm && widthMm <= slotLengthMm);
}

/** Can one pan of this size go into this oven at all? */
export function panFitsOven(lengthMm: number, widthMm: number, oven: Pick<OvenSpec, "capacity">): boolean {
  const c = oven.capacity;
  if (c.kind === "area") return panAreaCm2(lengthMm, widthMm) <= c.areaCm2 + EPS;
  return c.slots.length > 0 && panFitsSlot(lengthMm, widthMm, c.slotLengthMm, c.slotWidthMm);
}

/** A product's bake temperature, bake minutes and cool minutes: its own, else its formula's bake and cool steps. */
export function resolveBake(p: Pick<ScheduleProduct, "bakeTempC" | "bakeMinutes" | "coolMinutes">, f: Pick<ScheduleFormula, "steps"> | undefined) {
  const bake = f?.steps.find((s) => s.kind === "bake");
  const cool = f?.steps.find((s) => s.kind === "cool");
  return {
    tempC: p.bakeTempC ?? bake?.temperatureC ?? null,
    bakeMinutes: p.bakeMinutes ?? (bake && bake.minutes > 0 ? bake.minutes : null),
    coolMinutes: p.coolMinutes ?? cool?.minutes ?? 0,
  };
}

/** The last instant at "HH:mm" in the zone at or before `before` (epoch ms). */
function lastLocalTimeAtOrBefore(hhmm: string, before: DateTime): DateTime {
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
function isoWriter(zone: Zone) {
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

interface Interval { start: number; end: number }

/** Busy intervals of one resource, sorted by start, never overlapping. */
class Lane {
  busy: Interval[] = [];
  /** The latest start s with s + dur ≤ latestEnd and [s, s + dur) free. */
  latestStart(latestEnd: number, dur: number): number {
    if (dur <= 0) return latestEnd;
    const b = this.busy;
    // first interval starting at or after latestEnd: everything from there on is irrelevant
    let lo = 0;
    let hi = b.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (b[mid].start < latestEnd) lo = mid + 1;
      else hi = mid;
    }
    let end = latestEnd;
    for (let i = lo - 1; i >= 0; i--) {
      const iv = b[i];
      if (iv.end <= end - dur) return end - dur;
      end = Math.min(end, iv.start);
    }
    return end - dur;
  }
  book(start: number, end: number) {
    if (end <= start) return;
    const b = this.busy;
    let lo = 0;
    let hi = b.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (b[mid].start < start) lo = mid + 1;
      else hi = mid;
    }
    b.splice(lo, 0, { start, end });
  }
}

/** A max-heap of chains by their cursor (the latest end of their next resource step). */
class MaxHeap<T> {
  private a: { key: number; seq: number; v: T }[] = [];
  private seq = 0;
  get size() { return this.a.length; }
  push(key: number, v: T) {
    const a = this.a;
    a.push({ key, seq: this.seq++, v });
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (this.before(a[p], a[i])) break;
      [a[p], a[i]] = [a[i], a[p]];
      i = p;
    }
  }
  pop(): T | undefined {
    const a = this.a;
    if (!a.length) return undefined;
    const top = a[0];
    const last = a.pop()!;
    if (a.length) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < a.length && !this.before(a[m], a[l])) m = l;
        if (r < a.length && !this.before(a[m], a[r])) m = r;
        if (m === i) break;
        [a[m], a[i]] = [a[i], a[m]];
        i = m;
      }
    }
    return top.v;
  }
  /** x comes out before y: later key first, then first pushed. */
  private before(x: { key: number; seq: number }, y: { key: number; seq: number }) {
    return x.key > y.key || (x.key === y.key && x.seq < y.seq);
  }
}

// ---- the chains --------------------------------------------------------------------------------

interface ChainStep {
  kind: ScheduleStep;
  minutes: number;
  /** Formula minutes, for the "runs longer" note. */
  formulaMinutes: number;
  resource: "mixer" | "crew" | null;
  /** A mixer block: the steps that keep the mixer busy, in order (mix, rest, knead). */
  parts?: { kind: StepKind; minutes: number }[];
}

interface Placed {
  step: ChainStep;
  kind: ScheduleStep;
  start: number;
  end: number;
  resource: ResourceRef | null;
  note: string | null;
}

interface Chain {
  key: string;
  kind: "portion" | "mix";
  steps: ChainStep[];
  pos: number;
  cursor: number;
  placed: Placed[];
  formulaId: number;
  mix: number;
  load: number | null;
  productIds: number[];
  pans: number;
  dayBefore: boolean;
  mixDough?: number;
  /** Portions this mix waits for. */
  waiting?: number;
}

/** Split a formula's steps (minutes > 0, before the bake) into what a mix does and what each portion does. */
function formulaChains(f: ScheduleFormula | undefined) {
  const all = (f?.steps ?? []).filter((s) => s.minutes > 0);
  const bakeIdx = all.findIndex((s) => s.kind === "bake");
  const before = (bakeIdx >= 0 ? all.slice(0, bakeIdx) : all.filter((s) => s.kind !== "cool")).map((s) => ({ kind: s.kind, minutes: s.minutes }));
  const after = bakeIdx >= 0 ? all.slice(bakeIdx + 1).filter((s) => s.kind !== "cool") : [];
  if (!before.some((s) => s.kind === "mix")) {
    const pasteAt = before.findIndex((s) => s.kind === "paste");
    before.splice(pasteAt + 1, 0, { kind: "mix", minutes: DEFAULT_MIX_MINUTES });
  }
  let split = before.findIndex((s) => s.kind === "shape" || s.kind === "proof" || s.kind === "wash");
  if (split < 0) split = before.length;
  return {
    perMix: before.slice(0, split),
    perPortion: before.slice(split),
    /** Extra passive minutes after the bake besides cooling (rare). */
    afterMinutes: after.reduce((s, x) => s + x.minutes, 0),
    assumedMix: !(f?.steps ?? []).some((s) => s.kind === "mix" && s.minutes > 0),
  };
}

/** Turn formula steps into chain steps: mixer blocks, crew steps, the rest passive. */
function mixChainSteps(steps: { kind: StepKind; minutes: number }[], crewMinutes: (kind: StepKind, formulaMinutes: number) => number | null): ChainStep[] {
  const out: ChainStep[] = [];
  for (let i = 0; i < steps.length; i++) {
    const s = steps[i];
    if (s.kind === "mix" || s.kind === "knead") {
      // the block runs on through rests that a knead follows, and further kneads
      let j = i + 1;
      while (j < steps.length) {
        if (steps[j].kind === "knead") { j++; continue; }
        if (steps[j].kind === "rest") {
          let k = j;
          while (k < steps.length && steps[k].kind === "rest") k++;
          if (k < steps.length && steps[k].kind === "knead") { j = k + 1; continue; }
        }
        break;
      }
      const parts = steps.slice(i, j);
      const minutes = parts.reduce((a, b) => a + b.minutes, 0);
      out.push({ kind: s.kind, minutes, formulaMinutes: minutes, resource: "mixer", parts });
      i = j - 1;
      continue;
    }
    const crew = crewMinutes(s.kind, s.minutes);
    if (crew !== null) out.push({ kind: s.kind, minutes: crew, formulaMinutes: s.minutes, resource: "crew" });
    else out.push({ kind: s.kind, minutes: s.minutes, formulaMinutes: s.minutes, resource: null });
  }
  return out;
}

// ---- the scheduler -----------------------------------------------------------------------------

export function scheduleDay(input: ScheduleInput): DaySchedule {
  const { resources: res } = input;
  const zone = DateTime.fromISO(input.date, { zone: input.timeZone }).zone;
  const iso = isoWriter(zone);
  const [dh, dm] = input.dispatchTime.split(":").map(Number);
  const dispatchDt = DateTime.fromISO(input.date, { zone }).set({ hour: dh, minute: dm });
  const dispatch = Math.round(dispatchDt.toMillis() / MS_PER_MIN);
  const packFrom = dispatch - Math.max(0, res.packingMinutes);
  const shiftDt = lastLocalTimeAtOrBefore(res.shiftStart, dispatchDt);
  const shiftStart = Math.round(shiftDt.toMillis() / MS_PER_MIN);
  const locale = localeOr(input.locale);
  const dayOf = (min: number) => iso(min).slice(0, 10);
  /** "4:10 AM", or "Mon 11:50 PM" on another day than the bake day (en-US). */
  const whenText = (min: number) => formatAtOwnOffset(iso(min), dayOf(min) === input.date ? "time" : "weekdayTime", locale);

  const formulas = new Map(input.formulas.map((f) => [f.id, f]));
  const conflicts: ScheduleConflict[] = [];
  const warnings: string[] = [];
  const crewRef: ResourceRef = { kind: "crew", id: 0, name: `Crew (${res.crew.people} ${res.crew.people === 1 ? "person" : "people"})` };
  const people = Math.max(1, Math.floor(res.crew.people));
  const mixerRefs = new Map(res.mixers.map((m) => [m.id, { kind: "mixer" as const, id: m.id, name: m.name }]));
  const ovenRefs = new Map(res.ovens.map((o) => [o.id, { kind: "oven" as const, id: o.id, name: o.name }]));

  // ---- A. oven loads, backwards from the packing time ----------------------------------------
  interface Item { productId: number; formulaId: number; count: number; lengthMm: number; widthMm: number; area: number; cool: number; piecesPerPan: number; gramsPerPan: number }
  interface Group { temp: number; bake: number; items: Item[] }
  const groups = new Map<string, Group>();
  const unbaked: ScheduleProduct[] = [];
  for (const p of input.products) {
    if (!p.formulaId || p.pans <= 0) continue;
    const f = formulas.get(p.formulaId);
    const b = resolveBake(p, f);
    if (b.bakeMinutes === null || b.tempC === null) {
      unbaked.push(p);
      continue;
    }
    const item: Item = {
      productId: p.productId, formulaId: p.formulaId, count: p.pans, lengthMm: p.panLengthMm, widthMm: p.panWidthMm,
      area: panAreaCm2(p.panLengthMm, p.panWidthMm), cool: Math.max(0, b.coolMinutes) + formulaChains(f).afterMinutes,
      piecesPerPan: p.pieces / p.pans, gramsPerPan: (p.pieces / p.pans) * p.pieceGrams,
    };
    if (!res.ovens.some((o) => panFitsOven(item.lengthMm, item.widthMm, o))) {
      conflicts.push({ kind: "no_oven", message: `${p.name}: its pan (${p.panLengthMm} × ${p.panWidthMm} mm) fits no oven, so its ${p.pans === 1 ? "pan is" : `${p.pans} pans are`} not scheduled. Add an oven or slot it fits.`, minutes: null, entryId: null });
      continue;
    }
    const key = `${b.tempC}|${b.bakeMinutes}`;
    const g = groups.get(key) ?? { temp: b.tempC, bake: b.bakeMinutes, items: [] };
    g.items.push(item);
    groups.set(key, g);
  }
  for (const p of unbaked) {
    conflicts.push({ kind: "no_bake", message: `${p.name}: neither the product nor its formula has a bake time and temperature, so it gets no oven load. Give the formula a bake step.`, minutes: null, entryId: null });
  }
  for (const g of groups.values()) g.items.sort((a, b) => a.cool - b.cool || b.area - a.area);

  interface LoadDraft { oven: OvenSpec; temp: number; bake: number; start: number; end: number; items: { item: Item; pans: number; slots: string[] }[]; usedArea: number }
  const drafts: LoadDraft[] = [];
  const heats: { oven: OvenSpec; start: number; end: number; temp: number; fromTemp: number }[] = [];
  const ovenState = res.ovens.map((o) => ({ o, nextStart: Infinity, nextTemp: null as number | null, nextLoad: null as LoadDraft | null }));
  const left = () => [...groups.values()].filter((g) => g.items.some((i) => i.count > 0));
  for (let live = left(); live.length; live = left()) {
    // The group whose next pans may come out latest goes into the latest free oven time.
    let g = live[0];
    let gCool = Math.min(...g.items.filter((i) => i.count > 0).map((i) => i.cool));
    for (const h of live.slice(1)) {
      const c = Math.min(...h.items.filter((i) => i.count > 0).map((i) => i.cool));
      if (c < gCool) { g = h; gCool = c; }
    }
    let best: { s: (typeof ovenState)[number]; end: number; start: number; setup: number } | null = null;
    for (const s of ovenState) {
      if (!g.items.some((i) => i.count > 0 && panFitsOven(i.lengthMm, i.widthMm, s.o))) continue;
      const setup = s.nextTemp !== null && s.nextTemp !== g.temp ? Math.max(0, s.o.tempChangeMinutes) : 0;
      const end = Math.min(s.nextStart - setup, packFrom - gCool);
      const start = end - (s.o.loadMinutes + g.bake + s.o.unloadMinutes);
      if (!best || start > best.start || (start === best.start && capacityOf(s.o) > capacityOf(best.s.o))) best = { s, end, start, setup };
    }
    if (!best) break; // cannot happen: every item was checked against the ovens above
    const o = best.s.o;
    const load: LoadDraft = { oven: o, temp: g.temp, bake: g.bake, start: 0, end: best.end, items: [], usedArea: 0 };
    let areaLeft = o.capacity.kind === "area" ? o.capacity.areaCm2 : 0;
    let slotsLeft = o.capacity.kind === "slots" ? o.capacity.slots.length : 0;
    let maxCool = 0;
    for (const it of g.items) {
      if (it.count <= 0 || !panFitsOven(it.lengthMm, it.widthMm, o)) continue;
      let k = 0;
      if (o.capacity.kind === "area") k = Math.min(it.count, Math.floor((areaLeft + EPS) / it.area));
      else k = Math.min(it.count, slotsLeft);
      if (k <= 0) continue;
      const slots = o.capacity.kind === "slots" ? o.capacity.slots.slice(o.capacity.slots.length - slotsLeft, o.capacity.slots.length - slotsLeft + k) : [];
      load.items.push({ item: it, pans: k, slots });
      it.count -= k;
      areaLeft -= k * it.area;
      slotsLeft -= k;
      load.usedArea += k * it.area;
      maxCool = Math.max(maxCool, it.cool);
    }
    load.end = Math.min(load.end, packFrom - maxCool);
    load.start = load.end - (o.loadMinutes + g.bake + o.unloadMinutes);
    if (best.setup > 0 && best.s.nextLoad) {
      heats.push({ oven: o, start: load.end, end: load.end + best.setup, temp: best.s.nextTemp!, fromTemp: g.temp });
    }
    best.s.nextStart = load.start;
    best.s.nextTemp = g.temp;
    best.s.nextLoad = load;
    drafts.push(load);
  }
  drafts.sort((a, b) => a.start - b.start || a.oven.id - b.oven.id);
  const loadNo = new Map(drafts.map((d, i) => [d, i + 1]));

  // ---- B. which pans each mix makes ------------------------------------------------------------
  interface Portion { load: LoadDraft; pans: Map<number, number>; pieces: number; gramsPans: number }
  const mixPortions = new Map<string, Portion[]>();
  const mixKey = (f: number, i: number) => `${f}:${i}`;
  const mixesByFormula = new Map<number, ScheduleMix[]>();
  for (const m of input.mixes) mixesByFormula.set(m.formulaId, [...(mixesByFormula.get(m.formulaId) ?? []), m]);
  for (const [fid, mixes] of mixesByFormula) {
    mixes.sort((a, b) => a.index - b.index);
    const segs: { load: LoadDraft; item: Item; pans: number }[] = [];
    for (const d of drafts) for (const x of d.items) if (x.item.formulaId === fid) segs.push({ load: d, item: x.item, pans: x.pans });
    const totalPans = segs.reduce((s, x) => s + x.pans, 0);
    const totalGrams = segs.reduce((s, x) => s + x.pans * x.item.gramsPerPan, 0);
    const totalMix = mixes.reduce((s, m) => s + m.doughGrams, 0) || 1;
    // Global split points in pan count: pan i (0-based) goes to the mix whose share holds its middle.
    // The boundaries rise, so one walk over the segments finds them all.
    const n = mixes.length;
    const splits: number[] = [];
    {
      let cumMix = 0;
      const boundaries = mixes.slice(0, n - 1).map((m) => {
        cumMix += m.doughGrams;
        return (totalGrams * cumMix) / totalMix;
      });
      let j = 0;
      let cum = 0;
      let idx = 0;
      for (const s of segs) {
        const w = s.item.gramsPerPan;
        while (j < boundaries.length) {
          const k = Math.ceil((boundaries[j] - cum) / w - 0.5 - EPS);
          if (k >= s.pans) break;
          splits.push(idx + Math.max(0, k));
          j++;
        }
        cum += s.pans * w;
        idx += s.pans;
      }
      while (splits.length < n - 1) splits.push(totalPans);
    }
    // every mix makes at least one pan when there are enough pans
    if (totalPans >= n) {
      for (let j = 0; j < splits.length; j++) splits[j] = Math.max(splits[j], (j > 0 ? splits[j - 1] : 0) + 1);
      for (let j = splits.length - 1; j >= 0; j--) splits[j] = Math.min(splits[j], (j < splits.length - 1 ? splits[j + 1] : totalPans) - 1);
    }
    const bounds = [0, ...splits, totalPans];
    let idx = 0;
    let j = 0;
    for (const s of segs) {
      const end = idx + s.pans;
      for (let lo = idx; lo < end;) {
        while (bounds[j + 1] <= lo) j++;
        const hi = Math.min(bounds[j + 1], end);
        const key = mixKey(fid, mixes[j].index);
        let list = mixPortions.get(key);
        if (!list) {
          list = [];
          mixPortions.set(key, list);
        }
        // a mix's segments come load by load, so its current portion is the last one
        let portion = list.length && list[list.length - 1].load === s.load ? list[list.length - 1] : undefined;
        if (!portion) {
          portion = { load: s.load, pans: new Map(), pieces: 0, gramsPans: 0 };
          list.push(portion);
        }
        portion.pans.set(s.item.productId, (portion.pans.get(s.item.productId) ?? 0) + (hi - lo));
        portion.pieces += (hi - lo) * s.item.piecesPerPan;
        portion.gramsPans += (hi - lo) * s.item.gramsPerPan;
        lo = hi;
      }
      idx = end;
    }
  }

  // ---- C. mixes, dividing and shaping, backwards ------------------------------------------------
  const crewLane = new Lane();
  const mixerLanes = new Map(res.mixers.map((m) => [m.id, new Lane()]));
  const heap = new MaxHeap<Chain>();
  const mixChains = new Map<string, Chain>();
  const done: Chain[] = [];
  const started = new Set<Chain>();
  const anchors = new Map<string, number>();
  const divideRate = Math.max(0, res.crew.divideMinutesPerPiece);
  const shapeRate = Math.max(0, res.crew.shapeMinutesPerPiece);
  const panRate = Math.max(0, res.crew.panMinutesPerPan);
  const assumed = new Set<number>();

  /** Walk a chain back through its resting steps, then queue it for its next resource step (or finish it). */
  const advance = (c: Chain) => {
    started.add(c);
    while (c.pos >= 0 && c.steps[c.pos].resource === null) {
      const s = c.steps[c.pos];
      c.placed.push({ step: s, kind: s.kind, start: c.cursor - s.minutes, end: c.cursor, resource: null, note: null });
      c.cursor -= s.minutes;
      c.pos--;
    }
    if (c.pos >= 0) heap.push(c.cursor, c);
    else finish(c);
  };
  const finish = (c: Chain) => {
    done.push(c);
    if (c.kind === "portion") {
      const key = mixKey(c.formulaId, c.mix);
      anchors.set(key, Math.min(anchors.get(key) ?? Infinity, c.cursor));
      const m = mixChains.get(key);
      if (m && --m.waiting! === 0) {
        m.cursor = anchors.get(key)!;
        advance(m);
      }
    }
  };
  /** Place the chain's resource step at the latest free time; a resting step after it absorbs any gap. */
  const placeResource = (c: Chain) => {
    const s = c.steps[c.pos];
    let start: number;
    let ref: ResourceRef;
    if (s.resource === "crew") {
      start = crewLane.latestStart(c.cursor, s.minutes);
      crewLane.book(start, start + s.minutes);
      ref = crewRef;
    } else {
      const fits = res.mixers.filter((m) => m.capacityKg * 1000 + 0.5 >= (c.mixDough ?? 0));
      const pool = fits.length ? fits : res.mixers;
      let bestStart = -Infinity;
      let bestMixer = pool[0];
      for (const m of pool) {
        const st = mixerLanes.get(m.id)!.latestStart(c.cursor, s.minutes);
        if (st > bestStart) { bestStart = st; bestMixer = m; }
      }
      start = bestStart;
      mixerLanes.get(bestMixer.id)!.book(start, start + s.minutes);
      ref = mixerRefs.get(bestMixer.id)!;
    }
    const end = start + s.minutes;
    const gap = c.cursor - end;
    if (gap > 0) {
      const nextRest = c.placed.length ? c.placed[c.placed.length - 1] : null;
      if (nextRest && nextRest.resource === null && nextRest.start === c.cursor) {
        nextRest.start = end;
        const why = s.resource === "crew" ? "the crew is busy with other dough later" : `${ref.name} is busy with another mix later`;
        nextRest.note = `${minutesText(nextRest.end - nextRest.start - nextRest.step.formulaMinutes)} longer than the formula's ${minutesText(nextRest.step.formulaMinutes)}: ${why}.`;
      }
    }
    if (s.parts) {
      let t = start;
      for (const p of s.parts) {
        c.placed.push({ step: { ...s, kind: p.kind, minutes: p.minutes, formulaMinutes: p.minutes }, kind: p.kind, start: t, end: t + p.minutes, resource: ref, note: null });
        t += p.minutes;
      }
    } else {
      c.placed.push({ step: s, kind: s.kind, start, end, resource: ref, note: null });
    }
    c.cursor = start;
    c.pos--;
    advance(c);
  };

  if (!res.mixers.length && input.mixes.length) conflicts.push({ kind: "no_mixer", message: "No mixer is set up: add one under Production settings.", minutes: null, entryId: null });

  for (const [fid, mixes] of mixesByFormula) {
    const f = formulas.get(fid);
    const shape = formulaChains(f);
    if (shape.assumedMix) assumed.add(fid);
    const retard = f?.retardHours && f.retardHours > 0 ? Math.round(f.retardHours * 60) : 0;
    const formulaPieces = mixes.reduce((s, m) => s + (mixPortions.get(mixKey(fid, m.index)) ?? []).reduce((a, p) => a + p.pieces, 0), 0);
    for (const m of mixes) {
      const key = mixKey(fid, m.index);
      const portions = (mixPortions.get(key) ?? []).sort((a, b) => a.load.start - b.load.start);
      const mixPieces = portions.reduce((s, p) => s + p.pieces, 0);
      const mixPans = portions.reduce((s, p) => s + [...p.pans.values()].reduce((a, b) => a + b, 0), 0);
      const productIds = [...new Set(portions.flatMap((p) => [...p.pans.keys()]))];
      if (!res.mixers.length) continue;
      const mixSteps = mixChainSteps(shape.perMix, (kind, minutes) => {
        if (kind !== "divide") return null;
        if (divideRate > 0 && mixPieces > 0) return Math.max(1, Math.ceil((mixPieces * divideRate) / people - EPS));
        return formulaPieces > 0 ? Math.max(1, Math.ceil((minutes * mixPieces) / formulaPieces - EPS)) : minutes;
      });
      const mc: Chain = {
        key, kind: "mix", steps: mixSteps, pos: mixSteps.length - 1, cursor: 0, placed: [], formulaId: fid, mix: m.index, load: null,
        productIds, pans: mixPans, dayBefore: retard > 0, mixDough: m.doughGrams, waiting: portions.length,
      };
      mixChains.set(key, mc);
      for (const p of portions) {
        const pans = [...p.pans.values()].reduce((a, b) => a + b, 0);
        const steps: ChainStep[] = [];
        for (const s of shape.perPortion) {
          if (s.kind === "shape") {
            const work = p.pieces * shapeRate + pans * panRate;
            const minutes = work > 0 ? Math.max(1, Math.ceil(work / people - EPS)) : Math.max(1, Math.ceil((s.minutes * pans) / Math.max(1, mixPans) - EPS));
            steps.push({ kind: "shape", minutes, formulaMinutes: s.minutes, resource: "crew" });
            if (retard) steps.push({ kind: "retard", minutes: retard, formulaMinutes: retard, resource: null });
          } else {
            steps.push({ kind: s.kind, minutes: s.minutes, formulaMinutes: s.minutes, resource: null });
          }
        }
        if (retard && !steps.some((s) => s.kind === "retard")) steps.unshift({ kind: "retard", minutes: retard, formulaMinutes: retard, resource: null });
        const pc: Chain = {
          key: `${key}-L${loadNo.get(p.load)}`, kind: "portion", steps, pos: steps.length - 1, cursor: p.load.start, placed: [], formulaId: fid, mix: m.index,
          load: loadNo.get(p.load)!, productIds: [...p.pans.keys()], pans, dayBefore: false,
        };
        advance(pc);
      }
    }
  }
  // Mixes with no pans of their own (a pan's dough bigger than a mix) go as late as the dough's other mixes allow.
  for (;;) {
    while (heap.size) placeResource(heap.pop()!);
    const idle = [...mixChains.values()].filter((c) => !started.has(c));
    if (!idle.length) break;
    for (const c of idle) {
      const others = [...anchors.entries()].filter(([k]) => k.startsWith(`${c.formulaId}:`)).map(([, v]) => v);
      c.cursor = others.length ? Math.min(...others) : packFrom;
      advance(c);
    }
  }

  // ---- D. write it out --------------------------------------------------------------------------
  const unsorted: ScheduleEntry[] = [];
  const starts: number[] = [];
  const ids = new Set<string>();
  const push = (e: Omit<ScheduleEntry, "startsAt" | "endsAt" | "label"> & { label?: string }, start: number, end: number) => {
    let id = e.id;
    for (let k = 2; ids.has(id); k++) id = `${e.id}-${k}`;
    ids.add(id);
    unsorted.push({
      id, step: e.step, label: e.label ?? SCHEDULE_LABELS[e.step], resource: e.resource, formulaId: e.formulaId, mix: e.mix, load: e.load,
      productIds: e.productIds, pans: e.pans, startsAt: iso(start), endsAt: iso(end), temperatureC: e.temperatureC, dayBefore: e.dayBefore, note: e.note,
    });
    starts.push(start);
  };
  const scheduledMixes: ScheduledMix[] = [];
  for (const c of done) {
    const retarded = (formulas.get(c.formulaId)?.retardHours ?? 0) > 0;
    // In a retarded chain, everything up to the retard is done the day before.
    const retardStep = c.placed.find((p) => p.kind === "retard");
    for (const p of c.placed) {
      const dayBefore = retarded && (c.kind === "mix" || (retardStep ? p.end <= retardStep.start : false));
      const id = c.kind === "mix" ? `f${c.formulaId}-m${c.mix}-${p.kind}` : `f${c.formulaId}-m${c.mix}-L${c.load}-${p.kind}`;
      const note = p.kind === "retard" ? `Retard at about 2–4 °C (common practice, no source: 8–16 h).${p.note ? ` ${p.note}` : ""}` : p.note;
      push({ id, step: p.kind, resource: p.resource, formulaId: c.formulaId, mix: c.mix, load: c.load, productIds: c.productIds, pans: c.pans, temperatureC: null, dayBefore, note }, p.start, p.end);
      if (p.kind === "retard") {
        const hours = (p.end - p.start) / 60;
        if (hours > RETARD_HOURS.max + EPS) warnings.push(`${formulas.get(c.formulaId)?.name ?? "A dough"}, mix ${c.mix}: the shaped pans wait ${minutesText(p.end - p.start)} in the retarder, past the usual ${RETARD_HOURS.max} h.`);
      }
    }
    if (c.kind === "mix") {
      const mixStep = c.placed.find((p) => p.kind === "mix");
      const paste = c.placed.find((p) => p.kind === "paste");
      if (mixStep && mixStep.resource) {
        const portions = mixPortions.get(mixKey(c.formulaId, c.mix)) ?? [];
        const pans = new Map<number, number>();
        for (const p of portions) for (const [pid, n] of p.pans) pans.set(pid, (pans.get(pid) ?? 0) + n);
        scheduledMixes.push({
          formulaId: c.formulaId, index: c.mix, mixerId: mixStep.resource.id, mixerName: mixStep.resource.name, startsAt: iso(mixStep.start), endsAt: iso(mixStep.end),
          pasteStartsAt: paste ? iso(paste.start) : null, dayBefore: retarded, pans: [...pans].map(([productId, n]) => ({ productId, pans: n })),
        });
      }
    }
  }
  for (const fid of assumed) warnings.push(`${formulas.get(fid)?.name ?? "A dough"} has no mix step: ${DEFAULT_MIX_MINUTES} min of mixing is assumed for each of its mixes. Add the step to the formula.`);

  const ovenLoads: OvenLoad[] = [];
  for (const d of drafts) {
    const n = loadNo.get(d)!;
    const ref = ovenRefs.get(d.oven.id)!;
    const bakeStart = d.start + d.oven.loadMinutes;
    const bakeEnd = bakeStart + d.bake;
    const productIds = [...new Set(d.items.map((x) => x.item.productId))];
    const pans = d.items.reduce((s, x) => s + x.pans, 0);
    const fids = [...new Set(d.items.map((x) => x.item.formulaId))];
    const loadFormula = fids.length === 1 ? fids[0] : null;
    push({ id: `L${n}-bake`, step: "bake", label: `${STEP_LABELS.bake} ${minutesText(d.bake)}`, resource: ref, formulaId: loadFormula, mix: null, load: n, productIds, pans, temperatureC: d.temp, dayBefore: false, note: loadNote(d.oven) }, bakeStart, bakeEnd);
    const byCool = new Map<number, { ids: number[]; pans: number }>();
    for (const x of d.items) {
      const c = byCool.get(x.item.cool) ?? { ids: [], pans: 0 };
      if (!c.ids.includes(x.item.productId)) c.ids.push(x.item.productId);
      c.pans += x.pans;
      byCool.set(x.item.cool, c);
    }
    for (const [cool, c] of [...byCool].sort((a, b) => a[0] - b[0])) {
      if (cool <= 0) continue;
      push({ id: `L${n}-cool-${cool}`, step: "cool", resource: null, formulaId: loadFormula, mix: null, load: n, productIds: c.ids, pans: c.pans, temperatureC: null, dayBefore: false, note: null }, d.end, d.end + cool);
    }
    ovenLoads.push({
      load: n, ovenId: d.oven.id, ovenName: d.oven.name, temperatureC: d.temp, bakeMinutes: d.bake, startsAt: iso(d.start), endsAt: iso(d.end), bakeStartsAt: iso(bakeStart), bakeEndsAt: iso(bakeEnd),
      items: d.items.map((x) => ({ productId: x.item.productId, formulaId: x.item.formulaId, pans: x.pans, slots: x.slots })), pans,
      usedAreaCm2: Math.round(d.usedArea), capacityAreaCm2: d.oven.capacity.kind === "area" ? d.oven.capacity.areaCm2 : null, capacitySlots: d.oven.capacity.kind === "slots" ? d.oven.capacity.slots.length : null,
    });
  }
  for (const h of heats) {
    const ref = ovenRefs.get(h.oven.id)!;
    const after = drafts.find((d) => d.oven === h.oven && d.start >= h.end);
    push({ id: `heat-${h.oven.id}-${h.start}`, step: "heat", label: `${h.temp > h.fromTemp ? "Heat" : "Bring down"} ${ref.name}`, resource: ref, formulaId: null, mix: null, load: after ? loadNo.get(after)! : null, productIds: [], pans: 0, temperatureC: h.temp, dayBefore: false, note: null }, h.start, h.end);
  }
  const order = unsorted.map((_, i) => i).sort((a, b) => starts[a] - starts[b] || a - b);
  const entries = order.map((i) => unsorted[i]);
  const startOf = order.map((i) => starts[i]);

  // ---- E. does the day fit the shift? ----------------------------------------------------------
  // The retard itself runs overnight from the day before: the day's own work starts after it.
  let firstAt = -1;
  let count = 0;
  for (let i = 0; i < entries.length; i++) {
    if (entries[i].dayBefore || entries[i].step === "retard") continue;
    if (firstAt < 0) firstAt = i;
    if (startOf[i] < shiftStart) count++;
  }
  const first = firstAt >= 0 ? { ...entries[firstAt], _start: startOf[firstAt] } : null;
  let earlierStart: DaySchedule["earlierStart"] = null;
  if (first && first._start < shiftStart) {
    const minutes = shiftStart - first._start;
    const fname = first.formulaId ? formulas.get(first.formulaId)?.name : null;
    const what = `${first.label}${fname ? ` (${fname}${first.mix ? `, mix ${first.mix}` : ""}${first.load ? `, oven load ${first.load}` : ""})` : ""}`;
    const text = `Start ${minutesText(minutes)} earlier, at ${whenText(first._start)}.`;
    conflicts.unshift({
      kind: "shift_start",
      message: `The day does not fit the shift: ${what} has to start at ${whenText(first._start)}, ${minutesText(minutes)} before the shift starts at ${whenText(shiftStart)}${count > 1 ? ` (${count} steps start before the shift)` : ""}. ${text}`,
      minutes, entryId: first.id,
    });
    earlierStart = { minutes, startsAt: iso(first._start), text };
  }

  const lanes: ResourceRef[] = [...mixerRefs.values(), crewRef, ...ovenRefs.values()];
  return {
    entries,
    ovenLoads,
    mixes: scheduledMixes.sort((a, b) => a.formulaId - b.formulaId || a.index - b.index),
    conflicts,
    earlierStart,
    resources: lanes,
    dispatchAt: iso(dispatch),
    packFrom: iso(packFrom),
    shiftStartsAt: iso(shiftStart),
    startsAt: first ? first.startsAt : null,
    warnings,
  };
}

function capacityOf(o: OvenSpec): number {
  return o.capacity.kind === "area" ? o.capacity.areaCm2 : o.capacity.slots.length * panAreaCm2(o.capacity.slotLengthMm, o.capacity.slotWidthMm);
}

function loadNote(o: OvenSpec): string | null {
  const parts = [o.loadMinutes > 0 ? `load ${minutesText(o.loadMinutes)} before` : "", o.unloadMinutes > 0 ? `unload ${minutesText(o.unloadMinutes)} after` : ""].filter(Boolean);
  return parts.length ? `${o.name}: ${parts.join(", ")}.` : null;
}
