/** Ingredient and step kinds, their labels, and the formula as the production arithmetic reads it. */
export const INGREDIENT_KINDS = ["flour", "liquid", "fat", "sugar", "salt", "leavening", "egg", "inclusion", "other"] as const;
export type IngredientKind = (typeof INGREDIENT_KINDS)[number];

export const STEP_KINDS = ["paste", "mix", "rest", "knead", "bulk", "divide", "bench", "shape", "proof", "wash", "bake", "cool"] as const;
export type StepKind = (typeof STEP_KINDS)[number];
export const STEP_LABELS: Record<StepKind, string> = {
  paste: "Cook and cool the paste",
  mix: "Mix",
  rest: "Rest",
  knead: "Knead",
  bulk: "Bulk ferment",
  divide: "Divide and round",
  bench: "Bench rest",
  shape: "Shape and pan",
  proof: "Final proof",
  wash: "Wash",
  bake: "Bake",
  cool: "Cool",
};

export interface IngredientInfo {
  id: number;
  name: string;
  kind: IngredientKind;
  /** Water content in percent of the ingredient's weight (for effective hydration). */
  waterPercent: number;
}

export interface PasteSpec {
  flourIngredientId: number;
  liquidIngredientId: number;
  /** Share of the formula's total flour that is cooked into the paste, percent. */
  flourPercent: number;
  /** Liquid to flour by weight (5 means 5:1). */
  liquidRatio: number;
  cookToC: number;
}

export interface StepSpec {
  kind: StepKind;
  minutes: number;
  /** For the bake: oven temperature. */
  temperatureC?: number | null;
}

export interface FormulaSpec {
  id: number;
  version: number;
  name: string;
  lossPercent: number;
  ddtC: number;
  frictionC: number;
  paste: PasteSpec | null;
  lines: { ingredientId: number; percent: number }[];
  steps: StepSpec[];
  targetInternalC?: number | null;
}
