import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { bakeryKeys, calendarKeys, type CalendarParams } from "./keys";
import type { CalendarDayDto, CalendarSettingsDto, CalendarSettingsInput } from "../../shared/schemas/calendar";

export { calendarKeys, type CalendarParams } from "./keys";

export const calendarApi = {
  days: (params: CalendarParams) => api<{ days: CalendarDayDto[] }>("/api/calendar", { query: { from: params.from, to: params.to, accountId: params.accountId } }).then((r) => r.days),
  settings: () => api<{ settings: CalendarSettingsDto }>("/api/settings/calendar").then((r) => r.settings),
  saveSettings: (input: CalendarSettingsInput) => api<{ settings: CalendarSettingsDto }>("/api/settings/calendar", { method: "PUT", body: input }).then((r) => r.settings),
};

/** Delivery dates from..to (at most 120 days) with whether each can be ordered and its cut-off. */
export function useCalendarQuery(params: CalendarParams | null) {
  return useQuery({
    queryKey: calendarKeys.days(params ?? { from: "", to: "" }),
    queryFn: () => calendarApi.days(params!),
    enabled: !!params,
  });
}

export function useCalendarSettingsQuery() {
  return useQuery({ queryKey: calendarKeys.settings(), queryFn: calendarApi.settings });
}

export function useSaveCalendarSettingsMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: calendarApi.saveSettings,
    onSuccess: (settings) => {
      qc.setQueryData(calendarKeys.settings(), settings);
      void qc.invalidateQueries({ queryKey: calendarKeys.all });
      // The locale is the bakery's: every screen's dates, times and amounts follow it.
      void qc.invalidateQueries({ queryKey: bakeryKeys.all });
    },
  });
}
