/**
 * A buyer's standing order as plain data: the grid of quantities per product and delivery weekday, how often
 * it repeats, the dates it skips, what it comes to a week, and the payload PUT /api/standing-orders takes.
 * No React: the standing order screen and its tests share it.
 */
import { WEEKDAY_LONG, WEEKDAY_SHORT, type Weekday } from "../../shared/calendar";
import type { FieldErrors } from "../../shared/errors";
import type { ProductDto } from "../../shared/schemas/catalog";
import type { StandingOrderDto, StandingOrderInput } from "../../shared/schemas/orders";
import { addDays, cleanDate, formatDay } from "./dates";
import { expandRule, weeklyRule } from "../../shared/recurrence";
import { parseQuantity, quantityProblem, type QuantityRule } from "./quantities";

/** The grid's cells, as typed, by `cellKey(productId, weekday)`. */
export type Cells = Record<string, string>;

export const cellKey = (productId: number, weekday: number) => `${productId}:${weekday}`;

/** What the standing order form holds. */
export interface StandingValues {
  cells: Cells;
  startDate: string;
  endDate: string;
  intervalWeeks: 1 | 2;
  active: boolean;
  skipDates: string[];
}

/** The form's values for a saved standing order, or a new one starting tomorrow. */
export function standingValues(standing: StandingOrderDto | null, today: string): StandingValues {
  return {
    cells: Object.fromEntries((standing?.lines ?? []).filter((l) => l.quantity > 0).map((l) => [cellKey(l.productId, l.weekday), String(l.quantity)])),
    startDate: standing?.startDate ?? addDays(today, 1),
    endDate: standing?.endDate ?? "",
    intervalWeeks: standing?.intervalWeeks ?? 1,
    active: standing?.active ?? true,
    skipDates: standing?.skipDates ?? [],
  };
}

/** The weekdays this account gets deliveries: the bakery's days, narrowed to the account's route. */
export function accountWeekdays(bakeryDays: readonly Weekday[], routeDays: readonly Weekday[] | null | undefined): Weekday[] {
  return [...bakeryDays].filter((d) => !routeDays || routeDays.includes(d)).sort((a, b) => a - b);
}

/** "Tue, Thu and Sat". */
export function listWeekdays(days: readonly Weekday[], long = false): string {
  const names = days.map((d) => (long ? WEEKDAY_LONG[d] : WEEKDAY_SHORT[d]));
  if (names.length <= 1) return names.join("");
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}

/** The payload PUT /api/standing-orders gets: only non-zero cells, product by product, weekday by weekday. */
export function standingPayload(p: { products: readonly { id: number }[]; weekdays: readonly Weekday[] } & Omit<StandingValues, "skipDates"> & { skipDates: readonly string[] }): StandingOrderInput {
  const lines: StandingOrderInput["lines"] = [];
  for (const product of p.products) {
    for (const weekday of p.weekdays) {
      const q = parseQuantity(p.cells[cellKey(product.id, weekday)] ?? "");
      if (!Number.isNaN(q) && q > 0) lines.push({ productId: product.id, weekday, quantity: q });
    }
  }
  return {
    startDate: p.startDate.trim(),
    endDate: p.endDate.trim() ? p.endDate.trim() : null,
    intervalWeeks: p.intervalWeeks,
    skipDates: [...new Set(p.skipDates)].sort(),
    lines,
    active: p.active,
  };
}

/** A cell's typed quantity as a count (blank and unreadable ones are 0). */
const cellCount = (cells: Cells, productId: number, weekday: number) => Math.max(0, parseQuantity(cells[cellKey(productId, weekday)] ?? "") || 0);

/** Why a cell can't be saved (the product's limits), by cell key; cells that are fine are left out. */
export function cellProblems(products: readonly (QuantityRule & { id: number })[], weekdays: readonly Weekday[], cells: Cells): Record<string, string> {
  const problems: Record<string, string> = {};
  for (const p of products) {
    for (const d of weekdays) {
      const k = cellKey(p.id, d);
      const problem = quantityProblem(parseQuantity(cells[k] ?? ""), p);
      if (problem) problems[k] = problem;
    }
  }
  return problems;
}

/** Saved quantities for weekdays or products the account can no longer get (saving removes them). */
export function droppedLines(standing: StandingOrderDto | null, weekdays: readonly Weekday[], products: readonly { id: number }[]): StandingOrderDto["lines"] {
  const offered = new Set(products.map((p) => p.id));
  return (standing?.lines ?? []).filter((l) => l.quantity > 0 && (!weekdays.includes(l.weekday) || !offered.has(l.productId)));
}

/** The weekdays with at least one quantity set. */
export function chosenWeekdays(products: readonly { id: number }[], weekdays: readonly Weekday[], cells: Cells): Weekday[] {
  return weekdays.filter((d) => products.some((p) => parseQuantity(cells[cellKey(p.id, d)] ?? "") > 0));
}

/** How many of one product a week brings (its quantities are never added across products). */
export function perWeek(productId: number, weekdays: readonly Weekday[], cells: Cells): number {
  return weekdays.reduce((s, d) => s + cellCount(cells, productId, d), 0);
}

