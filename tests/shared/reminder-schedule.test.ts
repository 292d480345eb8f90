import { dueReminderStage } from "../../shared/billing";

// The schedule's own rule (shared/billing.ts); dates are worked by hand from a calendar (Dec 2026: the 14th is a Monday).
describe("dueReminderStage", () => {
  const base = { issueDate: "2026-12-01", dueDate: "2026-12-14", sent: [] as never[] };
  it.each([
    ["2026-12-10", null],
    ["2026-12-11", "before_due"],
    ["2026-12-13", "before_due"],
    ["2026-12-14", "on_due"],
    ["2026-12-20", "on_due"],
    ["2026-12-21", "after_due"],
    ["2027-01-30", "after_due"],
  ])("with nothing sent, on %s: %p", (today, stage) => expect(dueReminderStage({ ...base, today })).toBe(stage));

  it("never repeats a stage or goes back to an earlier one, and a reminder by hand does not count", () => {
    expect(dueReminderStage({ ...base, today: "2026-12-12", sent: ["before_due"] })).toBeNull();
    expect(dueReminderStage({ ...base, today: "2026-12-14", sent: ["before_due"] })).toBe("on_due");
    expect(dueReminderStage({ ...base, today: "2026-12-22", sent: ["after_due"] })).toBeNull();
    expect(dueReminderStage({ ...base, today: "2026-12-14", sent: ["manual"] })).toBe("on_due");
  });

  it("skips a stage that fell before the invoice existed (issued 1 day before due: no 3-days-before reminder)", () => {
    expect(dueReminderStage({ issueDate: "2026-12-13", dueDate: "2026-12-14", today: "2026-12-13", sent: [] })).toBeNull();
    expect(dueReminderStage({ issueDate: "2026-12-13", dueDate: "2026-12-14", today: "2026-12-14", sent: [] })).toBe("on_due");
  });
});
