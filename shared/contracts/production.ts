/**
 * Production answers and bodies that have no zod schema of their own: the plan as the API sends it, the purchasing
 * forecast, a formula's version history, and the bake day's inputs and progress as the client sends them (typed
 * from their schemas in shared/schemas/production.ts, so the form and the route agree).
 */
import type { z } from "zod";
import type { bakeDayInputSchema, PlanDto, progressInputSchema } from "../schemas/production";

/** GET /api/production/plan and every plan write: the stored or live plan, plus what a fresh calculation would change. */
export type PlanView = PlanDto & { changes: string[] };
export type PlanProgress = PlanDto["progress"];

/** PUT /api/production/bake-days/:date: extra pans per product and the day's temperatures (°C). */
export type BakeDayInput = z.output<typeof bakeDayInputSchema>;

/**
 * POST /api/production/bake-days/:date/progress. A tick: key "<formulaId>:<mixIndex>" for a mix, "<loadNumber>"
 * for an oven load (kind "wave", its stored name). An internal reading: the oven load's number and the
 * temperature reached (°C; null clears it), recorded by the baker.
 */
export type ProgressInput = z.input<typeof progressInputSchema>;
export type TickInput = Extract<ProgressInput, { kind: "mix" | "wave" }>;
export type InternalReadingInput = Extract<ProgressInput, { kind: "internal" }>;

/** GET /api/production/forecast?from=: ingredients for the next 7 days, in purchase packs rounded up. */
export interface ForecastDto {
  from: string;
  to: string;
  days: { date: string; doughGrams: number; orderedUnits: number }[];
  items: { ingredientId: number; name: string; grams: number; packName: string; packGrams: number; packs: number; costCents: number; byDay: Record<string, number> }[];
  totalCostCents: number;
}

/** GET /api/formulas/:id/history, newest first. */
export interface FormulaVersionDto {
  version: number;
  note: string;
  /** Who saved it (null for the seed's first versions). */
  editedById: number | null;
  createdAt: string;
}
