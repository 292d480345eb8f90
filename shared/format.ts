/**
 * The one place dates, times, numbers and amounts are written for a person — screens, e-mails, PDFs and the
 * calendar feed alike — always through Intl (Unicode CLDR data in the engine's ICU) with the bakery's locale
 * (`bakery.locale`, a BCP 47 tag, "en-US" for the demo bakery). Nothing here guesses a locale: every function
 * takes it. Data formats are not display: API and URL dates stay YYYY-MM-DD, settings inputs "HH:mm", CSV dates
 * ISO 8601 and CSV amounts plain decimals (the CSV spec in DEVELOPERS.md).
 *
 * Styles are named by purpose; what they read as (CLDR via Node's ICU):
 *
 * | style         | en-US                     | en-GB                  |
 * |---------------|---------------------------|------------------------|
 * | `weekday`     | Tue                       | Tue                    |
 * | `dayShort`    | Tue, Jun 9                | Tue 9 Jun              |
 * | `dayLong`     | Tuesday, June 9           | Tuesday 9 June         |
 * | `dayWithYear` | June 9, 2026              | 9 June 2026            |
 * | `dayFull`     | Tuesday, June 9, 2026     | Tuesday, 9 June 2026   |
 * | `date`        | Jun 9, 2026               | 9 Jun 2026             |
 * | `time`        | 2:00 PM                   | 14:00                  |
 * | `hour`        | 2 PM                      | 14                     |
 * | `weekdayTime` | Tue 2:00 PM               | Tue 14:00              |
 * | `dayTime`     | Tue, Jun 9, 2:00 PM       | Tue 9 Jun, 14:00       |
 * | `dateTime`    | Jun 9, 2026, 2:00 PM      | 9 Jun 2026, 14:00      |
 * | `dayTimeZone` | Tue, Jun 9, 2:00 PM CDT   | Tue 9 Jun, 14:00 GMT-5 |
 */
import { DateTime } from "luxon";
import { formatMoney } from "./money";

/** The locales a bakery can choose (English ones: the screens' words are English). */
export const SUPPORTED_LOCALES = ["en-US", "en-CA", "en-GB", "en-AU"] as const;
export type SupportedLocale = (typeof SUPPORTED_LOCALES)[number];
export const DEFAULT_LOCALE: SupportedLocale = "en-US";
export const LOCALE_NAMES: Record<SupportedLocale, string> = {
  "en-US": "English (United States)",
  "en-CA": "English (Canada)",
  "en-GB": "English (United Kingdom)",
  "en-AU": "English (Australia)",
};

/** True for a tag Panwise offers and this engine's Intl can format (Intl.DateTimeFormat.supportedLocalesOf). */
export function isSupportedLocale(tag: unknown): tag is SupportedLocale {
  if (typeof tag !== "string" || !(SUPPORTED_LOCALES as readonly string[]).includes(tag)) return false;
  try {
    return Intl.DateTimeFormat.supportedLocalesOf([tag]).length === 1 && Intl.NumberFormat.supportedLocalesOf([tag]).length === 1;
  } catch {
    return false;
  }
}

/** A stored or sent tag, or the default when it is missing or not one we offer. */
export function localeOr(tag: string | null | undefined): string {
  return isSupportedLocale(tag) ? tag : DEFAULT_LOCALE;
}

