/** Pass D: the placed chains, oven loads and temperature changes written out as the day's entries. */
import { STEP_LABELS } from "../production";
import type { Chain } from "./chains";
import type { Day } from "./context";
import type { Heat, LoadDraft } from "./ovens";
import { mixKey, type Portion } from "./portions";
import { DEFAULT_MIX_MINUTES, EPS, RETARD_HOURS, loadNote, minutesText } from "./resources";
import { SCHEDULE_LABELS, type OvenLoad, type ScheduledMix, type ScheduleEntry } from "./types";

export interface Placement {
  done: Chain[];
  assumed: Set<number>;
  mixPortions: Map<string, Portion[]>;
  drafts: LoadDraft[];
  heats: Heat[];
  loadNo: Map<LoadDraft, number>;
}

export interface WrittenDay {
  /** In time order, with their starts (epoch minutes) alongside. */
  entries: ScheduleEntry[];
  startOf: number[];
  ovenLoads: OvenLoad[];
  scheduledMixes: ScheduledMix[];
}

export function writeEntries(day: Day, placement: Placement): WrittenDay {
  const { formulas, iso, warnings, ovenRefs } = day;
  const { done, assumed, mixPortions, drafts, heats, loadNo } = placement;
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
  return { entries, startOf, ovenLoads, scheduledMixes };
}
