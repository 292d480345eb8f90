/**
 * Checks any day's schedule must pass, written against the plan's own output only (not the scheduler's
 * internals): used by tests/shared/schedule.test.ts and tests/server/production.test.ts.
 *
 * - No two steps overlap on one mixer, on the crew, or on one oven (an oven is busy from loading to the end of
 *   unloading, and while it changes temperature).
 * - Every weigh-out card has exactly one mix step.
 * - Each oven load's pans fit its oven: footprints (length × width) within the usable shelf area, or one pan per
 *   named slot and each pan no bigger than the slot either way round.
 * - Every step ends at least the packing time before dispatch.
 * - Every pan of every product is in exactly one oven load (unless the plan says it fits no oven).
 * - Each load's pans come out of their proof as the load goes in (proof and wash end by the load's start).
 */
import type { DaySchedule, OvenSpec, ScheduleEntry } from "../../shared/schedule";

export interface CheckInput {
  entries: ScheduleEntry[];
  schedule: Omit<DaySchedule, "entries" | "warnings">;
  /** The weigh-out cards: formula id and mix index of every card. */
  cards: { formulaId: number; index: number }[];
  ovens: OvenSpec[];
  packingMinutes: number;
  products: { productId: number; pans: number; panLengthMm: number; panWidthMm: number; formulaId: number | null }[];
}

const t = (iso: string) => Date.parse(iso);

export function scheduleProblems(x: CheckInput): string[] {
  const out: string[] = [];
  const lanes = new Map<string, { start: number; end: number; what: string }[]>();
  const add = (key: string, start: number, end: number, what: string) => lanes.set(key, [...(lanes.get(key) ?? []), { start, end, what }]);
  for (const e of x.entries) {
    if (t(e.endsAt) < t(e.startsAt)) out.push(`${e.id} ends before it starts`);
    if (e.resource && (e.resource.kind === "mixer" || e.resource.kind === "crew")) add(`${e.resource.kind}:${e.resource.id}`, t(e.startsAt), t(e.endsAt), e.id);
    if (e.step === "heat" && e.resource) add(`oven:${e.resource.id}`, t(e.startsAt), t(e.endsAt), e.id);
  }
  for (const l of x.schedule.ovenLoads) add(`oven:${l.ovenId}`, t(l.startsAt), t(l.endsAt), `load ${l.load}`);
  for (const [lane, list] of lanes) {
    list.sort((a, b) => a.start - b.start || a.end - b.end);
    for (let i = 1; i < list.length; i++) {
      if (list[i].start < list[i - 1].end) out.push(`${lane}: ${list[i - 1].what} and ${list[i].what} overlap`);
    }
  }
  for (const c of x.cards) {
    const n = x.entries.filter((e) => e.step === "mix" && e.formulaId === c.formulaId && e.mix === c.index).length;
    if (n !== 1) out.push(`card ${c.formulaId}:${c.index} has ${n} mix steps`);
  }
  const dims = new Map(x.products.map((p) => [p.productId, p]));
  for (const l of x.schedule.ovenLoads) {
    const oven = x.ovens.find((o) => o.id === l.ovenId);
    if (!oven) { out.push(`load ${l.load}: unknown oven ${l.ovenId}`); continue; }
    if (oven.capacity.kind === "area") {
      const area = l.items.reduce((s, i) => s + (i.pans * dims.get(i.productId)!.panLengthMm * dims.get(i.productId)!.panWidthMm) / 100, 0);
      if (area > oven.capacity.areaCm2 + 1e-6) out.push(`load ${l.load}: ${area} cm² of pans in ${oven.capacity.areaCm2} cm²`);
    } else {
      const cap = oven.capacity;
      const pans = l.items.reduce((s, i) => s + i.pans, 0);
      if (pans > cap.slots.length) out.push(`load ${l.load}: ${pans} pans in ${cap.slots.length} slots`);
      for (const i of l.items) {
        const d = dims.get(i.productId)!;
        const fits = (d.panLengthMm <= cap.slotLengthMm && d.panWidthMm <= cap.slotWidthMm) || (d.panLengthMm <= cap.slotWidthMm && d.panWidthMm <= cap.slotLengthMm);
        if (!fits) out.push(`load ${l.load}: product ${i.productId}'s pan does not fit a slot`);
        if (i.slots.length !== i.pans) out.push(`load ${l.load}: product ${i.productId} has ${i.pans} pans but ${i.slots.length} slots named`);
      }
      const named = l.items.flatMap((i) => i.slots);
      if (new Set(named).size !== named.length) out.push(`load ${l.load}: a slot is used twice`);
    }
    const bake = x.entries.find((e) => e.step === "bake" && e.load === l.load);
    if (!bake) out.push(`load ${l.load}: no bake step`);
    else if (t(bake.startsAt) < t(l.startsAt) || t(bake.endsAt) > t(l.endsAt)) out.push(`load ${l.load}: the bake lies outside the oven's time`);
    for (const e of x.entries.filter((e) => e.load === l.load && (e.step === "proof" || e.step === "wash"))) {
      if (t(e.endsAt) > t(l.startsAt)) out.push(`${e.id} ends after its load goes in`);
    }
  }
  const packBy = t(x.schedule.dispatchAt) - x.packingMinutes * 60_000;
  if (t(x.schedule.packFrom) !== packBy) out.push(`packFrom ${x.schedule.packFrom} is not dispatch less ${x.packingMinutes} min`);
  for (const e of x.entries) if (t(e.endsAt) > packBy) out.push(`${e.id} ends at ${e.endsAt}, after packing starts`);
  const unfit = new Set(x.schedule.conflicts.filter((c) => c.kind === "no_oven" || c.kind === "no_bake").map((c) => c.message));
  for (const p of x.products) {
    if (!p.formulaId || p.pans === 0) continue;
    const inLoads = x.schedule.ovenLoads.reduce((s, l) => s + l.items.filter((i) => i.productId === p.productId).reduce((a, i) => a + i.pans, 0), 0);
    if (inLoads !== p.pans && unfit.size === 0) out.push(`product ${p.productId}: ${inLoads} of ${p.pans} pans in oven loads`);
  }
  return out;
}
