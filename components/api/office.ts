import { useQuery } from "@tanstack/react-query";
import { api } from "./client";
import type { OfficeSummaryDto } from "../../shared/schemas/bakery";

export const officeKeys = {
  all: ["office"] as const,
  summary: () => [...officeKeys.all, "summary"] as const,
};

export const officeApi = {
  summary: () => api<{ summary: OfficeSummaryDto }>("/api/office/summary").then((r) => r.summary),
};

export function useOfficeSummaryQuery() {
  return useQuery({ queryKey: officeKeys.summary(), queryFn: officeApi.summary });
}
