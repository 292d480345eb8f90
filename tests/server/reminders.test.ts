import { startTestApp, makeAccount, makeBakery, makeUser, tokenFor, auth, waitForMail, type TestApp } from "./helpers/app";
import { Invoice } from "../../server/billing/invoice.entity";
import { InvoiceReminder } from "../../server/billing/invoice-reminder.entity";
import { OutboxMail } from "../../server/mail/outbox.entity";
import { runReminderSchedule } from "../../server/billing/reminders.service";

/**
 * Issue 12, "the bookkeeper chases payment": a reminder per invoice by hand, "remind all overdue", and the
 * schedule the owner or bookkeeper turns on. Clock: Mon 7 Dec 2026 12:00 CST (18:00Z).
 */
const NOW = "2026-12-07T18:00:00Z";
let t: TestApp;
let owner: string;
let bookkeeper: string;
let baker: string;
let buyer: string;
let billingEmail: string;
let accountId: number;
let seq = 0;

async function makeInvoice(over: Partial<Invoice> = {}): Promise<Invoice> {
  seq++;
  const repo = t.ds.getRepository(Invoice);
  return repo.save(repo.create({
    number: `RM-2026-${String(seq).padStart(5, "0")}`, year: 2026, seq, accountId, kind: "order", status: "open", issueDate: "2026-11-20", dueDate: "2026-11-27",
    periodStart: null, periodEnd: null, currency: "USD", subtotalCents: 5000, taxRateBp: 0, taxCents: 0, totalCents: 5000, sentAt: null, ...over,
  }));
}

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Reminder Bakery" });
  const a = await makeAccount(t.ds, { businessName: "Slow Payer Deli", billingEmail: "accounts@slowpayer.test" });
  accountId = a.id;
  billingEmail = a.billingEmail;
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  bookkeeper = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
  baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId }));
});
afterAll(() => t.close());
beforeEach(() => t.clock.set(NOW));

describe("a reminder by hand", () => {
  it("the owner and the bookkeeper may send one; the buyer and the baker may not", async () => {
    const inv = await makeInvoice();
    for (const token of [buyer, baker]) expect((await t.http().post(`/api/invoices/${inv.id}/reminders`).set(auth(token))).status).toBe(403);
    const res = await t.http().post(`/api/invoices/${inv.id}/reminders`).set(auth(bookkeeper));
    expect(res.status).toBe(201);
    expect(res.body.reminder).toMatchObject({ invoiceId: inv.id, stage: "manual" });
    expect((await t.http().post(`/api/invoices/${inv.id}/reminders`).set(auth(owner))).status).toBe(201);
    // The e-mail goes through the outbox to the billing address, and the invoice lists both reminders.
    const mail = await waitForMail(t, billingEmail, { subject: new RegExp(`Payment reminder: invoice ${inv.number}`) });
    expect(mail.text).toContain(`Invoice ${inv.number} was due on November 27, 2026, and $50.00 of it is still unpaid.`);
    expect(mail.text).toContain("If you have paid it already, thank you, and please ignore this reminder.");
    const detail = await t.http().get(`/api/invoices/${inv.id}`).set(auth(bookkeeper));
    expect(detail.body.reminders.map((r: { stage: string }) => r.stage)).toEqual(["manual", "manual"]);
    expect(detail.body.emails.filter((e: { kind: string }) => e.kind === "reminder")).toHaveLength(2);
  });

  it("bad input and nothing to remind about: 400, 404 and 409", async () => {
    expect((await t.http().post("/api/invoices/abc/reminders").set(auth(owner))).status).toBe(400);
    expect((await t.http().post("/api/invoices/999999/reminders").set(auth(owner))).status).toBe(404);
    const paid = await makeInvoice({ status: "paid", paidCents: 5000 });
    const res = await t.http().post(`/api/invoices/${paid.id}/reminders`).set(auth(owner));
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "nothing_due", message: `${paid.number} has nothing left to pay, so there is nothing to remind about.` });
    expect(await t.ds.getRepository(InvoiceReminder).countBy({ invoiceId: paid.id })).toBe(0);
  });
});

