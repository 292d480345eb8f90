import { z } from "zod";
import { DATE_MAX, DATE_MIN, daysBetween, isCalendarDate, isSupportedDate, WEEKDAYS, type NotOrderableReason, type Weekday } from "../calendar";
import { DEFAULT_LOCALE, formatNumber, isSupportedLocale, SUPPORTED_LOCALES } from "../format";

export const DATE_LIMIT_MESSAGE = `Dates run from ${DATE_MIN} to ${DATE_MAX}.`;

/** A YYYY-MM-DD calendar date within DATE_MIN..DATE_MAX (shared/calendar.ts). */
export const dateSchema = z
  .string({ error: (issue) => (issue.input === undefined ? "Choose a date." : "Dates are written YYYY-MM-DD.") })
  .superRefine((value, ctx) => {
    if (!isCalendarDate(value)) ctx.addIssue({ code: "custom", message: "That is not a calendar date (use YYYY-MM-DD)." });
    else if (!isSupportedDate(value)) ctx.addIssue({ code: "custom", message: DATE_LIMIT_MESSAGE });
  });

/** Days the calendar endpoint answers for at once. */
export const CALENDAR_MAX_DAYS = 120;
/** Days of orders the order list answers for at once (a year, leap day included). */
export const ORDER_LIST_MAX_DAYS = 366;

/**
 * A superRefine for an object holding a start and an end date: the end must not be before the start and,
 * with maxDays, the span (both ends counted) must not exceed it. Worked out from day counts, never from
 * string order; skipped when either date is missing or already refused by dateSchema.
 */
export function dateRangeCheck<K extends string, L extends string>(opts: { from: K; to: L; maxDays?: number; what?: string; reversed?: string }) {
  return (value: { [P in K | L]?: string | null }, ctx: z.RefinementCtx) => {
    const from = value[opts.from];
    const to = value[opts.to];
    if (typeof from !== "string" || typeof to !== "string" || !isSupportedDate(from) || !isSupportedDate(to)) return;
    const span = daysBetween(from, to) + 1;
    if (span < 1) ctx.addIssue({ code: "custom", path: [opts.to], message: opts.reversed ?? "The end date must not be before the start." });
    else if (opts.maxDays && span > opts.maxDays) {
      ctx.addIssue({ code: "custom", path: [opts.to], message: `Ask for at most ${opts.maxDays} days${opts.what ? ` of ${opts.what}` : ""} at a time; this range is ${formatNumber(span, DEFAULT_LOCALE)} days.` });
    }
  };
}

export const weekdaysSchema = z
  .array(z.number().int().refine((n): n is Weekday => (WEEKDAYS as readonly number[]).includes(n), "Weekdays are 1 (Mon) to 7 (Sun)."))
  .max(7)
  .transform((ds) => [...new Set(ds)].sort() as Weekday[]);

export const calendarSettingsSchema = z.object({
  timeZone: z.string().refine((tz) => {
    try {
      new Intl.DateTimeFormat(DEFAULT_LOCALE, { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  }, "Use an IANA time zone such as America/Chicago."),
  /** The bakery's locale for dates, times, numbers and amounts; left out, the stored one stays. */
  locale: z
    .string({ error: (issue) => (issue.input === undefined ? undefined : `Choose one of ${SUPPORTED_LOCALES.join(", ")}.`) })
    .refine(isSupportedLocale, `Choose one of ${SUPPORTED_LOCALES.join(", ")}: dates, times and amounts are written in one of these.`)
    .optional(),
  deliveryWeekdays: weekdaysSchema.refine((d) => d.length > 0, "Choose at least one delivery day."),
  cutoffTime: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time such as 14:00."),
  leadDays: z.coerce.number().int("Whole days only.").min(0, "At least 0 days.").max(14, "At most 14 days."),
  horizonDays: z.coerce.number().int("Whole days only.").min(1, "At least 1 day.").max(120, "At most 120 days."),
  closures: z.array(z.object({ date: dateSchema, note: z.string().trim().max(120).default("") })).max(400).default([]),
});
export type CalendarSettingsInput = z.input<typeof calendarSettingsSchema>;

export interface CalendarSettingsDto {
  timeZone: string;
  locale: string;
  deliveryWeekdays: Weekday[];
  cutoffTime: string;
  leadDays: number;
  horizonDays: number;
  closures: { date: string; note: string }[];
}

export interface CalendarDayDto {
  date: string;
  weekday: Weekday;
  orderable: boolean;
  reason: NotOrderableReason | null;
  reasonText: string | null;
  cutoffAt: string;
  /** productCount: how many products the order has (never a sum of trays, dozens and loaves). */
  order: { id: number; status: string; totalCents: number; productCount: number; source: string } | null;
}

export const calendarQuerySchema = z
  .object({ from: dateSchema, to: dateSchema, accountId: z.coerce.number().int().positive().optional() })
  .superRefine(dateRangeCheck({ from: "from", to: "to", maxDays: CALENDAR_MAX_DAYS }));

export const accountDeliverySchema = z.object({
  routeWeekdays: weekdaysSchema.nullable(),
  minimumOrderCents: z.coerce.number<number>().int("Whole cents only.").min(0, "Cannot be negative.").max(10_000_000),
  priceListId: z.number().int().positive().nullable(),
});

/** `?date=` or `/:date`: one delivery date (the orders board, a bake day). */
export const dateQuerySchema = z.object({ date: dateSchema });
