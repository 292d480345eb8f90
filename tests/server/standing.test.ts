import ICAL from "ical.js";
import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { Order } from "../../server/orders/order.entity";
import { materialiseAll } from "../../server/orders/standing.service";

/** Clock: Mon 7 Dec 2026 09:00 CST. Horizon 28 days; deliveries Tue–Sat. */
const NOW = "2026-12-07T15:00:00Z";
let t: TestApp;
let buyer: string;
let owner: string;
let accountId: number;
let rolls: { id: number };
let loaf: { id: number };
beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Standing Bakery" });
  await t.ds.query("INSERT INTO bakery_closure (date, note) VALUES ('2026-12-25', 'Christmas Day')");
  const a = await makeAccount(t.ds, { businessName: "Weekly Café", routeWeekdays: "2,4" });
  accountId = a.id;
  buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId }));
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  rolls = await makeProduct(t.ds, { name: "Rolls", priceCents: 1800 });
  loaf = await makeProduct(t.ds, { name: "Loaf", priceCents: 950, saleUnit: "loaf" });
});
afterAll(() => t.close());

const orders = () => t.ds.getRepository(Order).find({ where: { accountId }, order: { deliveryDate: "ASC" } });

describe("standing orders", () => {
  it("stores the weekly grid as an RRULE and makes an order for every orderable date in the horizon", async () => {
    const res = await t.http().put("/api/standing-orders").set(auth(buyer)).send({
      startDate: "2026-12-01", endDate: null, intervalWeeks: 1, skipDates: ["2026-12-17"],
      lines: [{ productId: rolls.id, weekday: 2, quantity: 3 }, { productId: rolls.id, weekday: 4, quantity: 2 }, { productId: loaf.id, weekday: 4, quantity: 1 }],
    });
    expect(res.status).toBe(200);
    expect(res.body.standingOrder.rrule).toContain("RRULE:FREQ=WEEKLY;INTERVAL=1;BYDAY=TU,TH;WKST=MO");
    const dates = (await orders()).map((o) => o.deliveryDate);
    // Tue/Thu from Tue 8 Dec to the horizon (4 Jan), skipping 17 Dec (café closed) and 25 Dec (bakery closed, a Friday anyway).
    expect(dates).toEqual(["2026-12-08", "2026-12-10", "2026-12-15", "2026-12-22", "2026-12-24", "2026-12-29", "2026-12-31"]);
    const thu = (await orders()).find((o) => o.deliveryDate === "2026-12-10")!;
    expect(thu).toMatchObject({ source: "standing", editedByHand: false, status: "open", totalCents: 2 * 1800 + 950 });
    expect(res.body.standingOrder.upcoming.map((u: { date: string }) => u.date)).toEqual(dates);
  });

  it("is idempotent: running the job twice creates nothing new", async () => {
    const before = (await orders()).length;
    const again = await t.http().post("/api/standing-orders/materialise").set(auth(owner));
    expect(again.status).toBe(200);
    expect(again.body.result).toEqual({ created: 0, updated: 0, cancelled: 0 });
    expect((await materialiseAll(t.ctx)).created).toBe(0);
    expect((await orders()).length).toBe(before);
  });

  it("keeps orders the buyer changed by hand when the standing order changes, and shows which", async () => {
    const tue15 = (await orders()).find((o) => o.deliveryDate === "2026-12-15")!;
    const edit = await t.http().patch(`/api/orders/${tue15.id}`).set(auth(buyer)).send({ lines: [{ productId: rolls.id, quantity: 9 }] });
    expect(edit.body.order.editedByHand).toBe(true);
    const res = await t.http().put("/api/standing-orders").set(auth(buyer)).send({
      startDate: "2026-12-01", endDate: null, intervalWeeks: 1, skipDates: ["2026-12-17"],
      lines: [{ productId: rolls.id, weekday: 2, quantity: 5 }, { productId: rolls.id, weekday: 4, quantity: 2 }, { productId: loaf.id, weekday: 4, quantity: 1 }],
    });
    const all = await orders();
    expect(all.find((o) => o.deliveryDate === "2026-12-15")!.totalCents).toBe(9 * 1800); // hand-edited: untouched
    expect(all.find((o) => o.deliveryDate === "2026-12-22")!.totalCents).toBe(5 * 1800); // followed the change
    const upcoming = res.body.standingOrder.upcoming as { date: string; editedByHand: boolean }[];
    expect(upcoming.filter((u) => u.editedByHand).map((u) => u.date)).toEqual(["2026-12-15"]);
  });

  it("every other week, and a weekday removed withdraws its untouched future orders", async () => {
    await t.http().put("/api/standing-orders").set(auth(buyer)).send({
      startDate: "2026-12-01", endDate: null, intervalWeeks: 2, skipDates: [],
      lines: [{ productId: rolls.id, weekday: 2, quantity: 4 }],
    });
    const open = (await orders()).filter((o) => o.status === "open").map((o) => o.deliveryDate);
    // Every other Tuesday counted from the week of 1 Dec: 15 Dec and 29 Dec; 8 Dec's cut-off (7 Dec 14:00) is still ahead.
    // Every other Tuesday from the week of Tue 1 Dec: 15 and 29 Dec. 15 Dec was also edited by hand,
    // so it stays as the buyer left it; 8, 10, 22, 24 and 31 Dec are withdrawn.
    expect(open).toEqual(["2026-12-15", "2026-12-29"]);
    const withdrawn = (await orders()).filter((o) => o.status === "cancelled").map((o) => o.deliveryDate);
    expect(withdrawn).toEqual(["2026-12-08", "2026-12-10", "2026-12-22", "2026-12-24", "2026-12-31"]);
  });

  it("refuses products or weekdays the account cannot get, with field messages", async () => {
    const res = await t.http().put("/api/standing-orders").set(auth(buyer)).send({
      startDate: "2026-12-01", intervalWeeks: 1, lines: [{ productId: rolls.id, weekday: 3, quantity: 2 }, { productId: 999999, weekday: 2, quantity: 1 }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields["lines.0.weekday"]).toMatch(/no delivery/);
    expect(res.body.error.fields["lines.1.productId"]).toMatch(/not offered/);
    const interval = await t.http().put("/api/standing-orders").set(auth(buyer)).send({ startDate: "2026-12-10", intervalWeeks: 3, lines: [] });
    expect(interval.body.error.fields.intervalWeeks).toBe("Choose every week or every other week.");
    const ends = await t.http().put("/api/standing-orders").set(auth(buyer)).send({ startDate: "2026-12-10", endDate: "2026-12-01", intervalWeeks: 1, lines: [] });
    expect(ends.body.error.fields.endDate).toBe("The end date must be after the start date.");
  });
});

describe("calendar feed (RFC 5545), parsed with ical.js", () => {
  it("lists the account's deliveries with their items; the URL is revocable", async () => {
    const created = await t.http().post("/api/calendar-feed").set(auth(buyer));
    expect(created.status).toBe(201);
    const url = new URL(created.body.url);
    expect(url.pathname).toMatch(/^\/api\/feeds\/[A-Za-z0-9_-]{32}\.ics$/);
    const res = await t.http().get(url.pathname);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/text\/calendar/);
    const comp = new ICAL.Component(ICAL.parse(res.text));
    const events = comp.getAllSubcomponents("vevent").map((v) => new ICAL.Event(v));
    const open = (await orders()).filter((o) => o.status !== "cancelled");
    expect(events.map((e) => e.startDate.toString()).sort()).toEqual(open.map((o) => o.deliveryDate).sort());
    expect(events.every((e) => e.startDate.isDate)).toBe(true);
    const e29 = events.find((e) => e.startDate.toString() === "2026-12-29")!;
    expect(e29.description).toContain("Rolls — 4 trays of 15 rolls");
    expect(e29.summary).toContain("Standing Bakery");

    const current = await t.http().get("/api/calendar-feed").set(auth(buyer));
    expect(current.body.url).toBe(created.body.url);
    expect((await t.http().delete("/api/calendar-feed").set(auth(buyer))).status).toBe(204);
    expect((await t.http().get(url.pathname)).status).toBe(404);
  });
});

describe("skip dates and what becomes of each coming date (issue 12, items 3 and 5)", () => {
  let fortnight: number;
  let fb: string;
  const put = (skipDates: string[]) =>
    t.http().put("/api/standing-orders").set(auth(fb)).send({ startDate: "2026-12-08", endDate: null, intervalWeeks: 2, skipDates, lines: [{ productId: rolls.id, weekday: 2, quantity: 2 }, { productId: rolls.id, weekday: 4, quantity: 1 }] });

  beforeAll(async () => {
    fortnight = (await makeAccount(t.ds, { businessName: "Fortnight Café", routeWeekdays: "2,4" })).id;
    fb = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: fortnight }));
    await t.ds.query("INSERT INTO bakery_closure (date, note) VALUES ('2026-12-24', 'Christmas Eve')");
  });

  it("refuses a skip date the standing order does not deliver on: the off week, another weekday, a past date", async () => {
    // Every other week from the week of Tue 8 Dec (RFC 5545 §3.3.10, INTERVAL=2 with WKST=MO): 8, 10, 22, 24 Dec; 15 and 17 Dec are the off week.
    const off = await put(["2026-12-15"]);
    expect(off.status).toBe(400);
    expect(off.body.error.fields["skipDates.0"]).toBe("Tue, Dec 15 is not one of your standing order's delivery dates (it delivers every other week); nothing is made then to skip.");
    const wed = await put(["2026-12-22", "2026-12-23"]);
    expect(wed.status).toBe(400);
    expect(Object.keys(wed.body.error.fields)).toEqual(["skipDates.1"]);
    const past = await put(["2026-12-01"]);
    expect(past.body.error.fields["skipDates.0"]).toBe("Tue, Dec 1 is in the past; choose a coming date to skip.");
    const ok = await put(["2026-12-22"]);
    expect(ok.status).toBe(200);
    expect(ok.body.standingOrder.skipDates).toEqual(["2026-12-22"]);
  });

  it("a closed date is shown as closed with the bakery's note, and cannot be skipped; made dates can", async () => {
    const res = await t.http().get("/api/standing-orders").set(auth(fb));
    const byDate = Object.fromEntries((res.body.standingOrder.upcoming as { date: string }[]).map((u) => [u.date, u]));
    expect(byDate["2026-12-24"]).toMatchObject({ plan: "closed", planText: "Bakery closed: Christmas Eve", skippable: false, orderId: null });
    expect(byDate["2026-12-08"]).toMatchObject({ plan: "ordered", status: "open", skippable: true });
    expect(byDate["2026-12-22"]).toBeUndefined(); // skipped
    // The horizon is 28 days (to 4 Jan): 8, 10, 22 (skipped) and 24 Dec.
    expect(Object.keys(byDate).sort()).toEqual(["2026-12-08", "2026-12-10", "2026-12-24"]);
  });

  it("on credit hold, dates without an order say they are made only if the overdue invoices are paid before the cut-off", async () => {
    // The job's order for 10 Dec is gone (say the owner removed it): while on hold, nothing makes it again.
    await t.ds.query("DELETE FROM order_line WHERE orderId IN (SELECT id FROM customer_order WHERE accountId = ? AND deliveryDate = '2026-12-10')", [fortnight]);
    await t.ds.query("DELETE FROM customer_order WHERE accountId = ? AND deliveryDate = '2026-12-10'", [fortnight]);
    await t.ds.query("UPDATE customer_account SET status = 'on_hold', creditHold = 1 WHERE id = ?", [fortnight]);
    const res = await t.http().get("/api/standing-orders").set(auth(fb));
    const dec10 = (res.body.standingOrder.upcoming as { date: string }[]).find((u) => u.date === "2026-12-10");
    expect(dec10).toMatchObject({ plan: "held", planText: "On hold: made only if the overdue invoices are paid before the cut-off", skippable: true });
    await t.ds.query("UPDATE customer_account SET status = 'active', creditHold = 0 WHERE id = ?", [fortnight]);
  });
});

