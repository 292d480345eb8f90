/**
 * shared/format.ts: every date, time, number and amount a person reads, in the bakery's locale.
 * Expected strings are Unicode CLDR's patterns as Node's ICU writes them (CLDR en / en_001 / en_GB / en_AU / en_CA
 * gregorian formats: en-US "EEE, MMM d" and "h:mm a", en-GB "EEE d MMM" and "HH:mm"), written out by hand here.
 */
import { DateTime } from "luxon";
import {
  DEFAULT_LOCALE,
  SUPPORTED_LOCALES,
  formatAtOwnOffset,
  formatCalendarDate,
  formatDateTimeIn,
  formatInstant,
  formatNumber,
  formatTimeOfDay,
  formatterFor,
  hourIn,
  isSupportedLocale,
  localeOr,
} from "../../shared/format";
import { formatMoney } from "../../shared/money";
import { formatLocal } from "../../shared/calendar";
import { formatMass, unitsFor } from "../../shared/units";

// 2026-06-09 is a Tuesday; 19:00Z is 2:00 PM CDT (UTC−5) in America/Chicago.
const AT = "2026-06-09T19:00:00.000Z";
const ZONE = "America/Chicago";

describe("calendar dates (no time zone, never shifted)", () => {
  it.each([
    // [style, en-US, en-GB] — Unicode CLDR via Node's ICU
    ["weekday", "Tue", "Tue"],
    ["dayShort", "Tue, Jun 9", "Tue 9 Jun"],
    ["dayLong", "Tuesday, June 9", "Tuesday 9 June"],
    ["dayWithYear", "June 9, 2026", "9 June 2026"],
    ["dayFull", "Tuesday, June 9, 2026", "Tuesday, 9 June 2026"],
    ["date", "Jun 9, 2026", "9 Jun 2026"],
  ] as const)("%s", (style, us, gb) => {
    expect(formatCalendarDate("2026-06-09", style, "en-US")).toBe(us);
    expect(formatCalendarDate("2026-06-09", style, "en-GB")).toBe(gb);
  });

  it("stays on its day whatever the device's zone (a date is not an instant)", () => {
    // The first and last days of a year, where a UTC midnight read in America/* or Asia/* would shift a day.
    expect(formatCalendarDate("2026-01-01", "dayWithYear", "en-US")).toBe("January 1, 2026");
    expect(formatCalendarDate("2025-12-31", "dayWithYear", "en-US")).toBe("December 31, 2025");
  });

  it("gives back text that is not a date as it is", () => {
    expect(formatCalendarDate("soon", "dayShort", "en-US")).toBe("soon");
  });

  it("en-AU and en-CA follow their own CLDR patterns", () => {
    expect(formatCalendarDate("2026-06-09", "dayShort", "en-AU")).toBe("Tue, 9 June"); // CLDR en_AU MMMEd "EEE, d MMMM"
    expect(formatCalendarDate("2026-06-09", "dayShort", "en-CA")).toBe("Tue, Jun 9"); // CLDR en_CA MMMEd "EEE, MMM d"
  });
});

describe("instants in the bakery's zone", () => {
  it.each([
    ["time", "2:00 PM", "14:00"],
    ["hour", "2 PM", "14"],
    ["weekdayTime", "Tue 2:00 PM", "Tue 14:00"],
    ["dayTime", "Tue, Jun 9, 2:00 PM", "Tue 9 Jun, 14:00"],
    ["dateTime", "Jun 9, 2026, 2:00 PM", "9 Jun 2026, 14:00"],
    ["dayTimeZone", "Tue, Jun 9, 2:00 PM CDT", "Tue 9 Jun, 14:00 GMT-5"],
  ] as const)("%s", (style, us, gb) => {
    expect(formatInstant(AT, style, "en-US", ZONE)).toBe(us);
    expect(formatInstant(AT, style, "en-GB", ZONE)).toBe(gb);
  });

  it("morning times: en-US 12-hour, en-GB 24-hour (CLDR en_GB Hm \"HH:mm\"; ICU writes the hour unpadded for a numeric hour)", () => {
    const threeAm = "2026-06-09T08:00:00.000Z"; // 3:00 AM CDT
    expect(formatInstant(threeAm, "time", "en-US", ZONE)).toBe("3:00 AM");
    expect(formatInstant(threeAm, "time", "en-GB", ZONE)).toBe("3:00");
    expect(formatInstant(threeAm, "time", "en-AU", ZONE)).toBe("3:00 am");
    expect(formatInstant(threeAm, "time", "en-CA", ZONE)).toBe("3:00 a.m.");
  });

  it("an instant in the offset written into it (the plan's instants)", () => {
    expect(formatAtOwnOffset("2026-06-09T03:40:00-05:00", "time", "en-US")).toBe("3:40 AM");
    expect(formatAtOwnOffset("2026-06-08T23:50:00-05:00", "weekdayTime", "en-US")).toBe("Mon 11:50 PM");
    expect(formatAtOwnOffset("2026-06-08T23:50:00-05:00", "weekdayTime", "en-GB")).toBe("Mon 23:50");
    expect(formatAtOwnOffset("not a time", "time", "en-US")).toBe("");
  });

  it("the cut-off in the bakery's zone across the DST change (CST = UTC−6, CDT = UTC−5; US Energy Policy Act of 2005)", () => {
    expect(formatLocal("2026-03-07T20:00:00.000Z", ZONE)).toBe("Sat, Mar 7, 2:00 PM CST");
    expect(formatLocal("2026-03-08T19:00:00.000Z", ZONE)).toBe("Sun, Mar 8, 2:00 PM CDT");
    expect(formatLocal(DateTime.fromISO("2026-03-08T19:00:00.000Z"), ZONE, "en-GB")).toBe("Sun 8 Mar, 14:00 GMT-5");
    expect(formatDateTimeIn(DateTime.fromISO(AT, { zone: ZONE }), "dayTimeZone", "en-US")).toBe("Tue, Jun 9, 2:00 PM CDT");
  });

  it("a stored HH:mm time of day", () => {
    expect(formatTimeOfDay("14:00", "en-US")).toBe("2:00 PM");
    expect(formatTimeOfDay("06:30", "en-US")).toBe("6:30 AM");
    expect(formatTimeOfDay("00:15", "en-US")).toBe("12:15 AM");
    expect(formatTimeOfDay("14:00", "en-GB")).toBe("14:00");
    expect(formatTimeOfDay("2pm", "en-US")).toBe("2pm");
  });

  it("reads the hour in a zone (a technical read for the greeting)", () => {
    expect(hourIn(new Date(AT), ZONE)).toBe(14);
    expect(hourIn(new Date("2026-06-09T05:00:00.000Z"), ZONE)).toBe(0);
  });

  it("an unreadable instant is empty, never 'Invalid Date'", () => {
    expect(formatInstant("nope", "time", "en-US", ZONE)).toBe("");
  });

  it("writes no narrow no-break space (U+202F), so PDFs in WinAnsi fonts and tests read the same on every ICU", () => {
    for (const l of SUPPORTED_LOCALES) expect(formatInstant(AT, "dayTimeZone", l, ZONE)).not.toMatch(/[\u202f\u2009]/);
  });
});

