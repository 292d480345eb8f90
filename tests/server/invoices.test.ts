import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, waitForMail, auth, type TestApp } from "./helpers/app";
import { Order } from "../../server/orders/order.entity";
import { OrderLine } from "../../server/orders/order-line.entity";
import { Invoice } from "../../server/billing/invoice.entity";
import { CustomerAccount } from "../../server/accounts/account.entity";
import { applyCreditHolds, issueStatements } from "../../server/billing/invoices.service";
import { allocateNumber } from "../../server/billing/ledger.service";
import { autoDeliver } from "../../server/billing/dispatch.service";
import { createDataSource } from "../../server/db/data-source";
import { loadConfig } from "../../server/config";
import { taxCents, invoiceTotals, agingBucket } from "../../shared/billing";
import { retryOnDeadlock } from "../../server/db/retry";

/** Clock: Wed 10 Jun 2026 10:00 CDT. */
const NOW = "2026-06-10T15:00:00Z";
let t: TestApp;
let owner: string;
let books: string;
let baker: string;
let rolls: { id: number };
beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Invoice Bakery", salesTaxRateBp: 875, invoicePrefix: "HB", creditHoldDays: 14, paymentInstructions: "Bank transfer to Hollowbrook Bakehouse, account 000-111 (demo)." });
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  books = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
  baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  rolls = await makeProduct(t.ds, { name: "Dinner rolls", priceCents: 1800 });
});
afterAll(() => t.close());
beforeEach(() => t.clock.set(NOW));

async function order(accountId: number, date: string, qty: number, status: Order["status"] = "locked") {
  const o = await t.ds.getRepository(Order).save(t.ds.getRepository(Order).create({ accountId, deliveryDate: date, status, totalCents: qty * 1800, source: "one_off", editedByHand: false, createdById: null, poNumber: null, note: null }));
  await t.ds.getRepository(OrderLine).insert({ orderId: o.id, productId: rolls.id, productName: "Dinner rolls", saleUnit: "tray of 15 rolls", quantity: qty, unitPriceCents: 1800, lineTotalCents: qty * 1800 });
  return o;
}

describe("tax and totals (rounding rule: tax once on the subtotal, half up to the cent)", () => {
  it("rounds half up with integer arithmetic", () => {
    expect(taxCents(1000, 875)).toBe(88); // 87.5 → 88
    expect(taxCents(1001, 875)).toBe(88); // 87.5875 → 88
    expect(taxCents(999, 875)).toBe(87); // 87.4125 → 87
    expect(taxCents(5400, 875)).toBe(473); // 472.5 → 473
    expect(invoiceTotals([{ amountCents: 1800 }, { amountCents: 1800 }, { amountCents: 1800 }], 875)).toEqual({ subtotalCents: 5400, taxCents: 473, totalCents: 5873 });
    // Per-line rounding would give 3 × 158 = 474: the rule is stated so the difference is deliberate.
    expect(3 * taxCents(1800, 875)).toBe(474);
  });

  it("ages amounts past due into buckets", () => {
    expect(agingBucket("2026-06-10", "2026-06-10")).toBe("current");
    expect(agingBucket("2026-06-09", "2026-06-10")).toBe("1-30");
    expect(agingBucket("2026-05-11", "2026-06-10")).toBe("1-30");
    expect(agingBucket("2026-05-10", "2026-06-10")).toBe("31-60");
    expect(agingBucket("2026-03-12", "2026-06-10")).toBe("61-90");
    expect(agingBucket("2026-03-11", "2026-06-10")).toBe("90+");
  });
});

