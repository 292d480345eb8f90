import { RRule } from "rrule";
import { expandRule, weeklyRule } from "../../shared/recurrence";

/**
 * Source: RFC 5545 §3.8.5.3 (Recurrence Rule) examples, dates as listed in the RFC
 * (copied from memory of the RFC text; the RRULE strings are the RFC's own).
 * The examples start 2 Sep 1997 09:00 America/New_York (EDT, 13:00Z); DTSTART is written in UTC so the
 * UNTIL bounds cut exactly where the RFC's do. Only the dates are compared.
 */
const dates = (rule: string, from: string, to: string) => expandRule(rule, from, to);

describe("RFC 5545 §3.8.5.3 weekly examples", () => {
  it("Weekly for 10 occurrences: FREQ=WEEKLY;COUNT=10", () => {
    const rule = "DTSTART:19970902T130000Z\nRRULE:FREQ=WEEKLY;COUNT=10";
    expect(dates(rule, "1997-01-01", "1998-12-31")).toEqual([
      "1997-09-02", "1997-09-09", "1997-09-16", "1997-09-23", "1997-09-30",
      "1997-10-07", "1997-10-14", "1997-10-21", "1997-10-28", "1997-11-04",
    ]);
  });

  it("Weekly on Tuesday and Thursday for five weeks: FREQ=WEEKLY;UNTIL=19971007T000000Z;WKST=SU;BYDAY=TU,TH", () => {
    const rule = "DTSTART:19970902T130000Z\nRRULE:FREQ=WEEKLY;UNTIL=19971007T000000Z;WKST=SU;BYDAY=TU,TH";
    expect(dates(rule, "1997-01-01", "1998-12-31")).toEqual([
      "1997-09-02", "1997-09-04", "1997-09-09", "1997-09-11", "1997-09-16", "1997-09-18",
      "1997-09-23", "1997-09-25", "1997-09-30", "1997-10-02",
    ]);
  });

  it("Every other week on Tuesday and Thursday, for 8 occurrences: FREQ=WEEKLY;INTERVAL=2;COUNT=8;WKST=SU;BYDAY=TU,TH", () => {
    const rule = "DTSTART:19970902T130000Z\nRRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=8;WKST=SU;BYDAY=TU,TH";
    expect(dates(rule, "1997-01-01", "1998-12-31")).toEqual([
      "1997-09-02", "1997-09-04", "1997-09-16", "1997-09-18", "1997-09-30", "1997-10-02", "1997-10-14", "1997-10-16",
    ]);
  });

  it("Every other week on Monday, Wednesday and Friday until 24 Dec 1997, starting Monday 1 Sep 1997", () => {
    const rule = "DTSTART:19970901T130000Z\nRRULE:FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR";
    expect(dates(rule, "1997-01-01", "1998-12-31")).toEqual([
      "1997-09-01", "1997-09-03", "1997-09-05", "1997-09-15", "1997-09-17", "1997-09-19", "1997-09-29",
      "1997-10-01", "1997-10-03", "1997-10-13", "1997-10-15", "1997-10-17", "1997-10-27", "1997-10-29", "1997-10-31",
      "1997-11-10", "1997-11-12", "1997-11-14", "1997-11-24", "1997-11-26", "1997-11-28",
      "1997-12-08", "1997-12-10", "1997-12-12", "1997-12-22",
    ]);
  });
});

describe("Panwise's standing-order rules", () => {
  it("writes a weekly rule that the rrule parser reads back", () => {
    const rule = weeklyRule({ startDate: "2026-12-01", endDate: null, intervalWeeks: 2, weekdays: [4, 2] });
    expect(rule).toContain("RRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=TU,TH;WKST=MO");
    expect(RRule.fromString(rule).options.interval).toBe(2);
    expect(dates(rule, "2026-12-01", "2026-12-31")).toEqual(["2026-12-01", "2026-12-03", "2026-12-15", "2026-12-17", "2026-12-29", "2026-12-31"]);
  });

  it("stops at the end date, inclusive", () => {
    const rule = weeklyRule({ startDate: "2026-12-01", endDate: "2026-12-15", intervalWeeks: 1, weekdays: [2] });
    expect(dates(rule, "2026-11-01", "2027-01-31")).toEqual(["2026-12-01", "2026-12-08", "2026-12-15"]);
  });
});
