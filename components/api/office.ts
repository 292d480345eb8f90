import { useQuery } from "@tanstack/react-query";
import { api } from "./client";
import { officeKeys } from "./keys";
import type { OfficeSummaryDto } from "../../shared/schemas/bakery";

export { officeKeys } from "./keys";

export const officeApi = {
  summary: () => api<{ summary: OfficeSummaryDto }>("/api/office/summary").then((r) => r.summary),
};

export function useOfficeSummaryQuery() {
  return useQuery({ queryKey: officeKeys.summary(), queryFn: officeApi.summary });
}
