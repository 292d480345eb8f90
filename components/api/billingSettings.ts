import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { billingSettingsKeys } from "./keys";
import type { BillingSettingsDto, BillingSettingsResponse } from "../../shared/contracts/billing";

export type { BillingSettingsDto } from "../../shared/contracts/billing";

export { billingSettingsKeys } from "./keys";

export const billingSettingsApi = {
  get: () => api<BillingSettingsResponse>("/api/settings/billing").then((r) => r.settings),
  save: (input: BillingSettingsDto) => api<BillingSettingsResponse>("/api/settings/billing", { method: "PUT", body: input }).then((r) => r.settings),
};

export function useBillingSettingsQuery() {
  return useQuery({ queryKey: billingSettingsKeys.detail(), queryFn: billingSettingsApi.get });
}

export function useSaveBillingSettingsMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: billingSettingsApi.save,
    onSuccess: (settings) => qc.setQueryData(billingSettingsKeys.detail(), settings),
  });
}
