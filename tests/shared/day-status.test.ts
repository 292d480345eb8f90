/** A delivery date's one badge on the buyer's home (components/ordering/dayStatus.ts). */
import { dayStatus } from "../../components/ordering/dayStatus";
import type { CalendarDayDto } from "../../shared/schemas/calendar";

const CUTOFF = "2025-12-02T14:00:00.000-06:00";
const BEFORE = Date.parse(CUTOFF) - 60_000;
const AFTER = Date.parse(CUTOFF) + 60_000;
const day = (d: Partial<CalendarDayDto> = {}): CalendarDayDto => ({ date: "2025-12-03", weekday: 3, orderable: true, reason: null, reasonText: null, cutoffAt: CUTOFF, order: null, ...d });
const order = (status: string) => ({ id: 1, status, totalCents: 100, productCount: 1, source: "one_off" });

test("an order: placed while open, then locked for baking, and delivered", () => {
  expect(dayStatus(day({ order: order("open") }), BEFORE)).toEqual({ label: "Order placed", tone: "sage" });
  expect(dayStatus(day({ order: order("open") }), AFTER)).toEqual({ label: "Locked for baking", tone: "neutral" });
  expect(dayStatus(day({ order: order("locked") }), BEFORE)).toEqual({ label: "Locked for baking", tone: "neutral" });
  expect(dayStatus(day({ order: order("delivered") }), AFTER)).toEqual({ label: "Delivered", tone: "neutral" });
});

test("no order: not ordered yet until the cut-off, then past it; a date that can't be ordered says why", () => {
  expect(dayStatus(day(), BEFORE)).toEqual({ label: "Not ordered yet", tone: "amber" });
  expect(dayStatus(day(), AFTER)).toEqual({ label: "Past the cut-off", tone: "neutral" });
  expect(dayStatus(day({ orderable: false, reason: "closed", reasonText: "The bakery is closed: Christmas" }), BEFORE)).toEqual({ label: "The bakery is closed: Christmas", tone: "neutral" });
  expect(dayStatus(day({ orderable: false, reason: "closed" }), BEFORE)).toEqual({ label: "Can't be ordered", tone: "neutral" });
});
