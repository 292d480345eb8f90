import { z } from "zod";
import { isCalendarDate, WEEKDAYS, type NotOrderableReason, type Weekday } from "../calendar";

export const dateSchema = z
  .string({ required_error: "Choose a date.", invalid_type_error: "Dates are written YYYY-MM-DD." })
  .refine(isCalendarDate, "That is not a calendar date (use YYYY-MM-DD).");

export const weekdaysSchema = z
  .array(z.number().int().refine((n): n is Weekday => (WEEKDAYS as readonly number[]).includes(n), "Weekdays are 1 (Mon) to 7 (Sun)."))
  .max(7)
  .transform((ds) => [...new Set(ds)].sort() as Weekday[]);

export const calendarSettingsSchema = z.object({
  timeZone: z.string().refine((tz) => {
    try {
      new Intl.DateTimeFormat("en-US", { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  }, "Use an IANA time zone such as America/Chicago."),
  deliveryWeekdays: weekdaysSchema.refine((d) => d.length > 0, "Choose at least one delivery day."),
  cutoffTime: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time such as 14:00."),
  leadDays: z.coerce.number().int("Whole days only.").min(0, "At least 0 days.").max(14, "At most 14 days."),
  horizonDays: z.coerce.number().int("Whole days only.").min(1, "At least 1 day.").max(120, "At most 120 days."),
  closures: z.array(z.object({ date: dateSchema, note: z.string().trim().max(120).default("") })).max(400).default([]),
});
export type CalendarSettingsInput = z.input<typeof calendarSettingsSchema>;

export interface CalendarSettingsDto {
  timeZone: string;
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
  order: { id: number; status: string; totalCents: number; itemCount: number; source: string } | null;
}

export const calendarQuerySchema = z
  .object({ from: dateSchema, to: dateSchema, accountId: z.coerce.number().int().positive().optional() })
  .refine((q) => q.to >= q.from, { path: ["to"], message: "The end date must not be before the start." });

export const accountDeliverySchema = z.object({
  routeWeekdays: weekdaysSchema.nullable(),
  minimumOrderCents: z.coerce.number().int("Whole cents only.").min(0, "Cannot be negative.").max(10_000_000),
  priceListId: z.number().int().positive().nullable(),
});
