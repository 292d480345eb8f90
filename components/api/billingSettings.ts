import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { billingSettingsKeys } from "./keys";

/** The bakery's billing settings; the tax rate is in basis points (875 = 8.75 %). */
export interface BillingSettingsDto {
  salesTaxRateBp: number;
  invoicePrefix: string;
  creditHoldDays: number;
  paymentInstructions: string;
}

export { billingSettingsKeys } from "./keys";

export const billingSettingsApi = {
  get: () => api<{ settings: BillingSettingsDto }>("/api/settings/billing").then((r) => r.settings),
  save: (input: BillingSettingsDto) => api<{ settings: BillingSettingsDto }>("/api/settings/billing", { method: "PUT", body: input }).then((r) => r.settings),
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
