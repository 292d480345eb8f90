import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { Invoice } from "../../server/billing/invoice.entity";
import { OutboxMail } from "../../server/mail/outbox.entity";

/**
 * Issue 12: the office overview's figures, worked by hand from the rows made here.
 * Clock: Mon 7 Dec 2026 09:00 CST; Tue 8 Dec's cut-off is Mon 14:00 CST (still ahead); deliveries Tue–Sat.
 */
const NOW = "2026-12-07T15:00:00Z";
let t: TestApp;
let owner: string;
let bookkeeper: string;

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Overview Bakery" });
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  bookkeeper = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
  const a = await makeAccount(t.ds, { businessName: "Figures Café" });
  const b = await makeAccount(t.ds, { businessName: "Second Café" });
  const rolls = await makeProduct(t.ds, { name: "Rolls", priceCents: 1800 });
  const buyerA = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: a.id }));
  const buyerB = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: b.id }));
  // Tomorrow (Tue 8 Dec): 3 + 2 trays on two orders, $90.00; a canceled one does not count.
  expect((await t.http().post("/api/orders").set(auth(buyerA)).send({ deliveryDate: "2026-12-08", lines: [{ productId: rolls.id, quantity: 3 }] })).status).toBe(201);
  expect((await t.http().post("/api/orders").set(auth(buyerB)).send({ deliveryDate: "2026-12-08", lines: [{ productId: rolls.id, quantity: 2 }] })).status).toBe(201);
  const c = await t.http().post("/api/orders").set(auth(buyerA)).send({ deliveryDate: "2026-12-09", lines: [{ productId: rolls.id, quantity: 4 }] });
  await t.http().delete(`/api/orders/${c.body.order.id}`).set(auth(buyerA));
  // Money: $50.00 overdue (due 1 Dec), $30.00 not yet due, one paid.
  const repo = t.ds.getRepository(Invoice);
  const inv = (n: number, over: Partial<Invoice>) => repo.save(repo.create({ number: `OV-2026-0000${n}`, year: 2026, seq: n, accountId: a.id, kind: "order", status: "open", issueDate: "2026-11-24", dueDate: "2026-12-01", periodStart: null, periodEnd: null, currency: "USD", subtotalCents: 5000, taxRateBp: 0, taxCents: 0, totalCents: 5000, sentAt: null, ...over }));
  await inv(1, {});
  await inv(2, { dueDate: "2026-12-14", subtotalCents: 3000, totalCents: 3000 });
  await inv(3, { status: "paid", paidCents: 5000 });
  // Mail: one invoice mail and one invitation the outbox gave up on.
  const mail = t.ds.getRepository(OutboxMail);
  for (const kind of ["invoice", "invitation"]) await mail.save(mail.create({ messageId: `<${kind}@t>`, kind, toAddress: "x@test.test", fromName: "B", subject: kind, html: "", text: "", status: "failed", attempts: 12, nextAttemptAt: new Date() }));
});
afterAll(() => t.close());

describe("office overview figures", () => {
  it("counts today's and tomorrow's orders, units and value; owed and overdue; the next cut-off; failed mail by role", async () => {
    const res = await t.http().get("/api/office/summary").set(auth(owner));
    expect(res.status).toBe(200);
    expect(res.body.summary.overview).toEqual({
      currency: "USD",
      days: [{ date: "2026-12-07", orders: 0, units: 0, totalCents: 0 }, { date: "2026-12-08", orders: 2, units: 5, totalCents: 9000 }],
      owedCents: 8000, overdueCents: 5000, overdueInvoices: 1,
      nextCutoff: { date: "2026-12-08", at: "2026-12-07T14:00:00.000-06:00" },
      failedMail: 2,
    });
    // The bookkeeper sees invoice and receipt mail in the outbox, not invitations: one failed.
    expect((await t.http().get("/api/office/summary").set(auth(bookkeeper))).body.summary.overview.failedMail).toBe(1);
    // After Monday's cut-off the next one is Tuesday's, for Wednesday.
    t.clock.set("2026-12-07T21:00:00Z");
    const later = await tokenFor(t, await makeUser(t.ds, "owner"));
    expect((await t.http().get("/api/office/summary").set(auth(later))).body.summary.overview.nextCutoff).toEqual({ date: "2026-12-09", at: "2026-12-08T14:00:00.000-06:00" });
  });
});
