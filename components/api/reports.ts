import { useQuery } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { saveBlob } from "./files";
import { reportKeys } from "./keys";
import type { AgingBucket } from "../../shared/billing";
import type { ExportFile } from "../../shared/schemas/billing";
import type { AgingResponse } from "../../shared/contracts/billing";

export { EXPORT_FILES } from "../../shared/schemas/billing";
export type { ExportFile } from "../../shared/schemas/billing";
export type { AgingAmounts, AgingDto, AgingRowDto } from "../../shared/contracts/billing";

export { reportKeys } from "./keys";

export const reportsApi = {
  aging: () => api<AgingResponse>("/api/reports/aging").then((r) => r.aging),
  export: (file: ExportFile) => apiBlob(`/api/reports/exports/${file}`),
};

export function useAgingQuery() {
  return useQuery({ queryKey: reportKeys.aging(), queryFn: reportsApi.aging });
}

/** Download one of the CSV exports; the file is named with the day it was taken ("invoices-2026-03-02.csv"). */
export async function downloadExport(file: ExportFile, today?: string): Promise<void> {
  const blob = await reportsApi.export(file);
  saveBlob(blob, today ? file.replace(".csv", `-${today}.csv`) : file);
}
