import { DATE_MAX, DATE_MIN, MAX_RANGE_DAYS, addDays, cutoffFor, dateRange, dateStatus, daysBetween, isCalendarDate, isSupportedDate, type CalendarSettings } from "../../shared/calendar";
import { dateSchema } from "../../shared/schemas/calendar";

/**
 * Source: the IANA time zone database (tzdata), zone America/Chicago — US rules since 2007: daylight
 * saving begins the second Sunday of March at 02:00 local (2026-03-08) and ends the first Sunday of
 * November at 02:00 local (2026-11-01). CST = UTC−6, CDT = UTC−5.
 * Second reference: the runtime's own ICU time-zone data through Intl.DateTimeFormat (independent of luxon).
 */
const chicago = { timeZone: "America/Chicago", cutoffTime: "14:00", leadDays: 1 };

function icuOffset(instant: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat("en-US", { timeZone, timeZoneName: "longOffset" }).formatToParts(instant).find((p) => p.type === "timeZoneName")!;
  return part.value.replace("GMT", "");
}

describe("cut-offs across the 2026 daylight-saving changes in America/Chicago (IANA tzdata)", () => {
  const cases: [string, number, string, string][] = [
    // delivery date, lead days, expected cut-off instant (UTC), expected local offset
    ["2026-03-08", 1, "2026-03-07T20:00:00.000Z", "-06:00"], // cut-off Sat 7 Mar 14:00 CST
    ["2026-03-09", 1, "2026-03-08T19:00:00.000Z", "-05:00"], // cut-off Sun 8 Mar 14:00 CDT (the change day)
    ["2026-03-10", 2, "2026-03-08T19:00:00.000Z", "-05:00"], // two lead days land on the change day too
    ["2026-03-10", 3, "2026-03-07T20:00:00.000Z", "-06:00"], // three lead days: before the change
    ["2026-11-01", 1, "2026-10-31T19:00:00.000Z", "-05:00"], // cut-off Sat 31 Oct 14:00 CDT
    ["2026-11-02", 1, "2026-11-01T20:00:00.000Z", "-06:00"], // cut-off Sun 1 Nov 14:00 CST (the change day)
    ["2026-11-03", 2, "2026-11-01T20:00:00.000Z", "-06:00"],
  ];
  it.each(cases)("delivery %s with %i lead day(s) → %s", (date, lead, utc, offset) => {
    const c = cutoffFor(date, { ...chicago, leadDays: lead });
    expect(c.toUTC().toISO()).toBe(utc);
    expect(c.toISO()!.slice(-6)).toBe(offset);
    expect(icuOffset(new Date(utc), "America/Chicago")).toBe(offset);
    expect(c.toFormat("HH:mm")).toBe("14:00");
  });

  it("a product's longer lead days win over the bakery's (max of the two)", () => {
    expect(cutoffFor("2026-06-12", chicago, 2).toISODate()).toBe("2026-06-10");
    expect(cutoffFor("2026-06-12", chicago, 0).toISODate()).toBe("2026-06-11");
    expect(cutoffFor("2026-06-12", chicago, null).toISODate()).toBe("2026-06-11");
  });

  it("a cut-off time inside the skipped hour (02:30 on 8 March) moves forward to a real instant", () => {
    const c = cutoffFor("2026-03-09", { ...chicago, cutoffTime: "02:30" });
    expect(c.isValid).toBe(true);
    expect(c.toUTC().toISO()).toBe("2026-03-08T08:30:00.000Z"); // 03:30 CDT
  });
});

describe("date status", () => {
  const settings: CalendarSettings = { ...chicago, deliveryWeekdays: [2, 3, 4, 5, 6], closures: ["2026-07-04"], horizonDays: 28 };
  const now = new Date("2026-06-10T15:00:00Z"); // Wed 10 Jun 10:00 CDT

  it("gives the reason a date cannot be ordered", () => {
    expect(dateStatus("2026-06-11", settings, now)).toMatchObject({ orderable: true, reason: null, cutoffAt: "2026-06-10T14:00:00.000-05:00" });
    expect(dateStatus("2026-06-10", settings, now).reason).toBe("past_cutoff");
    expect(dateStatus("2026-06-14", settings, now).reason).toBe("not_delivery_day"); // a Sunday
    expect(dateStatus("2026-07-04", settings, now).reason).toBe("closed");
    expect(dateStatus("2026-07-08", settings, now).orderable).toBe(true); // today + 28
    expect(dateStatus("2026-07-09", settings, now).reason).toBe("beyond_horizon");
    expect(dateStatus("2026-06-12", settings, now, [2, 4]).reason).toBe("not_delivery_day"); // not the account's route day
  });

  it("turns at the cut-off instant itself", () => {
    expect(dateStatus("2026-06-11", settings, new Date("2026-06-10T18:59:59.999Z")).orderable).toBe(true);
    expect(dateStatus("2026-06-11", settings, new Date("2026-06-10T19:00:00.000Z")).reason).toBe("past_cutoff");
  });

  it("accepts only real calendar dates", () => {
    expect(isCalendarDate("2026-02-28")).toBe(true);
    expect(isCalendarDate("2028-02-29")).toBe(true); // leap year (Gregorian rule)
    expect(isCalendarDate("2026-02-29")).toBe(false);
    expect(isCalendarDate("2026-02-30")).toBe(false);
    expect(isCalendarDate("2026-2-3")).toBe(false);
    expect(isCalendarDate("tomorrow")).toBe(false);
  });
});

