/**
 * The standing order as plain data (components/ordering/standing.ts): the grid, its checks, the week's
 * estimate, the schedule in words, skipped dates and the server's errors mapped back onto the grid.
 */
import {
  accountWeekdays,
  cellErrorsFrom,
  cellKey,
  cellProblems,
  chosenWeekdays,
  droppedLines,
  listWeekdays,
  perWeek,
  savedMessage,
  scheduleSummary,
  skipDateCheck,
  deliversOn,
  standingValues,
  toggledSkip,
  weekTotalCents,
  withSkip,
  withSkipDatesField,
} from "../../components/ordering/standing";
import type { StandingOrderDto } from "../../shared/schemas/orders";
import type { Weekday } from "../../shared/calendar";

const ROLLS = { id: 101, priceCents: 1800, minQuantity: 1, maxQuantity: 40, saleUnit: "tray", saleUnitPlural: "trays" };
const BUNS = { id: 102, priceCents: 1600, minQuantity: 2, maxQuantity: 5, saleUnit: "pack of 8 buns", saleUnitPlural: "packs of 8 buns" };
const PRODUCTS = [ROLLS, BUNS];
const TUE_WED_THU = [2, 3, 4] as const;

const standing = (s: Partial<StandingOrderDto> = {}): StandingOrderDto => ({
  accountId: 11,
  startDate: "2025-12-01",
  endDate: null,
  intervalWeeks: 1,
  skipDates: [],
  lines: [{ productId: 101, weekday: 2, quantity: 2 }],
  active: true,
  rrule: "",
  upcoming: [],
  ...s,
});

describe("the form's values", () => {
  it("fills the grid from a saved standing order, leaving zero cells blank", () => {
    const v = standingValues(standing({ lines: [{ productId: 101, weekday: 2, quantity: 2 }, { productId: 102, weekday: 3, quantity: 0 }], endDate: "2026-03-31", intervalWeeks: 2, active: false, skipDates: ["2025-12-25"] }), "2025-12-02");
    expect(v).toEqual({ cells: { "101:2": "2" }, startDate: "2025-12-01", endDate: "2026-03-31", intervalWeeks: 2, active: false, skipDates: ["2025-12-25"] });
  });

  it("starts a new one tomorrow, every week, switched on", () => {
    expect(standingValues(null, "2025-12-31")).toEqual({ cells: {}, startDate: "2026-01-01", endDate: "", intervalWeeks: 1, active: true, skipDates: [] });
  });
});

describe("weekdays", () => {
  it("narrows the bakery's delivery days to the account's route, in week order", () => {
    expect(accountWeekdays([6, 2, 3, 4, 5], [4, 2, 3])).toEqual([2, 3, 4]);
    expect(accountWeekdays([5, 2], null)).toEqual([2, 5]);
    expect(accountWeekdays([2, 3], [])).toEqual([]);
  });

  it("lists them in words", () => {
    expect(listWeekdays([2, 4, 6])).toBe("Tue, Thu and Sat");
    expect(listWeekdays([2], true)).toBe("Tuesday");
    expect(listWeekdays([])).toBe("");
  });
});

describe("the grid", () => {
  const cells = { [cellKey(101, 2)]: "2", [cellKey(101, 4)]: "3", [cellKey(102, 3)]: "1", [cellKey(102, 4)]: "x" };

  it("marks cells outside the product's limits, and unreadable ones", () => {
    expect(cellProblems(PRODUCTS, TUE_WED_THU, cells)).toEqual({ "102:3": "At least 2 packs of 8 buns per order.", "102:4": "Enter a whole number." });
    expect(cellProblems(PRODUCTS, TUE_WED_THU, { "101:2": "41" })).toEqual({ "101:2": "At most 40 trays per order." });
    expect(cellProblems(PRODUCTS, TUE_WED_THU, {})).toEqual({});
  });

  it("counts a product's week and prices the whole week at today's prices", () => {
    expect(perWeek(101, TUE_WED_THU, cells)).toBe(5);
    expect(perWeek(102, TUE_WED_THU, cells)).toBe(1);
    expect(weekTotalCents(PRODUCTS, TUE_WED_THU, cells)).toBe(5 * 1800 + 1 * 1600);
    // Every other week still says what one delivery week comes to.
    expect(weekTotalCents(PRODUCTS, TUE_WED_THU, {})).toBe(0);
  });

  it("knows which weekdays have anything set", () => {
    expect(chosenWeekdays(PRODUCTS, TUE_WED_THU, cells)).toEqual([2, 3, 4]);
    expect(chosenWeekdays(PRODUCTS, TUE_WED_THU, { "101:3": "0", "102:4": "2" })).toEqual([4]);
  });

  it("finds saved quantities for days off the route and products no longer offered", () => {
    const s = standing({ lines: [{ productId: 101, weekday: 2, quantity: 2 }, { productId: 101, weekday: 6, quantity: 1 }, { productId: 999, weekday: 3, quantity: 4 }, { productId: 102, weekday: 6, quantity: 0 }] });
    expect(droppedLines(s, TUE_WED_THU, PRODUCTS)).toEqual([
      { productId: 101, weekday: 6, quantity: 1 },
      { productId: 999, weekday: 3, quantity: 4 },
    ]);
    expect(droppedLines(null, TUE_WED_THU, PRODUCTS)).toEqual([]);
  });
});

