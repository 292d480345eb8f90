import type { PickerOption } from "../ui/InlinePicker";
import type { IngredientInfo, StepKind } from "../../shared/production";
import type { IngredientDto } from "../../shared/schemas/production";
import { celsiusToFahrenheit } from "../../shared/units";
import { DEFAULT_PASTE, newKey, type FormulaValues, type LineValue, type PasteValues, type StepValue } from "./formulaForm";
import { KIND_LABEL, KIND_ORDER } from "./ingredientKinds";

/**
 * The formula editor's changes to its draft (no React): each returns the part of the values it changes, for the
 * form's `patch`. Lines and steps keep their keys, so React keeps each row's inputs while they move.
 */
export type DraftChange = Partial<FormulaValues>;

export const setLine = (v: FormulaValues, i: number, change: Partial<LineValue>): DraftChange => ({ lines: v.lines.map((l, n) => (n === i ? { ...l, ...change } : l)) });
export const removeLine = (v: FormulaValues, i: number): DraftChange => ({ lines: v.lines.filter((_, n) => n !== i) });
export const addLine = (v: FormulaValues): DraftChange => ({ lines: [...v.lines, { key: newKey("line"), ingredientId: null, percent: "" }] });

export const setStep = (v: FormulaValues, i: number, change: Partial<StepValue>): DraftChange => ({ steps: v.steps.map((s, n) => (n === i ? { ...s, ...change } : s)) });
export const removeStep = (v: FormulaValues, i: number): DraftChange => ({ steps: v.steps.filter((_, n) => n !== i) });
export const addStep = (v: FormulaValues): DraftChange => ({ steps: [...v.steps, { key: newKey("step"), kind: "rest", minutes: "", temperatureC: "" }] });

/** A step turned into a bake gets the usual 180 °C unless it has a temperature already. */
export const setStepKind = (v: FormulaValues, i: number, kind: StepKind): DraftChange => {
  const s = v.steps[i];
  return setStep(v, i, { kind, temperatureC: kind === "bake" && !s.temperatureC ? "180" : s.temperatureC });
};

/** Swap a step with the one before (-1) or after (1); nothing past either end. */
export function moveStep(v: FormulaValues, i: number, by: -1 | 1): DraftChange | null {
  const j = i + by;
  if (j < 0 || j >= v.steps.length) return null;
  const steps = [...v.steps];
  [steps[i], steps[j]] = [steps[j], steps[i]];
  return { steps };
}

/** Turning the paste off forgets what was typed for it. */
export const setPasteOn = (v: FormulaValues, on: boolean): DraftChange => ({ pasteOn: on, paste: on ? v.paste : { ...DEFAULT_PASTE } });
export const setPaste = (v: FormulaValues, change: Partial<PasteValues>): DraftChange => ({ paste: { ...v.paste, ...change } });

/** The ingredient picker's options: flour first, then by kind as usually weighed, then by name. */
export function ingredientOptions(ingredients: readonly IngredientDto[]): PickerOption<number>[] {
  return [...ingredients]
    .sort((a, b) => KIND_ORDER.indexOf(a.kind) - KIND_ORDER.indexOf(b.kind) || a.name.localeCompare(b.name))
    .map((i) => ({ value: i.id, label: i.name, hint: KIND_LABEL[i.kind] }));
}

/** The formula's own lines of one kind, as options (the paste cooks a flour and a liquid of the formula). */
export function linesOfKind(v: FormulaValues, infos: Map<number, IngredientInfo>, options: readonly PickerOption<number>[], kind: string): PickerOption<number>[] {
  return v.lines
    .filter((l) => l.ingredientId !== null && infos.get(l.ingredientId)?.kind === kind)
    .map((l) => options.find((o) => o.value === l.ingredientId))
    .filter((o): o is PickerOption<number> => !!o);
}

/** "= 356 °F" under a °C field while it holds a number. */
export function fahrenheitHint(typed: string): string | undefined {
  const n = Number(typed.trim().replace(",", "."));
  return typed.trim() !== "" && Number.isFinite(n) ? `= ${Math.round(celsiusToFahrenheit(n))} °F` : undefined;
}
