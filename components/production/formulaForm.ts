import { formulaFigures, formulaWarnings, validateFormula, type FormulaFigures, type IngredientInfo, type StepKind } from "../../shared/production";
import { formulaInputSchema, type FormulaDto, type FormulaInput, type IngredientDto } from "../../shared/schemas/production";
import { fieldErrorsFrom } from "../../shared/schemas/common";
import type { FieldErrors } from "../../shared/errors";
import { rowFields, type CheckResult } from "../forms/checkedSchema";

/** One ingredient line as typed: the percent stays text until it is read. */
export interface LineValue {
  key: string;
  ingredientId: number | null;
  percent: string;
}

export interface StepValue {
  key: string;
  kind: StepKind;
  minutes: string;
  /** Oven temperature (°C), for the bake. */
  temperatureC: string;
}

export interface PasteValues {
  flourIngredientId: number | null;
  liquidIngredientId: number | null;
  /** Share of the formula's flour cooked, percent. */
  flourPercent: string;
  /** Liquid to flour by weight (5 = 5:1). */
  liquidRatio: string;
  cookToC: string;
}

export interface FormulaValues {
  name: string;
  lossPercent: string;
  ddtC: string;
  frictionC: string;
  /** Blank: none. */
  targetInternalC: string;
  lines: LineValue[];
  pasteOn: boolean;
  paste: PasteValues;
  steps: StepValue[];
  note: string;
}

let keySeq = 0;
/** A key for a new line or step (React lists), unique in this session. */
export const newKey = (prefix: string) => `${prefix}-${++keySeq}`;

export const DEFAULT_PASTE: PasteValues = { flourIngredientId: null, liquidIngredientId: null, flourPercent: "5", liquidRatio: "5", cookToC: "65" };

/** A new formula: one flour line at 100 % and the usual enriched-dough steps to fill in. */
export function emptyFormula(): FormulaValues {
  return {
    name: "",
    lossPercent: "2",
    ddtC: "26",
    frictionC: "12",
    targetInternalC: "",
    lines: [{ key: newKey("line"), ingredientId: null, percent: "100" }],
    pasteOn: false,
    paste: { ...DEFAULT_PASTE },
    steps: (["mix", "bulk", "divide", "shape", "proof", "bake", "cool"] as StepKind[]).map((kind) => ({ key: newKey("step"), kind, minutes: "", temperatureC: kind === "bake" ? "180" : "" })),
    note: "",
  };
}

const text = (n: number | null | undefined) => (n === null || n === undefined ? "" : String(n));

export function valuesOf(f: FormulaDto): FormulaValues {
  return {
    name: f.name,
    lossPercent: text(f.lossPercent),
    ddtC: text(f.ddtC),
    frictionC: text(f.frictionC),
    targetInternalC: text(f.targetInternalC),
    lines: f.lines.map((l) => ({ key: newKey("line"), ingredientId: l.ingredientId, percent: text(l.percent) })),
    pasteOn: !!f.paste,
    paste: f.paste
      ? { flourIngredientId: f.paste.flourIngredientId, liquidIngredientId: f.paste.liquidIngredientId, flourPercent: text(f.paste.flourPercent), liquidRatio: text(f.paste.liquidRatio), cookToC: text(f.paste.cookToC) }
      : { ...DEFAULT_PASTE },
    steps: f.steps.map((s) => ({ key: newKey("step"), kind: s.kind, minutes: text(s.minutes), temperatureC: text(s.temperatureC) })),
    note: "",
  };
}

/** A typed number ("58", "1.8", "1,8"), or NaN. */
export function readNumber(typed: string): number {
  const t = typed.trim().replace(",", ".");
  if (!/^-?(\d+(\.\d*)?|\.\d+)$/.test(t)) return Number.NaN;
  return Number(t);
}

export function ingredientMap(ingredients: IngredientDto[]): Map<number, IngredientInfo> {
  return new Map(ingredients.map((i) => [i.id, { id: i.id, name: i.name, kind: i.kind, waterPercent: i.waterPercent }]));
}

/** The values in the shape the shared arithmetic reads. */
export function specOf(v: FormulaValues) {
  return {
    lossPercent: readNumber(v.lossPercent),
    lines: v.lines.map((l) => ({ ingredientId: l.ingredientId ?? 0, percent: readNumber(l.percent) })),
    paste: v.pasteOn
      ? {
          flourIngredientId: v.paste.flourIngredientId ?? 0,
          liquidIngredientId: v.paste.liquidIngredientId ?? 0,
          flourPercent: readNumber(v.paste.flourPercent),
          liquidRatio: readNumber(v.paste.liquidRatio),
          cookToC: readNumber(v.paste.cookToC),
        }
      : null,
  };
}

