import { Platform } from "react-native";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { saveBlob } from "./files";
import { productionKeys } from "./keys";
import type { z } from "zod";
import type { ProductionSettingsDto, productionSettingsSchema } from "../../shared/schemas/production";
import type { BakeDayInput, ForecastDto, PlanProgress, PlanView, ProgressInput } from "../../shared/contracts/production";
import type { UnitSystem } from "../../shared/units";

/** The plan as the API sends it, the bake day's inputs and progress, the forecast: shared/contracts/production.ts. */
export type { BakeDayInput, ForecastDto, InternalReadingInput, PlanProgress, PlanView, ProgressInput, TickInput } from "../../shared/contracts/production";

/** Mixers, ovens, crew, packing, shift start, dispatch and overnight retard (shared/schemas/production.ts). */
export type { ProductionSettingsDto };
export type ProductionSettingsBody = z.input<typeof productionSettingsSchema>;

export { productionKeys } from "./keys";

/** The key a mix's progress is stored under. */
export const mixKey = (formulaId: number, index: number) => `${formulaId}:${index}`;

export const productionApi = {
  nextDay: () => api<{ date: string }>("/api/production/next-day").then((r) => r.date),
  plan: (date: string) => api<{ plan: PlanView }>("/api/production/plan", { query: { date } }).then((r) => r.plan),
  recalculate: (date: string) => api<{ plan: PlanView }>("/api/production/plan/recalculate", { method: "POST", query: { date } }).then((r) => r.plan),
  saveBakeDay: (date: string, input: BakeDayInput) => api<{ plan: PlanView }>(`/api/production/bake-days/${date}`, { method: "PUT", body: input }).then((r) => r.plan),
  progress: (date: string, input: ProgressInput) => api<{ progress: PlanProgress }>(`/api/production/bake-days/${date}/progress`, { method: "POST", body: input }).then((r) => r.progress),
  pdf: (date: string, units: UnitSystem) => apiBlob("/api/production/plan.pdf", { date, units }),
  forecast: (from: string) => api<{ forecast: ForecastDto }>("/api/production/forecast", { query: { from } }).then((r) => r.forecast),
  forecastCsv: (from: string) => apiBlob("/api/production/forecast.csv", { from }),
  settings: () => api<{ settings: ProductionSettingsDto }>("/api/production/settings").then((r) => r.settings),
  saveSettings: (input: ProductionSettingsBody) => api<{ settings: ProductionSettingsDto }>("/api/production/settings", { method: "PUT", body: input }).then((r) => r.settings),
};

/** The next bake day in the bakery's zone (the first delivery date whose dispatch is still ahead). */
export function useNextBakeDayQuery(options: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: productionKeys.nextDay(), queryFn: productionApi.nextDay, enabled: options.enabled ?? true });
}

export function usePlanQuery(date: string | null) {
  return useQuery({ queryKey: productionKeys.plan(date ?? ""), queryFn: () => productionApi.plan(date!), enabled: !!date });
}

/**
 * A plan the server just worked out again: show it at once, and refresh the forecast that depends on it.
 * Its `changes` say what this recalculation moved (the screen shows them); the stored plan now matches a
 * fresh calculation, so the cached copy has none pending.
 */
function usePlanSaved(date: string) {
  const qc = useQueryClient();
  return (plan: PlanView) => {
    qc.setQueryData(productionKeys.plan(date), { ...plan, changes: [] });
    void qc.invalidateQueries({ queryKey: productionKeys.forecasts() });
  };
}

/** Recalculate on purpose (the plan is stored again); the answer's `changes` say what moved. */
export function useRecalculatePlanMutation(date: string) {
  const saved = usePlanSaved(date);
  return useMutation({ mutationFn: () => productionApi.recalculate(date), onSuccess: saved });
}

/** The baker's inputs for the day: extra pans per product and the three temperatures. */
export function useSaveBakeDayMutation(date: string) {
  const saved = usePlanSaved(date);
  return useMutation({ mutationFn: (input: BakeDayInput) => productionApi.saveBakeDay(date, input), onSuccess: saved });
}

/** Tick a mix or a wave done (or not); the plan shows the answer's progress at once. */
export function useProgressMutation(date: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ProgressInput) => productionApi.progress(date, input),
    onSuccess: (progress) => {
      qc.setQueryData<PlanView>(productionKeys.plan(date), (plan) => (plan ? { ...plan, progress } : plan));
      void qc.invalidateQueries({ queryKey: productionKeys.plan(date) });
    },
  });
}

export function useForecastQuery(from: string | null) {
  return useQuery({ queryKey: productionKeys.forecast(from ?? ""), queryFn: () => productionApi.forecast(from!), enabled: !!from });
}

export function useProductionSettingsQuery() {
  return useQuery({ queryKey: productionKeys.settings(), queryFn: productionApi.settings });
}

/** Owner only. Mixer size, dispatch and oven room change every plan, so all of production is refreshed. */
export function useSaveProductionSettingsMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: productionApi.saveSettings,
    onSuccess: (settings) => {
      qc.setQueryData(productionKeys.settings(), settings);
      void qc.invalidateQueries({ queryKey: productionKeys.all });
    },
  });
}

/**
 * Fetch the production sheet (with the bearer token) and hand it to the browser as a file download,
 * through a temporary object URL (web only).
 */
export async function downloadPlanPdf(date: string, units: UnitSystem): Promise<void> {
  const blob = await productionApi.pdf(date, units);
  if (Platform.OS !== "web" || typeof document === "undefined" || typeof URL === "undefined" || !URL.createObjectURL) {
    throw new Error("The production sheet downloads in the web app.");
  }
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = `production-${date}${units === "us" ? "-us" : ""}.pdf`;
  a.rel = "noopener";
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** Download the purchasing forecast as CSV ("purchasing-2026-12-05-to-2026-12-11.csv"). */
export async function downloadForecastCsv(forecast: Pick<ForecastDto, "from" | "to">): Promise<void> {
  saveBlob(await productionApi.forecastCsv(forecast.from), `purchasing-${forecast.from}-to-${forecast.to}.csv`);
}