describe("numbers and money", () => {
  it("groups thousands and marks decimals the CLDR way (all four English locales: ',' and '.')", () => {
    for (const l of SUPPORTED_LOCALES) expect(formatNumber(1234567.5, l, 1)).toBe("1,234,567.5");
  });

  it("money through shared/money.ts with the locale (ISO 4217 USD, 2 decimals; CLDR currency symbols)", () => {
    expect(formatMoney(123450, "USD", "en-US")).toBe("$1,234.50");
    expect(formatMoney(123450, "USD", "en-GB")).toBe("US$1,234.50");
    expect(formatMoney(123450, "GBP", "en-GB")).toBe("£1,234.50");
    expect(formatMoney(123450, "CAD", "en-CA")).toBe("$1,234.50");
    expect(formatMoney(1000, "JPY", "en-US")).toBe("¥1,000"); // JPY has no minor unit (ISO 4217)
  });

  it("shared/units.ts writes its digits in the sheet's locale", () => {
    expect(unitsFor("metric", "en-GB").mass(11120)).toBe("11.120 kg");
    expect(formatMass(1200, "metric")).toBe("1,200 g");
  });
});

describe("the locale setting", () => {
  it("offers en-US, en-CA, en-GB and en-AU, all known to this engine's Intl", () => {
    expect(SUPPORTED_LOCALES).toEqual(["en-US", "en-CA", "en-GB", "en-AU"]);
    for (const l of SUPPORTED_LOCALES) expect(isSupportedLocale(l)).toBe(true);
    expect(DEFAULT_LOCALE).toBe("en-US");
  });

  it("refuses tags it does not offer", () => {
    for (const bad of ["fr-FR", "en", "EN-us", "xx-YY", "", null, 42]) expect(isSupportedLocale(bad)).toBe(false);
    expect(localeOr("fr-FR")).toBe("en-US");
    expect(localeOr(undefined)).toBe("en-US");
  });

  it("formatterFor binds a locale and zone", () => {
    const f = formatterFor("en-GB", ZONE);
    expect(f.day("2026-06-09")).toBe("Tue 9 Jun");
    expect(f.at(AT)).toBe("Tue 9 Jun, 14:00");
    expect(f.time(AT)).toBe("14:00");
    expect(f.money(1250, "GBP")).toBe("£12.50");
    expect(formatterFor(undefined).day("2026-06-09")).toBe("Tue, Jun 9");
  });
});

describe("no hand-made display patterns (the rule in DEVELOPERS.md: every display string through shared/format.ts)", () => {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const fs = require("fs") as typeof import("fs");
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const path = require("path") as typeof import("path");
  const root = path.join(__dirname, "..", "..");
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (/\.tsx?$/.test(e.name)) files.push(p);
    }
  };
  for (const d of ["app", "components", "server", "shared"]) walk(path.join(root, d));
  it.each([
    ["luxon toFormat patterns", /\.toFormat\(/],
    ["toLocaleString / toLocaleDateString / toLocaleTimeString with a fixed locale", /\.toLocale(Date|Time)?String\(\s*["']/],
    ["Intl formatters with a fixed locale outside shared/format.ts", /new Intl\.(DateTimeFormat|NumberFormat)\(\s*["']/],
  ])("%s", (_what, re) => {
    const offenders = files.filter((f) => !f.endsWith(path.join("shared", "format.ts")) && re.test(fs.readFileSync(f, "utf8")));
    expect(offenders.map((f) => path.relative(root, f))).toEqual([]);
  });
});
