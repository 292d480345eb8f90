/**
 * Recording a delivery date's dispatch as plain data: the lines marked short, the adjustments they send,
 * their checks, and the server's errors put back on the lines. No React: the screen and its tests share it.
 */
import { z } from "zod";
import type { BoardDto } from "../api/board";
import type { DispatchAdjustment, DispatchResult } from "../api/dispatch";
import type { FieldErrors } from "../../shared/errors";
import { ordersLabel, parseQuantity } from "./quantities";

/** A line marked short: the delivered quantity as typed, and why. */
export interface Short {
  delivered: string;
  reason: string;
}

/** The lines marked short, by `lineKey(orderId, productId)`. */
export type Shorts = Record<string, Short>;

export const lineKey = (orderId: number, productId: number) => `${orderId}-${productId}`;

/**
 * What POST /api/deliveries/:date/confirm takes (the server's body, server/billing; the same messages).
 * The form checks the adjustments with it before sending.
 */
export const dispatchInputSchema = z.object({
  adjustments: z
    .array(
      z.object({
        orderId: z.number().int().positive(),
        productId: z.number().int().positive(),
        deliveredQuantity: z.number().int("Whole units.").min(0, "Cannot be negative."),
        reason: z.string().trim().max(200).optional(),
      }),
    )
    .max(500),
});

/** The orders still to record (open or locked for baking). */
export const isWaiting = (row: Pick<BoardDto["rows"][number], "status">) => row.status === "open" || row.status === "locked";

/** Mark a line short (starting at one fewer than ordered), or deliver it in full again. */
export function toggleShort(shorts: Shorts, key: string, ordered: number): Shorts {
  const next = { ...shorts };
  if (next[key]) delete next[key];
  else next[key] = { delivered: String(Math.max(0, ordered - 1)), reason: "" };
  return next;
}

/** The adjustments to send, or the problems per line ("<orderId>-<productId>" → message). */
export function dispatchAdjustments(board: BoardDto, shorts: Shorts): { ok: true; adjustments: DispatchAdjustment[] } | { ok: false; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const adjustments: DispatchAdjustment[] = [];
  for (const row of board.rows) {
    if (!isWaiting(row)) continue;
    for (const [pid, ordered] of Object.entries(row.quantities)) {
      const key = lineKey(row.orderId, Number(pid));
      const s = shorts[key];
      if (!s) continue;
      const q = parseQuantity(s.delivered);
      if (Number.isNaN(q)) problems[key] = "Enter a whole number.";
      else if (q >= ordered) problems[key] = `Less than the ${ordered} ordered, or untick "Short".`;
      else adjustments.push({ orderId: row.orderId, productId: Number(pid), deliveredQuantity: q, ...(s.reason.trim() ? { reason: s.reason.trim() } : {}) });
    }
  }
  if (Object.keys(problems).length) return { ok: false, problems };
  return { ok: true, adjustments };
}

/** The server names lines by their place in the list it was sent ("adjustments.2.deliveredQuantity"). */
export function lineProblemsFrom(fields: FieldErrors, sent: readonly DispatchAdjustment[]): Record<string, string> {
  const mapped: Record<string, string> = {};
  for (const [k, m] of Object.entries(fields)) {
    const i = Number(/^adjustments\.(\d+)\./.exec(k)?.[1]);
    const a = Number.isInteger(i) ? sent[i] : undefined;
    if (a) mapped[lineKey(a.orderId, a.productId)] = m;
  }
  return mapped;
}

/** "2 orders to record · 1 line short." */
export function dispatchSummary(waiting: number, short: number): string {
  return `${ordersLabel(waiting)} to record${short ? ` · ${short === 1 ? "1 line" : `${short} lines`} short` : " · everything as ordered"}.`;
}

/** What recording did, in the owner's words. */
export function dispatchResultText(r: DispatchResult): string {
  return `${r.delivered === 1 ? "1 order" : `${r.delivered} orders`} marked delivered.${r.invoices.length ? ` Invoiced at once (card accounts): ${r.invoices.join(", ")}.` : " No card invoices were due; accounts on terms get their weekly statement."}`;
}