describe("remind all overdue", () => {
  it("reminds each overdue invoice once a day, leaving out ones not due yet and ones reminded today", async () => {
    await t.ds.query("UPDATE invoice SET status = 'void' WHERE accountId = ?", [accountId]);
    const late = await makeInvoice({ dueDate: "2026-12-01" });
    const notYet = await makeInvoice({ dueDate: "2026-12-10" });
    for (const token of [buyer, baker]) expect((await t.http().post("/api/invoices/reminders").set(auth(token))).status).toBe(403);
    const first = await t.http().post("/api/invoices/reminders").set(auth(bookkeeper));
    expect(first.status).toBe(200);
    expect(first.body).toEqual({ sent: [late.number], skipped: [] });
    const again = await t.http().post("/api/invoices/reminders").set(auth(owner));
    expect(again.body).toEqual({ sent: [], skipped: [late.number] });
    expect(await t.ds.getRepository(InvoiceReminder).countBy({ invoiceId: notYet.id })).toBe(0);
    t.clock.set("2026-12-08T18:00:00Z");
    const nextDay = await tokenFor(t, await makeUser(t.ds, "bookkeeper")); // a session from the next day
    expect((await t.http().post("/api/invoices/reminders").set(auth(nextDay))).body.sent).toEqual([late.number]);
  });
});

describe("a double press", () => {
  it("two 'remind all overdue' at once send each invoice's reminder once (checked under the invoice's row lock)", async () => {
    await t.ds.query("UPDATE invoice SET status = 'void' WHERE accountId = ?", [accountId]);
    const late = await makeInvoice({ dueDate: "2026-12-02" });
    const [a, b] = await Promise.all([t.http().post("/api/invoices/reminders").set(auth(bookkeeper)), t.http().post("/api/invoices/reminders").set(auth(owner))]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect([...a.body.sent, ...b.body.sent]).toEqual([late.number]);
    expect([...a.body.skipped, ...b.body.skipped]).toEqual([late.number]);
    expect(await t.ds.getRepository(InvoiceReminder).countBy({ invoiceId: late.id })).toBe(1);
  });
});

describe("the reminder schedule", () => {
  it("is turned on by the owner or the bookkeeper, not the buyer or the baker; bad input is refused", async () => {
    for (const token of [buyer, baker]) expect((await t.http().put("/api/settings/billing/reminders").set(auth(token)).send({ on: true })).status).toBe(403);
    for (const body of [{ on: "yes" }, {}, { on: 1 }]) {
      const bad = await t.http().put("/api/settings/billing/reminders").set(auth(bookkeeper)).send(body);
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields.on).toBe("Say on (true) or off (false).");
    }
    const on = await t.http().put("/api/settings/billing/reminders").set(auth(bookkeeper)).send({ on: true });
    expect(on.status).toBe(200);
    expect(on.body.settings.remindersOn).toBe(true);
    expect((await t.http().get("/api/settings/billing").set(auth(buyer))).body.settings.remindersOn).toBe(true);
    expect((await t.http().put("/api/settings/billing/reminders").set(auth(owner)).send({ on: false })).body.settings.remindersOn).toBe(false);
  });

  it("sends each stage once, on its day: 3 days before, on the due date, 7 days after; nothing when off", async () => {
    await t.ds.query("UPDATE invoice SET status = 'void' WHERE accountId = ?", [accountId]);
    const inv = await makeInvoice({ issueDate: "2026-12-07", dueDate: "2026-12-14" });
    const stages = async () => (await t.ds.getRepository(InvoiceReminder).find({ where: { invoiceId: inv.id }, order: { id: "ASC" } })).map((r) => r.stage);
    t.clock.set("2026-12-11T18:00:00Z"); // Fri 11 Dec: 3 days before
    expect(await runReminderSchedule(t.ctx)).toBe(0); // off
    t.clock.set(NOW); // the owner's session is from NOW
    expect((await t.http().put("/api/settings/billing/reminders").set(auth(owner)).send({ on: true })).body.settings.remindersOn).toBe(true);
    t.clock.set("2026-12-10T18:00:00Z");
    expect(await runReminderSchedule(t.ctx)).toBe(0); // 4 days before: nothing yet
    t.clock.set("2026-12-11T18:00:00Z");
    expect(await runReminderSchedule(t.ctx)).toBe(1);
    expect(await runReminderSchedule(t.ctx)).toBe(0); // the same stage never twice
    t.clock.set("2026-12-14T18:00:00Z");
    await runReminderSchedule(t.ctx);
    t.clock.set("2026-12-18T18:00:00Z"); // 4 days overdue: the 7-day stage has not come
    expect(await runReminderSchedule(t.ctx)).toBe(0);
    t.clock.set("2026-12-21T18:00:00Z");
    await runReminderSchedule(t.ctx);
    t.clock.set("2026-12-28T18:00:00Z");
    expect(await runReminderSchedule(t.ctx)).toBe(0); // after the last stage: nothing more
    expect(await stages()).toEqual(["before_due", "on_due", "after_due"]);
    const queued = await t.ds.getRepository(OutboxMail).countBy({ kind: "reminder", toAddress: billingEmail });
    expect(queued).toBeGreaterThanOrEqual(3);
    t.clock.set(NOW);
    await t.http().put("/api/settings/billing/reminders").set(auth(owner)).send({ on: false });
  });
});