/** Derived figures as the baker types: only lines with an ingredient and a number count. */
export function liveFigures(v: FormulaValues, ingredients: Map<number, IngredientInfo>): FormulaFigures {
  const spec = specOf(v);
  const lines = spec.lines.filter((l) => ingredients.has(l.ingredientId) && Number.isFinite(l.percent));
  const paste = spec.paste && Number.isFinite(spec.paste.flourPercent) && Number.isFinite(spec.paste.liquidRatio) ? spec.paste : null;
  return formulaFigures({ lines, paste }, ingredients);
}

/**
 * What can't be baked as written, from the shared validateFormula (the server runs the same), keyed like
 * the API's fields. `attempted` (after a first save) adds the lines still being filled in.
 */
export function liveProblems(v: FormulaValues, ingredients: Map<number, IngredientInfo>, attempted: boolean): FieldErrors {
  const errors = validateFormula(specOf(v), ingredients);
  v.lines.forEach((l, i) => {
    if (l.ingredientId === null && errors[`lines.${i}.ingredientId`]) errors[`lines.${i}.ingredientId`] = "Choose an ingredient.";
    if (!attempted && (l.ingredientId === null || l.percent.trim() === "")) {
      delete errors[`lines.${i}.ingredientId`];
      delete errors[`lines.${i}.percent`];
    }
  });
  if (v.pasteOn) {
    if (v.paste.flourIngredientId === null) errors["paste.flourIngredientId"] = "Choose the flour to cook.";
    if (v.paste.liquidIngredientId === null) errors["paste.liquidIngredientId"] = "Choose the liquid to cook.";
  }
  return errors;
}

/** Values that can be saved but look wrong (shared formulaWarnings): a friction factor implausible in °C. */
export function liveWarnings(v: FormulaValues): FieldErrors {
  return formulaWarnings({ frictionC: readNumber(v.frictionC) });
}

/** The API body, checked with the shared formulaInputSchema; or the messages per field. */
export function formulaBody(v: FormulaValues, ingredients: Map<number, IngredientInfo>): CheckResult<FormulaInput> {
  const fields: FieldErrors = { ...liveProblems(v, ingredients, true) };
  const spec = specOf(v);
  const candidate = {
    name: v.name,
    lossPercent: v.lossPercent.trim() === "" ? undefined : v.lossPercent.trim().replace(",", "."),
    ddtC: v.ddtC.trim() === "" ? undefined : v.ddtC.trim().replace(",", "."),
    frictionC: v.frictionC.trim() === "" ? undefined : v.frictionC.trim().replace(",", "."),
    targetInternalC: v.targetInternalC.trim() === "" ? null : v.targetInternalC.trim().replace(",", "."),
    paste: spec.paste,
    lines: spec.lines,
    steps: v.steps.map((s) => ({ kind: s.kind, minutes: readNumber(s.minutes), ...(s.kind === "bake" ? { temperatureC: s.temperatureC.trim() === "" ? null : readNumber(s.temperatureC) } : {}) })),
    note: v.note,
  };
  const parsed = formulaInputSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const [k, m] of Object.entries(fieldErrorsFrom(parsed.error))) if (!fields[k]) fields[k] = m;
  }
  v.steps.forEach((s, i) => {
    if (s.minutes.trim() === "" || Number.isNaN(readNumber(s.minutes))) fields[`steps.${i}.minutes`] = "Enter whole minutes.";
    if (s.kind === "bake" && s.temperatureC.trim() !== "" && Number.isNaN(readNumber(s.temperatureC))) fields[`steps.${i}.temperatureC`] = "Enter the oven temperature in °C.";
  });
  if (Object.keys(fields).length || !parsed.success) return { ok: false, fields };
  return { ok: true, input: parsed.data as FormulaInput };
}

/** Every field key the API may name (up to the schema's 40 lines and 30 steps), for putting its messages beside the right inputs. */
export const FORMULA_FIELDS: readonly string[] = [
  "name", "lossPercent", "ddtC", "frictionC", "targetInternalC", "note", "lines",
  ...rowFields("lines", 40, ["ingredientId", "percent"]),
  "paste.flourIngredientId", "paste.liquidIngredientId", "paste.flourPercent", "paste.liquidRatio", "paste.cookToC",
  ...rowFields("steps", 30, ["minutes", "temperatureC", "kind"]),
];
