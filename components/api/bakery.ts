import { useQuery } from "@tanstack/react-query";
import { api } from "./client";
import type { BakeryDto } from "../../shared/schemas/bakery";

export const bakeryKeys = {
  all: ["bakery"] as const,
  detail: () => [...bakeryKeys.all, "detail"] as const,
};

export const bakeryApi = {
  get: () => api<{ bakery: BakeryDto }>("/api/bakery").then((r) => r.bakery),
};

export function useBakeryQuery() {
  return useQuery({ queryKey: bakeryKeys.detail(), queryFn: bakeryApi.get });
}

/** The bakery's time zone once known (dates and times are shown in it); undefined while loading. */
export function useBakeryTimeZone(): string | undefined {
  return useBakeryQuery().data?.timeZone;
}