describe("a product that needs more notice than is left", () => {
  it("stays off the first date's order while the rest of the delivery is made", async () => {
    // Now Mon 7 Dec 09:00 CST. Tue 8 Dec closes Mon 14:00 (one day's notice, still ahead); a product with two
    // days' lead closed for Tue 8 Dec on Sun 6 Dec, so that date is made without it and Tue 15 Dec with it.
    const late = await makeAccount(t.ds, { businessName: "Late Café", routeWeekdays: "2" });
    const lateBuyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: late.id }));
    const swirl = await makeProduct(t.ds, { name: "Swirl", priceCents: 1150, saleUnit: "loaf", leadDays: 2 });
    const res = await t.http().put("/api/standing-orders").set(auth(lateBuyer)).send({
      startDate: "2026-12-01", endDate: null, intervalWeeks: 1, skipDates: [],
      lines: [{ productId: rolls.id, weekday: 2, quantity: 2 }, { productId: swirl.id, weekday: 2, quantity: 1 }],
    });
    expect(res.status).toBe(200);
    const made = await t.ds.getRepository(Order).find({ where: { accountId: late.id }, order: { deliveryDate: "ASC" } });
    expect(made.slice(0, 2).map((o) => [o.deliveryDate, o.totalCents])).toEqual([["2026-12-08", 2 * 1800], ["2026-12-15", 2 * 1800 + 1150]]);
    // The job's next runs leave the first date as it is: the product's cut-off for it has passed.
    expect((await materialiseAll(t.ctx)).updated).toBe(0);
  });
});