describe("dispatch, invoices and statements", () => {
  it("confirming a dispatch delivers the orders; card accounts get an invoice at once, mailed with its PDF; a short delivery becomes a credit note", async () => {
    const acct = await makeAccount(t.ds, { businessName: "Card Café", billingEmail: "pay@cardcafe.test" });
    const o = await order(acct.id, "2026-06-10", 3);
    const res = await t.http().post("/api/deliveries/2026-06-10/confirm").set(auth(baker)).send({ adjustments: [{ orderId: o.id, productId: rolls.id, deliveredQuantity: 2, reason: "one tray dropped" }] });
    expect(res.status).toBe(200);
    expect(res.body.result.delivered).toBe(1);
    expect(res.body.result.invoices).toEqual(["HB-2026-00001"]);
    const inv = await t.ds.getRepository(Invoice).findOneByOrFail({ number: "HB-2026-00001" });
    expect(inv).toMatchObject({ subtotalCents: 5400, taxCents: 473, totalCents: 5873, issueDate: "2026-06-10", dueDate: "2026-06-10", status: "open" });
    // Credit note for the short tray: 1800 + tax 157.5 → 158 = 1958, applied to what is owed.
    const detail = await t.http().get(`/api/invoices/${inv.id}`).set(auth(books));
    expect(detail.body.creditNotes).toEqual([expect.objectContaining({ number: "HB-CN-2026-00001", totalCents: 1958, disposition: "applied" })]);
    expect(detail.body.invoice.amountDueCents).toBe(5873 - 1958);
    expect(detail.body.emails).toEqual([expect.objectContaining({ kind: "invoice", to: "pay@cardcafe.test", status: "pending" })]);
    expect((await t.ds.getRepository(Order).findOneByOrFail({ id: o.id })).status).toBe("delivered");
    const mail = await waitForMail(t, "pay@cardcafe.test");
    expect(mail.subject).toContain("HB-2026-00001");
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0].contentType).toBe("application/pdf");
    expect(mail.attachments[0].content.subarray(0, 5).toString()).toBe("%PDF-");
  });

  it("orders not confirmed by the end of their day are delivered as ordered", async () => {
    const acct = await makeAccount(t.ds);
    const o = await order(acct.id, "2026-06-09", 2);
    expect(await autoDeliver(t.ctx)).toBeGreaterThanOrEqual(1);
    expect((await t.ds.getRepository(Order).findOneByOrFail({ id: o.id })).status).toBe("delivered");
    expect(await t.ds.getRepository(Invoice).countBy({ accountId: acct.id })).toBe(1);
  });

  it("accounts on terms get one weekly statement, due in their net days; a valid exemption certificate removes the tax", async () => {
    const acct = await makeAccount(t.ds, { businessName: "Terms Bistro", paymentTerms: "net14", billingEmail: "books@termsbistro.test" });
    for (const d of ["2026-06-02", "2026-06-04", "2026-06-06"]) await order(acct.id, d, 2, "delivered");
    await order(acct.id, "2026-06-09", 5, "delivered"); // this week: not yet on a statement
    await t.ds.query("INSERT INTO tax_certificate (accountId, file, contentType, status, expiresOn) VALUES (?, 'x.pdf', 'application/pdf', 'approved', '2026-12-31')", [acct.id]);
    const issued = await issueStatements(t.ctx);
    const mine = await t.ds.getRepository(Invoice).findBy({ accountId: acct.id });
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({ kind: "statement", subtotalCents: 6 * 1800, taxCents: 0, taxExempt: true, issueDate: "2026-06-10", dueDate: "2026-06-24", periodStart: "2026-06-02", periodEnd: "2026-06-07" });
    expect(issued.length).toBeGreaterThanOrEqual(1);
    expect((await issueStatements(t.ctx)).filter((i) => i.accountId === acct.id)).toHaveLength(0); // idempotent
    // The e-mail calls it what the screen and the PDF call it (issue 10: screens and documents agree).
    const mail = await waitForMail(t, "books@termsbistro.test");
    expect(mail.subject).toMatch(/^Weekly statement HB-/);
    // An expired certificate stops the exemption.
    await t.ds.query("UPDATE tax_certificate SET expiresOn = '2026-06-01' WHERE accountId = ?", [acct.id]);
    const next = await t.http().post("/api/invoices/statements").set(auth(books)).send({ through: "2026-06-09" });
    expect(next.status).toBe(200);
    const later = (await t.ds.getRepository(Invoice).findBy({ accountId: acct.id })).find((i) => i.id !== mine[0].id)!;
    expect(later).toMatchObject({ taxExempt: false, taxRateBp: 875, subtotalCents: 9000, taxCents: 788 });
  });

  it("overdue invoices put the account on credit hold (orders refused); paying lifts it", async () => {
    const acct = await makeAccount(t.ds, { businessName: "Late Payer", paymentTerms: "net7" });
    const buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: acct.id }));
    await order(acct.id, "2026-05-01", 2, "delivered");
    t.clock.set("2026-05-04T15:00:00Z");
    await issueStatements(t.ctx);
    const inv = await t.ds.getRepository(Invoice).findOneByOrFail({ accountId: acct.id });
    expect(inv.dueDate).toBe("2026-05-11");
    t.clock.set(NOW); // 30 days after due > 14 hold days
    expect((await applyCreditHolds(t.ctx)).held).toBeGreaterThanOrEqual(1);
    expect((await t.ds.getRepository(CustomerAccount).findOneByOrFail({ id: acct.id })).status).toBe("on_hold");
    const refused = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: "2026-06-11", lines: [{ productId: rolls.id, quantity: 1 }] });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("account_on_hold");
    expect(refused.body.error.message).toMatch(/on credit hold: it has overdue invoices/);
    const aging = await t.http().get("/api/reports/aging").set(auth(books));
    expect(aging.body.aging.accounts.find((a: { accountId: number }) => a.accountId === acct.id)).toMatchObject({ "1-30": inv.totalCents, onHold: true, creditHold: true });
    const pay = await t.http().post(`/api/invoices/${inv.id}/payments`).set(auth(books)).send({ amountCents: inv.totalCents, method: "bank_transfer", reference: "BT-7731", receivedOn: "2026-06-10" });
    expect(pay.status).toBe(201);
    expect((await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).status).toBe("paid");
    expect((await t.ds.getRepository(CustomerAccount).findOneByOrFail({ id: acct.id })).status).toBe("active");
    const over = await t.http().post(`/api/invoices/${inv.id}/payments`).set(auth(books)).send({ amountCents: 1, method: "cheque", reference: "CHQ 12", receivedOn: "2026-06-10" });
    expect(over.status).toBe(400);
  });

  it("a buyer sees only their own invoices and PDFs", async () => {
    const a = await makeAccount(t.ds);
    const b = await makeAccount(t.ds);
    await order(a.id, "2026-06-09", 1, "delivered");
    await order(b.id, "2026-06-09", 1, "delivered");
    await t.http().post("/api/invoices/statements").set(auth(books)).send({ through: "2026-06-09" });
    const buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: a.id }));
    const mine = await t.http().get("/api/invoices").set(auth(buyer));
    expect(mine.body.invoices.every((i: { accountId: number }) => i.accountId === a.id)).toBe(true);
    const theirs = await t.ds.getRepository(Invoice).findOneBy({ accountId: b.id });
    if (theirs) {
      expect((await t.http().get(`/api/invoices/${theirs.id}`).set(auth(buyer))).status).toBe(404);
      expect((await t.http().get(`/api/invoices/${theirs.id}/pdf`).set(auth(buyer))).status).toBe(404);
    }
  });
});

