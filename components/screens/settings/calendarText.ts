import { addDays, formatDay } from "../../ordering/dates";
import { cutoffFor, formatLocal, weekdayOf } from "../../../shared/calendar";
import { formatCalendarDate, formatTimeOfDay } from "../../../shared/format";
import { formatMoney } from "../../../shared/money";
import type { CalendarSettingsDto } from "../../../shared/schemas/calendar";

/** How a locale writes a day, a time and an amount: "Tue, Jun 9 · 2:00 PM · $1,234.50" (en-US). */
export function localeSample(locale: string, currency = "USD"): string {
  return `${formatCalendarDate("2026-06-09", "dayShort", locale)} · ${formatTimeOfDay("14:00", locale)} · ${formatMoney(123450, currency, locale)}`;
}

/** "A Tuesday delivery closes Mon 1 Dec, 14:00 CST": the rule worked through for the next delivery day. */
export function cutoffExample(today: string, s: Pick<CalendarSettingsDto, "timeZone" | "deliveryWeekdays" | "cutoffTime" | "leadDays">): string | null {
  if (!/^([01]\d|2[0-3]):[0-5]\d$/.test(s.cutoffTime) || s.deliveryWeekdays.length === 0) return null;
  for (let i = 1; i <= 7 + s.leadDays; i++) {
    const d = addDays(today, i + s.leadDays);
    if (s.deliveryWeekdays.includes(weekdayOf(d))) {
      return `For example, the ${formatDay(d)} delivery closes ${formatLocal(cutoffFor(d, s), s.timeZone)}.`;
    }
  }
  return null;
}
