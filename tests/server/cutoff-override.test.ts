import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { Order } from "../../server/orders/order.entity";
import { CustomerAccount } from "../../server/accounts/account.entity";

/**
 * Issue 12: the owner takes an order by phone past the cut-off, confirming it with a reason that is kept on the
 * order. Clock: Wed 10 Jun 2026 15:00 CDT (20:00Z); Thu 11 Jun's cut-off was Wed 14:00 CDT, Fri 12 Jun's is ahead.
 */
const LATE = "2026-06-10T20:00:00Z";
const THU = "2026-06-11";
const FRI = "2026-06-12";

let t: TestApp;
let owner: string;
let ownerId: number;
let bookkeeper: string;
let baker: string;
let buyer: string;
let accountId: number;
let rolls: { id: number };
beforeAll(async () => {
  t = await startTestApp({ now: LATE });
  await makeBakery(t.ds, { name: "Phone Bakery" });
  accountId = (await makeAccount(t.ds, { businessName: "Late Caller Café" })).id;
  buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId }));
  const o = await makeUser(t.ds, "owner");
  ownerId = o.id;
  owner = await tokenFor(t, o);
  bookkeeper = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
  baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  rolls = await makeProduct(t.ds, { name: "Dinner rolls", priceCents: 1800 });
});
afterAll(() => t.close());
beforeEach(() => t.clock.set(LATE));

const override = { confirm: true, reason: "Phoned at 3 pm; the oven has room" };
const place = (token: string, body: object) => t.http().post("/api/orders").set(auth(token)).send({ accountId, deliveryDate: THU, lines: [{ productId: rolls.id, quantity: 2 }], ...body });

describe("placing past the cut-off", () => {
  it("without an override, everyone meets the cut-off (409 cutoff_passed)", async () => {
    for (const token of [owner, bookkeeper]) expect((await place(token, {})).body.error.code).toBe("cutoff_passed");
    const own = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: THU, lines: [{ productId: rolls.id, quantity: 2 }] });
    expect(own.body.error.code).toBe("cutoff_passed");
  });

  it("only the owner may override: the bookkeeper and the buyer get 403, the baker cannot order at all", async () => {
    const books = await place(bookkeeper, { cutoffOverride: override });
    expect(books.status).toBe(403);
    expect(books.body.error).toMatchObject({ code: "override_owner_only", message: "Only the owner can take or change an order past its cut-off." });
    const self = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: THU, lines: [{ productId: rolls.id, quantity: 2 }], cutoffOverride: override });
    expect(self.status).toBe(403);
    expect(self.body.error.code).toBe("override_owner_only");
    expect((await place(baker, { cutoffOverride: override })).status).toBe(403);
    expect(await t.ds.getRepository(Order).countBy({ accountId, deliveryDate: THU })).toBe(0);
  });

  it("bad input: no confirmation, no or a too-short reason, a reason too long — 400 with the field named", async () => {
    const cases: [object, string, RegExp][] = [
      [{ cutoffOverride: { reason: "Phoned late" } }, "cutoffOverride.confirm", /Confirm that the cut-off is set aside/],
      [{ cutoffOverride: { confirm: true } }, "cutoffOverride.reason", /Say why the cut-off is set aside/],
      [{ cutoffOverride: { confirm: true, reason: " a " } }, "cutoffOverride.reason", /at least 3 characters/],
      [{ cutoffOverride: { confirm: true, reason: "x".repeat(201) } }, "cutoffOverride.reason", /at most 200 characters/],
      [{ cutoffOverride: "yes" }, "cutoffOverride", /./],
    ];
    for (const [body, field, message] of cases) {
      const res = await place(owner, body);
      expect(res.status).toBe(400);
      expect(res.body.error.fields[field]).toMatch(message);
    }
    expect(await t.ds.getRepository(Order).countBy({ accountId, deliveryDate: THU })).toBe(0);
  });

  it("the owner's confirmed override places the order and records who, when and why", async () => {
    const res = await place(owner, { cutoffOverride: override });
    expect(res.status).toBe(201);
    expect(res.body.order).toMatchObject({ deliveryDate: THU, totalCents: 3600, cutoffOverride: { at: "2026-06-10T20:00:00.000Z", reason: "Phoned at 3 pm; the oven has room", byId: ownerId } });
    const row = await t.ds.getRepository(Order).findOneByOrFail({ accountId, deliveryDate: THU });
    expect(row).toMatchObject({ cutoffOverrideById: ownerId, cutoffOverrideReason: "Phoned at 3 pm; the oven has room" });
  });

  it("keeps the other rules: a day without delivery, the minimum and the hold still refuse", async () => {
    const sunday = await place(owner, { deliveryDate: "2026-06-14", cutoffOverride: override });
    expect(sunday.body.error).toMatchObject({ code: "date_not_orderable", reason: "not_delivery_day" });
    await t.ds.getRepository(CustomerAccount).update({ id: accountId }, { minimumOrderCents: 5000 });
    const small = await place(owner, { deliveryDate: FRI, cutoffOverride: override });
    expect(small.status).toBe(422);
    await t.ds.getRepository(CustomerAccount).update({ id: accountId }, { minimumOrderCents: 0, status: "on_hold" });
    const held = await place(owner, { deliveryDate: "2026-06-16", cutoffOverride: override });
    expect(held.body.error.code).toBe("account_on_hold");
    await t.ds.getRepository(CustomerAccount).update({ id: accountId }, { status: "active" });
  });

  it("an override given before the cut-off is not needed and leaves no record", async () => {
    const res = await place(owner, { deliveryDate: FRI, cutoffOverride: override });
    expect(res.status).toBe(201);
    expect(res.body.order.cutoffOverride).toBeNull();
  });
});

describe("changing and cancelling past the cut-off", () => {
  it("changes a locked order only with the owner's override, and cancels it the same way", async () => {
    const order = await t.ds.getRepository(Order).findOneByOrFail({ accountId, deliveryDate: THU });
    const lines = [{ productId: rolls.id, quantity: 5 }];
    const plain = await t.http().patch(`/api/orders/${order.id}`).set(auth(owner)).send({ lines });
    expect(plain.body.error.code).toBe("cutoff_passed");
    expect((await t.http().patch(`/api/orders/${order.id}`).set(auth(bookkeeper)).send({ lines, cutoffOverride: override })).status).toBe(403);
    expect((await t.http().patch(`/api/orders/${order.id}`).set(auth(buyer)).send({ lines, cutoffOverride: override })).status).toBe(403);
    const changed = await t.http().patch(`/api/orders/${order.id}`).set(auth(owner)).send({ lines, cutoffOverride: { confirm: true, reason: "Called back: 5 trays, not 2" } });
    expect(changed.status).toBe(200);
    expect(changed.body.order).toMatchObject({ totalCents: 9000, cutoffOverride: { reason: "Called back: 5 trays, not 2" } });

    expect((await t.http().delete(`/api/orders/${order.id}`).set(auth(owner))).body.error.code).toBe("cutoff_passed");
    expect((await t.http().delete(`/api/orders/${order.id}?overrideReason=Cancelled`).set(auth(bookkeeper))).status).toBe(403);
    expect((await t.http().delete(`/api/orders/${order.id}?overrideReason=x`).set(auth(owner))).status).toBe(400);
    const cancelled = await t.http().delete(`/api/orders/${order.id}?overrideReason=${encodeURIComponent("Café closed for a burst pipe")}`).set(auth(owner));
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.order).toMatchObject({ status: "cancelled", cutoffOverride: { reason: "Café closed for a burst pipe" } });
  });
});
