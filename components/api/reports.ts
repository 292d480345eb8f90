import { useQuery } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { saveBlob } from "./files";
import { reportKeys } from "./keys";
import type { AgingBucket } from "../../shared/billing";
import type { ExportFile, ExportRange } from "../../shared/schemas/billing";
import type { AgingResponse } from "../../shared/contracts/billing";

export { EXPORT_FILES } from "../../shared/schemas/billing";
export type { ExportFile } from "../../shared/schemas/billing";
export type { AgingAmounts, AgingDto, AgingRowDto } from "../../shared/contracts/billing";

export { reportKeys } from "./keys";

export const reportsApi = {
  aging: () => api<AgingResponse>("/api/reports/aging").then((r) => r.aging),
  export: (file: ExportFile, range: ExportRange = {}) => apiBlob(`/api/reports/exports/${file}`, { from: range.from, to: range.to }),
};

export function useAgingQuery() {
  return useQuery({ queryKey: reportKeys.aging(), queryFn: reportsApi.aging });
}

/** Download one of the CSV exports; the file is named with the day it was taken ("invoices-2026-03-02.csv"). */
export async function downloadExport(file: ExportFile, today?: string, range: ExportRange = {}): Promise<void> {
  const blob = await reportsApi.export(file, range);
  const ranged = range.from || range.to ? `-${range.from ?? "start"}-to-${range.to ?? today ?? "now"}` : today ? `-${today}` : "";
  saveBlob(blob, file.replace(".csv", `${ranged}.csv`));
}