describe("the schedule in words", () => {
  it("says how often, on which days, from and until when", () => {
    expect(scheduleSummary([2, 4], { intervalWeeks: 1, startDate: "2025-12-02", endDate: "" })).toBe("Every week on Tue and Thu, from Tue, Dec 2.");
    expect(scheduleSummary([3], { intervalWeeks: 2, startDate: "2025-12-02", endDate: "2026-03-31" })).toBe("Every other week on Wed, from Tue, Dec 2 until Tue, Mar 31.");
    expect(scheduleSummary([3], { intervalWeeks: 1, startDate: "next week", endDate: "soon" })).toBe("Every week on Wed, from the start date.");
    expect(scheduleSummary([], { intervalWeeks: 1, startDate: "2025-12-02", endDate: "" })).toBe("No quantities yet: set how much you want on each delivery day.");
  });

  it("says what saving did", () => {
    expect(savedMessage({ active: false, lines: [{ productId: 1, weekday: 2, quantity: 1 }] }, 28)).toBe("Saved. Your standing order is paused: no new orders are made from it.");
    expect(savedMessage({ active: true, lines: [] }, 28)).toBe("Saved. With no quantities set, no orders are made from it.");
    expect(savedMessage({ active: true, lines: [{ productId: 1, weekday: 2, quantity: 1 }] }, 28)).toBe("Saved. Orders are made for the next 28 days; dates you changed by hand keep your changes.");
  });
});

describe("skipped dates", () => {
  it("takes a typed date after today", () => {
    expect(skipDateCheck(" 2025-12-25 ", "2025-12-02")).toEqual({ date: "2025-12-25" });
    // The example is a week after today, never a date already gone (issue 12, item 5).
    expect(skipDateCheck("25/12/2025", "2025-12-02")).toEqual({ error: "Write the date as YYYY-MM-DD, e.g. 2025-12-09." });
    expect(skipDateCheck("25/12/2025", "2026-12-04")).toEqual({ error: "Write the date as YYYY-MM-DD, e.g. 2026-12-11." });
    expect(skipDateCheck("2025-12-02", "2025-12-02")).toEqual({ error: "Choose a date after today." });
  });

  it("takes only dates the standing order delivers on (RFC 5545 §3.3.10: INTERVAL=2 counts weeks from DTSTART's week, WKST=MO)", () => {
    // Worked by hand on a printed December 2025 calendar: starting Tue 2 Dec, every other week on Tue and Thu
    // delivers on 2, 4, 16, 18, 30 Dec; 9 and 11 Dec are the off week, Wed 3 Dec is another weekday.
    const everyOther = { startDate: "2025-12-02", endDate: "2025-12-31", intervalWeeks: 2 as const, weekdays: [2, 4] as Weekday[] };
    expect(["2025-12-02", "2025-12-04", "2025-12-09", "2025-12-11", "2025-12-16", "2025-12-18", "2025-12-30"].filter((d) => deliversOn(everyOther, d))).toEqual(["2025-12-02", "2025-12-04", "2025-12-16", "2025-12-18", "2025-12-30"]);
    expect(skipDateCheck("2025-12-16", "2025-12-02", everyOther)).toEqual({ date: "2025-12-16" });
    expect(skipDateCheck("2025-12-09", "2025-12-02", everyOther)).toEqual({ error: "Tue, Dec 9 is not one of your delivery dates (every other week on Tue and Thu): nothing is made then." });
    expect(skipDateCheck("2025-12-03", "2025-12-02", { ...everyOther, intervalWeeks: 1 })).toEqual({ error: "Wed, Dec 3 is not one of your delivery dates (every week on Tue and Thu): nothing is made then." });
    expect(skipDateCheck("2026-01-13", "2025-12-02", everyOther)).toEqual({ error: "Tue, Jan 13 is after your standing order ends: nothing is made then." });
    // No quantities yet: any coming date may be noted.
    expect(skipDateCheck("2025-12-03", "2025-12-02", { ...everyOther, weekdays: [] })).toEqual({ date: "2025-12-03" });
  });

  it("adds without repeats, in date order, and toggles", () => {
    expect(withSkip(["2025-12-30", "2025-12-23"], "2025-12-25")).toEqual(["2025-12-23", "2025-12-25", "2025-12-30"]);
    expect(withSkip(["2025-12-25"], "2025-12-25")).toEqual(["2025-12-25"]);
    expect(toggledSkip(["2025-12-23", "2025-12-30"], "2025-12-23")).toEqual(["2025-12-30"]);
    expect(toggledSkip(["2025-12-30"], "2025-12-23")).toEqual(["2025-12-23", "2025-12-30"]);
  });
});

describe("the server's errors", () => {
  const sent = [
    { productId: 101, weekday: 2, quantity: 2 },
    { productId: 102, weekday: 3, quantity: 9 },
  ];

  it("puts a line's error on the cell of the line sent at that index", () => {
    expect(cellErrorsFrom({ "lines.1.quantity": "At most 5.", "lines.0": "Twice.", "lines.7.weekday": "No delivery.", startDate: "Too early." }, sent)).toEqual({ "102:3": "At most 5.", "101:2": "Twice." });
  });

  it("names every skipped date's error after the one skip input", () => {
    expect(withSkipDatesField({ "skipDates.3": "Not a date.", startDate: "Too early." })).toEqual({ skipDates: "Not a date.", startDate: "Too early." });
  });
});
