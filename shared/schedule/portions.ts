/** Pass B: which pans (and so which oven loads) each mix's dough makes. */
import { EPS } from "./resources";
import type { Item, LoadDraft } from "./ovens";
import type { ScheduleInput, ScheduleMix } from "./types";

/** A mix's key: "<formulaId>:<mix index>". */
export const mixKey = (f: number, i: number) => `${f}:${i}`;

/** The pans of one mix that go into one oven load. */
export interface Portion { load: LoadDraft; pans: Map<number, number>; pieces: number; gramsPans: number }

export interface MixPortions {
  mixPortions: Map<string, Portion[]>;
  /** Each formula's mixes, by index. */
  mixesByFormula: Map<number, ScheduleMix[]>;
}

export function portionMixes(input: Pick<ScheduleInput, "mixes">, drafts: LoadDraft[]): MixPortions {
  const mixPortions = new Map<string, Portion[]>();
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
  return { mixPortions, mixesByFormula };
}