describe("the orders board and held accounts (issue 12, item 7)", () => {
  it("names an account on hold whose standing order delivers that date, credit hold and pause told apart", async () => {
    const held = await makeAccount(t.ds, { businessName: "Held Café", routeWeekdays: "2" });
    const heldBuyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: held.id }));
    const put = await t.http().put("/api/standing-orders").set(auth(heldBuyer)).send({ startDate: "2026-12-01", endDate: null, intervalWeeks: 1, skipDates: ["2026-12-22"], lines: [{ productId: rolls.id, weekday: 2, quantity: 2 }] });
    expect(put.status).toBe(200);
    // Held after its orders were made: the ones still to come are withdrawn by hand here (what the hold leaves is no order).
    await t.ds.query("DELETE l FROM order_line l JOIN customer_order o ON o.id = l.orderId WHERE o.accountId = ?", [held.id]);
    await t.ds.query("DELETE FROM customer_order WHERE accountId = ?", [held.id]);
    await t.ds.query("UPDATE customer_account SET status = 'on_hold', creditHold = 1 WHERE id = ?", [held.id]);
    const heldOn = async (date: string) => (await t.http().get(`/api/orders/board?date=${date}`).set(auth(owner))).body.board.held as { accountName: string; hold: string }[];
    expect((await heldOn("2026-12-15")).filter((h) => h.accountName === "Held Café")).toEqual([{ accountId: held.id, accountName: "Held Café", hold: "credit" }]);
    expect((await heldOn("2026-12-16")).filter((h) => h.accountName === "Held Café")).toEqual([]); // a Wednesday: not its day
    expect((await heldOn("2026-12-22")).filter((h) => h.accountName === "Held Café")).toEqual([]); // skipped
    await t.ds.query("UPDATE customer_account SET creditHold = 0 WHERE id = ?", [held.id]);
    expect((await heldOn("2026-12-15")).filter((h) => h.accountName === "Held Café")).toEqual([{ accountId: held.id, accountName: "Held Café", hold: "paused" }]);
    await t.ds.query("UPDATE customer_account SET status = 'closed' WHERE id = ?", [held.id]);
  });
});

