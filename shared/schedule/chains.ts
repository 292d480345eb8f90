/** A formula's steps as chains: what each mix does on the mixer and the crew, and what each portion does. */
import type { StepKind } from "../production";
import { DEFAULT_MIX_MINUTES } from "./resources";
import type { ResourceRef, ScheduleFormula, ScheduleStep } from "./types";

export interface ChainStep {
  kind: ScheduleStep;
  minutes: number;
  /** Formula minutes, for the "runs longer" note. */
  formulaMinutes: number;
  resource: "mixer" | "crew" | null;
  /** A mixer block: the steps that keep the mixer busy, in order (mix, rest, knead). */
  parts?: { kind: StepKind; minutes: number }[];
}

export interface Placed {
  step: ChainStep;
  kind: ScheduleStep;
  start: number;
  end: number;
  resource: ResourceRef | null;
  note: string | null;
}

export interface Chain {
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
export function formulaChains(f: ScheduleFormula | undefined) {
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
export function mixChainSteps(steps: { kind: StepKind; minutes: number }[], crewMinutes: (kind: StepKind, formulaMinutes: number) => number | null): ChainStep[] {
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
