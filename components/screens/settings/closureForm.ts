import { z } from "zod";
import { readText } from "../../forms/textSchemas";
import { cleanDate } from "../../ordering/dates";
import type { CalendarSettingsDto } from "../../../shared/schemas/calendar";

export type Closure = CalendarSettingsDto["closures"][number];

/** A closed date to add: a date not on the list yet, and an optional note. */
export function closureSchema(closures: Closure[]) {
  return z.object({
    date: readText<string>((text) => {
      const d = cleanDate(text);
      if (!d) return { message: "Write the date as YYYY-MM-DD (year, month, day)." };
      if (closures.some((c) => c.date === d)) return { message: "That date is already on the list." };
      return { value: d };
    }),
    note: z.string().trim(),
  });
}

/** The list with one more closure, in date order. */
export function withClosure(closures: Closure[], closure: Closure): Closure[] {
  return [...closures, closure].sort((a, b) => a.date.localeCompare(b.date));
}
