import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { feedKeys } from "./keys";
import type { CalendarFeedDto } from "../../shared/contracts/feed";

export { feedKeys } from "./keys";

export const feedApi = {
  get: (accountId?: number) => api<CalendarFeedDto>("/api/calendar-feed", { query: { accountId } }).then((r) => r.url),
  rotate: (accountId?: number) => api<{ url: string }>("/api/calendar-feed", { method: "POST", query: { accountId } }).then((r) => r.url),
  revoke: (accountId?: number) => api<void>("/api/calendar-feed", { method: "DELETE", query: { accountId } }),
};

/** The account's private calendar address (an .ics feed of its deliveries), or null when there is none. */
export function useCalendarFeedQuery(accountId?: number) {
  return useQuery({ queryKey: feedKeys.detail(accountId), queryFn: () => feedApi.get(accountId) });
}

/** A new address; the old one stops working. */
export function useRotateFeedMutation(accountId?: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: () => feedApi.rotate(accountId), onSuccess: (url) => qc.setQueryData(feedKeys.detail(accountId), url) });
}

export function useRevokeFeedMutation(accountId?: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: () => feedApi.revoke(accountId), onSuccess: () => qc.setQueryData(feedKeys.detail(accountId), null) });
}
