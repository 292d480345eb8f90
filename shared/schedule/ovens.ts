/** Pass A: the oven loads, worked backwards from the packing time over the ovens. */
import type { Day } from "./context";
import { formulaChains } from "./chains";
import { EPS, capacityOf, panAreaCm2, panFitsOven, resolveBake } from "./resources";
import type { OvenSpec, ScheduleProduct } from "./types";

export interface Item { productId: number; formulaId: number; count: number; lengthMm: number; widthMm: number; area: number; cool: number; piecesPerPan: number; gramsPerPan: number }
export interface Group { temp: number; bake: number; items: Item[] }
export interface LoadDraft { oven: OvenSpec; temp: number; bake: number; start: number; end: number; items: { item: Item; pans: number; slots: string[] }[]; usedArea: number }
export interface Heat { oven: OvenSpec; start: number; end: number; temp: number; fromTemp: number }

export interface OvenPlan {
  /** In time order; a load's number is its place in this list (loadNo). */
  drafts: LoadDraft[];
  heats: Heat[];
  loadNo: Map<LoadDraft, number>;
}

export function planOvenLoads(day: Day): OvenPlan {
  const { input, formulas, res, packFrom, conflicts } = day;
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
  return { drafts, heats, loadNo };
}