describe("a date the bakery closes after its standing orders were made (issue 12, item 5)", () => {
  it("withdraws the job's own untouched order at once, keeps one changed by hand, and both dates say the bakery is closed", async () => {
    const cafe = await makeAccount(t.ds, { businessName: "Closure Café", routeWeekdays: "2,4" });
    const cafeBuyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: cafe.id }));
    await t.http().put("/api/standing-orders").set(auth(cafeBuyer)).send({ startDate: "2026-12-01", endDate: null, intervalWeeks: 1, skipDates: [], lines: [{ productId: rolls.id, weekday: 2, quantity: 2 }, { productId: rolls.id, weekday: 4, quantity: 1 }] });
    const byDate = async () => new Map((await t.ds.getRepository(Order).find({ where: { accountId: cafe.id } })).map((o) => [o.deliveryDate, o]));
    const thu17 = (await byDate()).get("2026-12-17")!;
    expect((await t.http().patch(`/api/orders/${thu17.id}`).set(auth(cafeBuyer)).send({ lines: [{ productId: rolls.id, quantity: 5 }] })).status).toBe(200);
    const before = (await t.http().get("/api/settings/calendar").set(auth(owner))).body.settings;
    const closures = [...before.closures, { date: "2026-12-15", note: "Oven service" }, { date: "2026-12-17", note: "Oven service" }];
    const put = await t.http().put("/api/settings/calendar").set(auth(owner)).send({ ...before, closures });
    expect(put.status).toBe(200);
    const after = await byDate();
    expect(after.get("2026-12-15")!.status).toBe("cancelled"); // the job's own: withdrawn with the closure
    expect(after.get("2026-12-17")!.status).toBe("open"); // changed by hand: left for the bakery to sort out with the café
    const upcoming = (await t.http().get("/api/standing-orders").set(auth(cafeBuyer))).body.standingOrder.upcoming as { date: string; plan: string; planText: string; skippable: boolean }[];
    for (const d of ["2026-12-15", "2026-12-17"]) expect(upcoming.find((u) => u.date === d)).toMatchObject({ plan: "closed", planText: "Bakery closed: Oven service", skippable: false });
    await t.http().put("/api/settings/calendar").set(auth(owner)).send(before);
    expect((await byDate()).get("2026-12-15")!.status).toBe("open"); // reopened: the job makes it again
    await t.ds.query("UPDATE customer_account SET status = 'closed' WHERE id = ?", [cafe.id]);
  });
});