describe("issuing statements by hand (issue 8 item 12)", () => {
  it("six at once: one run at a time under a MariaDB named lock, the others 409 already_running, no 500 and no duplicate", async () => {
    const accounts = await Promise.all([1, 2, 3].map((n) => makeAccount(t.ds, { businessName: `Busy Terms ${n}`, paymentTerms: "net7" })));
    for (const a of accounts) for (const d of ["2026-06-01", "2026-06-02", "2026-06-03"]) await order(a.id, d, 2, "delivered");
    const answers = await Promise.all(Array.from({ length: 6 }, () => t.http().post("/api/invoices/statements").set(auth(books)).send({ through: "2026-06-07" })));
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s !== 200 && s !== 409)).toEqual([]);
    expect(statuses.filter((s) => s === 200).length).toBeGreaterThanOrEqual(1);
    for (const r of answers.filter((x) => x.status === 409)) {
      expect(r.body.error).toEqual({ code: "already_running", message: "Statements are already being issued; try again in a minute.", requestId: expect.any(String) });
    }
    // Every account got exactly one statement, whichever request issued it.
    for (const a of accounts) expect(await t.ds.getRepository(Invoice).countBy({ accountId: a.id })).toBe(1);
    const issued = answers.filter((r) => r.status === 200).flatMap((r) => r.body.issued as string[]);
    expect(new Set(issued).size).toBe(issued.length);
  });
});

describe("invoice numbers", () => {
  it("are unique and gapless when two server processes issue 200 at once (two separate connection pools)", async () => {
    const other = createDataSource({ ...loadConfig().db, database: t.ds.options.database as string });
    await other.initialize();
    try {
      const grab = (ds: typeof other) => retryOnDeadlock(() => ds.transaction((m) => allocateNumber(m, "race", 2030)), 10);
      const all = await Promise.all(Array.from({ length: 200 }, (_, i) => grab(i % 2 ? other : t.ds)));
      expect([...all].sort((x, y) => x - y)).toEqual(Array.from({ length: 200 }, (_, i) => i + 1));
      // A rolled-back transaction gives its number back: no gap.
      await t.ds.transaction(async (m) => { await allocateNumber(m, "race", 2030); throw new Error("rollback"); }).catch(() => undefined);
      expect(await grab(t.ds)).toBe(201);
    } finally {
      await other.destroy();
    }
  });
});