const DATE_STYLES = {
  weekday: { weekday: "short" },
  weekdayLong: { weekday: "long" },
  dayShort: { weekday: "short", month: "short", day: "numeric" },
  dayLong: { weekday: "long", month: "long", day: "numeric" },
  dayWithYear: { year: "numeric", month: "long", day: "numeric" },
  dayFull: { weekday: "long", year: "numeric", month: "long", day: "numeric" },
  date: { year: "numeric", month: "short", day: "numeric" },
  monthYear: { year: "numeric", month: "long" },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;

const INSTANT_STYLES = {
  ...DATE_STYLES,
  time: { hour: "numeric", minute: "2-digit" },
  hour: { hour: "numeric" },
  weekdayTime: { weekday: "short", hour: "numeric", minute: "2-digit" },
  dayTime: { weekday: "short", month: "short", day: "numeric", hour: "numeric", minute: "2-digit" },
  dateTime: { year: "numeric", month: "short", day: "numeric", hour: "numeric", minute: "2-digit" },
  dayTimeZone: { weekday: "short", month: "short", day: "numeric", hour: "numeric", minute: "2-digit", timeZoneName: "short" },
  timeZone: { hour: "numeric", minute: "2-digit", timeZoneName: "short" },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;

export type DateStyle = keyof typeof DATE_STYLES;
export type InstantStyle = keyof typeof INSTANT_STYLES;

const dateFormats = new Map<string, Intl.DateTimeFormat>();
function dateFormat(locale: string, timeZone: string | undefined, options: Intl.DateTimeFormatOptions, key: string): Intl.DateTimeFormat {
  const k = `${locale}|${timeZone ?? ""}|${key}`;
  let f = dateFormats.get(k);
  if (!f) {
    try {
      f = new Intl.DateTimeFormat(locale, { ...options, timeZone });
    } catch {
      // An unknown time zone on this device: the device's own zone rather than nothing.
      f = new Intl.DateTimeFormat(locale, options);
    }
    dateFormats.set(k, f);
  }
  return f;
}

/**
 * Some ICU versions put a narrow no-break space (U+202F) before "PM" and thin spaces in ranges; written out as
 * a plain space so screens, e-mails and PDFs (WinAnsi fonts) read the same on every engine.
 */
const plain = (s: string) => s.replace(/[\u202f\u2009]/g, " ");

/** A calendar date "YYYY-MM-DD" (no time zone, never shifted): `formatCalendarDate("2026-06-09", "dayShort", "en-US")` → "Tue, Jun 9". */
export function formatCalendarDate(date: string, style: DateStyle, locale: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!m) return date;
  const ms = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  if (Number.isNaN(ms)) return date;
  const d = new Date(ms);
  d.setUTCFullYear(Number(m[1])); // years 0–99 would otherwise be read as 1900–1999
  return plain(dateFormat(locale, "UTC", DATE_STYLES[style], style).format(d));
}

/** An instant (ISO 8601 text, epoch ms or Date) in the given IANA zone: "Tue, Jun 9, 2:00 PM". "" when unreadable. */
export function formatInstant(instant: string | number | Date, style: InstantStyle, locale: string, timeZone?: string): string {
  const d = instant instanceof Date ? instant : new Date(instant);
  if (Number.isNaN(d.getTime())) return "";
  return plain(dateFormat(locale, timeZone, INSTANT_STYLES[style], style).format(d));
}

/**
 * A time of day stored as data, "HH:mm" (a cut-off, a dispatch or shift time), as the locale writes it:
 * "14:00" → "2:00 PM" (en-US), "14:00" (en-GB). Text that is not a valid HH:mm comes back as it is.
 */
export function formatTimeOfDay(hhmm: string, locale: string): string {
  const m = /^([01]\d|2[0-3]):([0-5]\d)$/.exec(hhmm.trim());
  if (!m) return hhmm;
  return plain(dateFormat(locale, "UTC", INSTANT_STYLES.time, "time").format(new Date(Date.UTC(2000, 0, 1, Number(m[1]), Number(m[2])))));
}

/**
 * An ISO 8601 instant in the offset written into it (the production plan writes the bakery's offset into every
 * instant): "3:00 AM" for "…T03:00:00-05:00", whatever the device's zone. Through luxon's toLocaleString (Intl).
 */
export function formatAtOwnOffset(iso: string, style: InstantStyle, locale: string): string {
  const dt = DateTime.fromISO(iso, { setZone: true });
  if (!dt.isValid) return "";
  return plain(dt.setLocale(locale).toLocaleString(INSTANT_STYLES[style]));
}

/** A luxon DateTime in its own zone: `formatDateTimeIn(dt, "dayTimeZone", "en-US")` → "Tue, Jun 9, 2:00 PM CDT". */
export function formatDateTimeIn(dt: DateTime, style: InstantStyle, locale: string): string {
  if (!dt.isValid) return "";
  const zone = dt.zoneName;
  return zone && dt.zone.type === "iana" ? formatInstant(dt.toJSDate(), style, locale, zone) : plain(dt.setLocale(locale).toLocaleString(INSTANT_STYLES[style]));
}

/** The hour 0–23 of an instant in a zone (a technical read, not display). */
export function hourIn(instant: Date, timeZone?: string): number {
  const f = dateFormat("en-US", timeZone, { hour: "numeric", hourCycle: "h23" }, "hour23");
  return Number(f.formatToParts(instant).find((p) => p.type === "hour")?.value ?? instant.getHours()) % 24;
}

const numberFormats = new Map<string, Intl.NumberFormat>();
/** Digits with the locale's grouping and decimal marks, min–max decimals ("1,200", "2.5"); cached. */
export function formatNumber(n: number, locale: string, minDecimals = 0, maxDecimals = Math.max(minDecimals, 0)): string {
  const k = `${locale}|${minDecimals}|${maxDecimals}`;
  let f = numberFormats.get(k);
  if (!f) numberFormats.set(k, (f = new Intl.NumberFormat(locale, { minimumFractionDigits: minDecimals, maximumFractionDigits: maxDecimals })));
  return plain(f.format(n));
}

/** Formatters bound to one locale and zone (a screen holds one through useFormat(), an e-mail or PDF makes one). */
export function formatterFor(locale: string | null | undefined, timeZone?: string) {
  const l = localeOr(locale);
  return {
    locale: l,
    timeZone,
    /** A calendar date "YYYY-MM-DD". */
    day: (date: string, style: DateStyle = "dayShort") => formatCalendarDate(date, style, l),
    /** An instant in the bakery's zone. */
    at: (instant: string | number | Date, style: InstantStyle = "dayTime") => formatInstant(instant, style, l, timeZone),
    time: (instant: string | number | Date) => formatInstant(instant, "time", l, timeZone),
    /** A stored "HH:mm" time of day. */
    timeOfDay: (hhmm: string) => formatTimeOfDay(hhmm, l),
    number: (n: number, minDecimals = 0, maxDecimals = minDecimals) => formatNumber(n, l, minDecimals, maxDecimals),
    money: (minor: number, currency = "USD") => formatMoney(minor, currency, l),
  };
}

export type Formatter = ReturnType<typeof formatterFor>;
