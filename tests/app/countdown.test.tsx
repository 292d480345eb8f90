import { formatCountdown, formatDuration, isUrgent, msUntil, secondsLeft, URGENT_MS } from "../../components/ordering/countdown";
import { clockSkew } from "../../components/ordering/useServerNow";
import { stepDown, stepUp, parseQuantity, quantityProblem, shortfall } from "../../components/ordering/quantities";
import { mmToInches, MM_PER_INCH } from "../../components/ordering/pan";
import { IdempotencyKeeper } from "../../components/ordering/idempotency";
import { formatCutoff } from "../../components/ordering/dates";

const S = 1000;
const M = 60 * S;
const H = 60 * M;

describe("cut-off countdown", () => {
  it.each([
    [3 * H + 12 * M, "closes in 3 h 12 min"],
    [3 * H, "closes in 3 h"],
    [26 * H + 30 * M, "closes in 1 day 2 h"],
    [3 * 24 * H, "closes in 3 days"],
    [59 * M + 59 * S, "closes in 59 min 59 s"],
    [42 * M, "closes in 42 min"],
    [35 * S, "closes in 35 s"],
    [200, "closes in 1 s"],
    [0, "ordering has closed"],
    [-5 * M, "ordering has closed"],
  ])("%d ms reads %p", (ms, text) => {
    expect(formatCountdown(ms)).toBe(text);
  });

  it("rounds partial seconds up, so it never reads 0 s while still open", () => {
    expect(secondsLeft(1)).toBe(1);
    expect(secondsLeft(1000)).toBe(1);
    expect(secondsLeft(1001)).toBe(2);
    expect(formatDuration(0)).toBe("");
    expect(secondsLeft(Number.NaN)).toBe(0);
  });

  it("turns urgent under an hour, and not once closed", () => {
    expect(isUrgent(URGENT_MS)).toBe(false);
    expect(isUrgent(URGENT_MS - 1)).toBe(true);
    expect(isUrgent(1)).toBe(true);
    expect(isUrgent(0)).toBe(false);
  });

  it("measures to an ISO instant with its offset", () => {
    const now = Date.parse("2025-12-02T05:30:00-06:00");
    expect(msUntil("2025-12-02T14:00:00.000-06:00", now)).toBe(8.5 * H);
    expect(msUntil("not a date", now)).toBe(Number.NEGATIVE_INFINITY);
  });

  it("corrects the device clock by the server's", () => {
    expect(clockSkew("2025-12-02T05:30:00.000-06:00", Date.parse("2025-12-02T11:29:50.000Z"))).toBe(10 * S);
    expect(clockSkew(undefined, 123)).toBe(0);
    expect(clockSkew("garbage", 123)).toBe(0);
  });

  it("shows the cut-off in the bakery's time zone", () => {
    // Chicago is UTC−6 in December and UTC−5 in June (IANA tz database).
    expect(formatCutoff("2025-12-02T20:00:00.000Z", "America/Chicago")).toBe("Tue, Dec 2, 2:00 PM CST");
    expect(formatCutoff("2026-06-09T19:00:00.000Z", "America/Chicago")).toBe("Tue, Jun 9, 2:00 PM CDT");
  });
});

describe("quantity steps", () => {
  const rule = { minQuantity: 2, maxQuantity: 5, saleUnit: "pack of 8 buns", saleUnitPlural: "packs of 8 buns" };
  it("jumps from nothing to the minimum and stops at the maximum", () => {
    expect(stepUp(0, rule)).toBe(2);
    expect(stepUp(2, rule)).toBe(3);
    expect(stepUp(5, rule)).toBe(5);
    expect(stepDown(3, rule)).toBe(2);
    expect(stepDown(2, rule)).toBe(0);
    expect(stepDown(0, rule)).toBe(0);
    expect(stepDown(9, rule)).toBe(5);
  });
  it("reads typed quantities and names what is wrong in the server's words", () => {
    expect(parseQuantity("")).toBe(0);
    expect(parseQuantity(" 7 ")).toBe(7);
    expect(parseQuantity("2.5")).toBeNaN();
    expect(quantityProblem(6, rule)).toBe("At most 5 packs of 8 buns per order.");
    expect(quantityProblem(1, rule)).toBe("At least 2 packs of 8 buns per order.");
    expect(quantityProblem(0, rule)).toBeNull();
    expect(quantityProblem(Number.NaN, rule)).toBe("Enter a whole number.");
  });
  it("works out the shortfall to a minimum order", () => {
    expect(shortfall(3600, 5000)).toBe(1400);
    expect(shortfall(5000, 5000)).toBe(0);
    expect(shortfall(0, 5000)).toBe(0);
    expect(shortfall(100, 0)).toBe(0);
  });
});

describe("pan sizes", () => {
  it("uses 1 in = 25.4 mm exactly (NIST SP 811, appendix B)", () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(mmToInches(254)).toBe("10 in");
    expect(mmToInches(330)).toBe("13 in");
    expect(mmToInches(229)).toBe("9 in");
    expect(mmToInches(250)).toBe("9.8 in");
    expect(mmToInches(0)).toBe("");
  });
});

describe("idempotency keys", () => {
  it("keeps the key for the same body and makes a new one for a changed body or after success", () => {
    const k = new IdempotencyKeeper();
    const a = k.keyFor({ lines: [1] });
    expect(k.keyFor({ lines: [1] })).toBe(a);
    const b = k.keyFor({ lines: [2] });
    expect(b).not.toBe(a);
    k.reset();
    expect(k.keyFor({ lines: [2] })).not.toBe(b);
  });
});
