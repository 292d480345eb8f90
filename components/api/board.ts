import { Platform } from "react-native";
import { useQuery } from "@tanstack/react-query";
import { api, apiBlob } from "./client";
import { boardKeys } from "./keys";
import type { BoardDto } from "../../shared/contracts/board";

/** Accounts × products for one delivery date (cancelled orders left out): shared/contracts/board.ts. */
export type { BoardDto, BoardProductDto, BoardRowDto } from "../../shared/contracts/board";
export { boardKeys } from "./keys";

export const boardApi = {
  get: (date: string) => api<{ board: BoardDto }>("/api/orders/board", { query: { date } }).then((r) => r.board),
  csv: (date: string) => apiBlob("/api/orders/board.csv", { date }),
};

export function useBoardQuery(date: string | null) {
  return useQuery({ queryKey: boardKeys.detail(date ?? ""), queryFn: () => boardApi.get(date!), enabled: !!date });
}

/**
 * Download the board as CSV. The file needs the bearer header, so it is fetched as a blob and saved
 * through a temporary object URL (web only).
 */
export async function downloadBoardCsv(date: string): Promise<void> {
  const blob = await boardApi.csv(date);
  if (Platform.OS !== "web" || typeof document === "undefined" || typeof URL === "undefined" || !URL.createObjectURL) {
    throw new Error("Downloading the CSV works in the web app.");
  }
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = `orders-${date}.csv`;
  a.rel = "noopener";
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