/**
 * Day arithmetic near the end of four-digit years. Reference: ECMAScript time values (ECMA-262 §21.4.1,
 * a day is exactly 86,400,000 ms of UTC) through Date.UTC, independent of luxon. Past 9999-12-31 luxon
 * writes "+010000-01-01" (ISO 8601 expanded year), which sorts before "9999-12-31" as a string.
 */
const utcDays = (y: number, m: number, d: number) => Date.UTC(y, m - 1, d) / 86_400_000;

describe("addDays and dateRange near year 9999", () => {
  it("adds days across month, leap-day and year ends", () => {
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29");
    expect(addDays("2026-12-31", 1)).toBe("2027-01-01");
    expect(addDays("2027-01-01", -1)).toBe("2026-12-31");
    expect(addDays("9999-12-30", 1)).toBe("9999-12-31");
  });

  it("refuses a result past 9999-12-31 or before 0000-01-01 instead of writing +010000-01-01", () => {
    expect(() => addDays("9999-12-31", 1)).toThrow(RangeError);
    expect(() => addDays("0000-01-01", -1)).toThrow(RangeError);
    expect(() => addDays("2026-02-30", 1)).toThrow(RangeError);
    expect(() => addDays("2026-12-01", 0.5)).toThrow(RangeError);
  });

  it("counts days arithmetically, as Date.UTC does", () => {
    expect(daysBetween("2026-12-01", "9999-12-31")).toBe(utcDays(9999, 12, 31) - utcDays(2026, 12, 1));
    expect(daysBetween("1900-01-01", "2400-12-31")).toBe(utcDays(2400, 12, 31) - utcDays(1900, 1, 1));
    expect(daysBetween("2026-12-10", "2026-12-01")).toBe(-9);
  });

  it("builds a range that ends on 9999-12-31 and stops there", () => {
    expect(dateRange("9999-12-29", "9999-12-31")).toEqual(["9999-12-29", "9999-12-30", "9999-12-31"]);
    expect(dateRange("2028-02-27", "2028-03-01")).toEqual(["2028-02-27", "2028-02-28", "2028-02-29", "2028-03-01"]);
    expect(dateRange("2026-12-10", "2026-12-01")).toEqual([]);
  });

  it("throws at once, before building anything, for a span above its maximum", () => {
    daysBetween("2026-01-01", "2026-01-02"); // warm up luxon's parser
    const started = performance.now();
    expect(() => dateRange("2026-12-01", "9999-12-31")).toThrow(/more than the 400 days/);
    expect(() => dateRange("1900-01-01", "2400-12-31")).toThrow(RangeError);
    expect(() => dateRange("2026-01-01", "2026-01-10", 9)).toThrow(RangeError);
    expect(performance.now() - started).toBeLessThan(50);
    expect(dateRange("2026-01-01", "2026-01-10", 10)).toHaveLength(10);
    expect(dateRange("2026-01-01", addDays("2026-01-01", MAX_RANGE_DAYS - 1))).toHaveLength(MAX_RANGE_DAYS);
    expect(() => dateRange("2026-12-01", "10000-01-01")).toThrow(RangeError);
  });
});

describe("dateSchema: real dates from 2000-01-01 to 2099-12-31", () => {
  it("accepts the limits themselves and refuses what lies outside, naming the limits", () => {
    expect([DATE_MIN, DATE_MAX]).toEqual(["2000-01-01", "2099-12-31"]);
    for (const ok of ["2000-01-01", "2026-12-01", "2099-12-31"]) expect(dateSchema.safeParse(ok).success).toBe(true);
    for (const bad of ["1999-12-31", "1900-01-01", "2100-01-01", "2400-12-31", "9999-12-31"]) {
      const r = dateSchema.safeParse(bad);
      expect(r.success).toBe(false);
      expect(r.error!.issues).toHaveLength(1);
      expect(r.error!.issues[0].message).toBe("Dates run from 2000-01-01 to 2099-12-31.");
    }
    for (const bad of ["10000-01-01", "+010000-01-01", "2026-02-30", "2026-12-1"]) {
      expect(dateSchema.safeParse(bad).error!.issues[0].message).toBe("That is not a calendar date (use YYYY-MM-DD).");
    }
    expect(isSupportedDate("2099-12-31")).toBe(true);
    expect(isSupportedDate("2100-01-01")).toBe(false);
  });
});