/** What a week of the standing order comes to at today's prices, in cents. */
export function weekTotalCents(products: readonly Pick<ProductDto, "id" | "priceCents">[], weekdays: readonly Weekday[], cells: Cells): number {
  return products.reduce((s, p) => s + perWeek(p.id, weekdays, cells) * p.priceCents, 0);
}

/** "Every week on Tue and Thu, from Tue, Dec 2 until Wed, Dec 31." */
export function scheduleSummary(days: readonly Weekday[], values: Pick<StandingValues, "intervalWeeks" | "startDate" | "endDate">): string {
  if (!days.length) return "No quantities yet: set how much you want on each delivery day.";
  const from = cleanDate(values.startDate) ? formatDay(values.startDate) : "the start date";
  const until = cleanDate(values.endDate) ? ` until ${formatDay(values.endDate)}` : "";
  return `${values.intervalWeeks === 2 ? "Every other week" : "Every week"} on ${listWeekdays(days)}, from ${from}${until}.`;
}

/** "About $77.20 a week" / "About $77.20 every other week": what one period of the standing order comes to. */
export const periodText = (intervalWeeks: 1 | 2) => (intervalWeeks === 2 ? "every other week" : "a week");

/** The standing order's pattern as the form holds it: which dates it delivers on. */
export interface StandingPattern {
  startDate: string;
  endDate: string;
  intervalWeeks: 1 | 2;
  weekdays: readonly Weekday[];
}

/**
 * Whether the pattern delivers on a date: the same RFC 5545 rule the server stores (shared/recurrence.ts, the
 * `rrule` library), so "every other week" counts weeks from the start date's week as the server does.
 */
export function deliversOn(p: StandingPattern, date: string): boolean {
  const start = cleanDate(p.startDate);
  if (!start || !p.weekdays.length) return false;
  const end = cleanDate(p.endDate);
  return expandRule(weeklyRule({ startDate: start, endDate: end, intervalWeeks: p.intervalWeeks, weekdays: [...p.weekdays] }), date, date).length > 0;
}

/** A date typed (or picked) to skip: the date, or why it can't be skipped. The example date is a coming one. */
export function skipDateCheck(text: string, today: string, pattern?: StandingPattern): { date: string } | { error: string } {
  const d = cleanDate(text);
  if (!d) return { error: `Write the date as YYYY-MM-DD, e.g. ${addDays(today, 7)}.` };
  if (d <= today) return { error: "Choose a date after today." };
  if (pattern && pattern.weekdays.length && !deliversOn(pattern, d)) {
    const end = cleanDate(pattern.endDate);
    if (end && d > end) return { error: `${formatDay(d)} is after your standing order ends: nothing is made then.` };
    if (cleanDate(pattern.startDate) && d < pattern.startDate) return { error: `${formatDay(d)} is before your standing order starts: nothing is made then.` };
    return { error: `${formatDay(d)} is not one of your delivery dates (${pattern.intervalWeeks === 2 ? "every other week" : "every week"} on ${listWeekdays(pattern.weekdays)}): nothing is made then.` };
  }
  return { date: d };
}

/** The skip list with `date` added (sorted, no repeats). */
export const withSkip = (skipDates: readonly string[], date: string): string[] => [...new Set([...skipDates, date])].sort();

/** The skip list with `date` taken off if it is there, else added. */
export const toggledSkip = (skipDates: readonly string[], date: string): string[] =>
  skipDates.includes(date) ? skipDates.filter((x) => x !== date) : [...skipDates, date].sort();

/** What saving did, in the buyer's words. */
export function savedMessage(saved: Pick<StandingOrderDto, "active" | "lines">, horizonDays: number): string {
  if (!saved.active) return "Saved. Your standing order is paused: no new orders are made from it.";
  if (saved.lines.length === 0) return "Saved. With no quantities set, no orders are made from it.";
  return `Saved. Orders are made for the next ${horizonDays} days; dates you changed by hand keep your changes.`;
}

/** The form's own fields (errors beside them); every skipped date's error goes beside the skip input. */
export const STANDING_FIELDS = ["startDate", "endDate", "intervalWeeks", "skipDates"] as const;

/**
 * The server's field errors for the grid: `lines.<i>` (and `.quantity`, `.weekday`, `.productId`) on the cell
 * of the line sent at that index, by cell key.
 */
export function cellErrorsFrom(fields: FieldErrors, sent: StandingOrderInput["lines"]): Record<string, string> {
  const byCell: Record<string, string> = {};
  for (const [key, message] of Object.entries(fields)) {
    const m = /^lines\.(\d+)(\.(quantity|weekday|productId))?$/.exec(key);
    const line = m ? sent[Number(m[1])] : undefined;
    if (line) byCell[cellKey(line.productId, line.weekday)] = message;
  }
  return byCell;
}

/** The server's field errors with `skipDates.<i>` named `skipDates`, the one input that shows them. */
export function withSkipDatesField(fields: FieldErrors): FieldErrors {
  const out: FieldErrors = {};
  for (const [key, message] of Object.entries(fields)) out[key.startsWith("skipDates") ? "skipDates" : key] = message;
  return out;
}
