/** Pass C: mixes, dividing and shaping, placed backwards from their oven loads on the mixers and the crew. */
import { formulaChains, mixChainSteps, type Chain, type ChainStep } from "./chains";
import type { Day } from "./context";
import { Lane, MaxHeap } from "./lanes";
import type { LoadDraft } from "./ovens";
import { mixKey, type Portion } from "./portions";
import { EPS, minutesText } from "./resources";
import type { ResourceRef, ScheduleMix } from "./types";

export interface PlacedChains {
  /** Every chain, as it was finished. */
  done: Chain[];
  /** Formulas without a mix step (one was assumed). */
  assumed: Set<number>;
}

export function placeChains(day: Day, mixesByFormula: Map<number, ScheduleMix[]>, mixPortions: Map<string, Portion[]>, loadNo: Map<LoadDraft, number>): PlacedChains {
  const { input, res, formulas, conflicts, crewRef, people, mixerRefs, packFrom } = day;
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
  return { done, assumed };
}
