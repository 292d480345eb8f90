import { useQuery } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { saveBlob } from "./files";
import { reportKeys } from "./keys";
import type { AgingBucket } from "../../shared/billing";

export type AgingAmounts = Record<AgingBucket, number> & { total: number };

export interface AgingRowDto extends AgingAmounts {
  accountId: number;
  accountName: string;
  onHold: boolean;
  /** The hold is the automatic credit hold (overdue invoices), not a pause by hand. */
  creditHold: boolean;
}

export interface AgingDto {
  today: string;
  buckets: AgingBucket[];
  accounts: AgingRowDto[];
  totals: AgingAmounts;
}

export const EXPORT_FILES = ["invoices.csv", "payments.csv", "payouts.csv"] as const;
export type ExportFile = (typeof EXPORT_FILES)[number];

export { reportKeys } from "./keys";

export const reportsApi = {
  aging: () => api<{ aging: AgingDto }>("/api/reports/aging").then((r) => r.aging),
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
