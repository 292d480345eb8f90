import type { BadgeTone } from "../ui/Badge";
import type { CalendarDayDto } from "../../shared/schemas/calendar";
import { msUntil } from "./countdown";

/** What a delivery date's state is for the buyer, as one badge. */
export function dayStatus(day: CalendarDayDto, now: number): { label: string; tone: BadgeTone } {
  const open = msUntil(day.cutoffAt, now) > 0;
  if (day.order) {
    if (day.order.status === "open" && open) return { label: "Order placed", tone: "sage" };
    if (day.order.status === "delivered") return { label: "Delivered", tone: "neutral" };
    return { label: "Locked for baking", tone: "neutral" };
  }
  if (day.orderable && open) return { label: "Not ordered yet", tone: "amber" };
  if (day.orderable) return { label: "Past the cut-off", tone: "neutral" };
  return { label: day.reasonText ?? "Can't be ordered", tone: "neutral" };
}
