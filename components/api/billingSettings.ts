import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { billingSettingsKeys } from "./keys";
import type { BillingSettingsDto, BillingSettingsResponse } from "../../shared/contracts/billing";

export type { BillingSettingsDto } from "../../shared/contracts/billing";

export { billingSettingsKeys } from "./keys";

export const billingSettingsApi = {
  get: () => api<BillingSettingsResponse>("/api/settings/billing").then((r) => r.settings),
  save: (input: Omit<BillingSettingsDto, "remindersOn">) => api<BillingSettingsResponse>("/api/settings/billing", { method: "PUT", body: input }).then((r) => r.settings),
  reminders: (on: boolean) => api<BillingSettingsResponse>("/api/settings/billing/reminders", { method: "PUT", body: { on } }).then((r) => r.settings),
};

export function useBillingSettingsQuery() {
  return useQuery({ queryKey: billingSettingsKeys.detail(), queryFn: billingSettingsApi.get });
}

/** The payment-reminder schedule on or off (owner or bookkeeper). */
export function useRemindersSwitchMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: billingSettingsApi.reminders,
    onSuccess: (settings) => qc.setQueryData(billingSettingsKeys.detail(), settings),
  });
}

export function useSaveBillingSettingsMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: billingSettingsApi.save,
    onSuccess: (settings) => qc.setQueryData(billingSettingsKeys.detail(), settings),
  });
}
