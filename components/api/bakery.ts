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
