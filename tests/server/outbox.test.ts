import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { processOutbox, MAX_ATTEMPTS } from "../../server/mail/outbox.service";
import { OutboxMail } from "../../server/mail/outbox.entity";
import { startMailFake } from "../../fakes/mail/mail-fake";

let t: TestApp;
let owner: string;
beforeAll(async () => {
  t = await startTestApp({ now: "2026-06-10T15:00:00Z" });
  await makeBakery(t.ds);
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
});
afterAll(() => t.close());

describe("mail that is never lost", () => {
  it("queues a confirmation in the order's own transaction: a refused order queues nothing", async () => {
    const acct = await makeAccount(t.ds, { minimumOrderCents: 100000 });
    const buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId: acct.id }));
    const p = await makeProduct(t.ds);
    const before = await t.ds.getRepository(OutboxMail).count();
    const refused = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: "2026-06-11", lines: [{ productId: p.id, quantity: 1 }] });
    expect(refused.status).toBe(422);
    expect(await t.ds.getRepository(OutboxMail).count()).toBe(before);
  });

  it("a burst of confirmations with the mail server down arrives exactly once each when it is back", async () => {
    const p = await makeProduct(t.ds);
    const smtpPort = t.mail.smtpPort;
    await t.mail.close();
    const buyers: string[] = [];
    for (let i = 0; i < 20; i++) {
      const acct = await makeAccount(t.ds);
      const u = await makeUser(t.ds, "buyer", { accountId: acct.id });
      buyers.push(u.email);
      const res = await t.http().post("/api/orders").set(auth(await tokenFor(t, u))).send({ deliveryDate: "2026-06-12", lines: [{ productId: p.id, quantity: 1 }] });
      expect(res.status).toBe(201);
    }
    await processOutbox(t.ctx);
    await processOutbox(t.ctx);
    t.mail = await startMailFake({ smtpPort, httpPort: 0 });
    for (let i = 0; i < 5; i++) {
      t.clock.advance(10 * 60 * 1000);
      await processOutbox(t.ctx);
    }
    for (const b of buyers) expect(t.mail.messages.filter((m) => m.to.includes(b))).toHaveLength(1);
    const ids = t.mail.messages.map((m) => m.messageId);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it("500 confirmations queued while the mail server is down for a minute all arrive, exactly once", async () => {
    const smtpPort = t.mail.smtpPort;
    await t.mail.close();
    const { enqueueMail } = await import("../../server/mail/outbox.service");
    await t.ds.transaction(async (m) => {
      for (let i = 0; i < 500; i++) await enqueueMail(m, t.ctx, "order_placed", { to: `burst${i}@cafe.test`, fromName: "Test Bakery", subject: `Order received #${i}`, html: `<p>${i}</p>`, text: String(i) });
    });
    // A minute of the server being down: the worker keeps trying and backing off.
    for (let s = 0; s < 6; s++) {
      await processOutbox(t.ctx, 500);
      t.clock.advance(10_000);
    }
    t.mail = await startMailFake({ smtpPort, httpPort: 0 });
    for (let i = 0; i < 20 && t.mail.messages.filter((m) => m.subject.startsWith("Order received #")).length < 500; i++) {
      t.clock.advance(5 * 60 * 1000);
      await processOutbox(t.ctx, 500);
    }
    const burst = t.mail.messages.filter((m) => m.subject.startsWith("Order received #"));
    expect(burst).toHaveLength(500);
    expect(new Set(burst.map((m) => m.to[0])).size).toBe(500);
    expect(await t.ds.getRepository(OutboxMail).countBy({ kind: "order_placed", status: "sent" })).toBeGreaterThanOrEqual(500);
  }, 60_000);

  it("gives up after the last attempt; the owner sees it failed and sends it again", async () => {
    const repo = t.ds.getRepository(OutboxMail);
    const row = await repo.save(repo.create({ messageId: "<stuck.1@panwise.test>", kind: "test", toAddress: "stuck@place.test", fromName: "Test", subject: "Stuck", html: "<p>x</p>", text: "x", status: "pending", attempts: MAX_ATTEMPTS - 1, nextAttemptAt: t.clock.now() }));
    const smtpPort = t.mail.smtpPort;
    await t.mail.close();
    await processOutbox(t.ctx);
    expect((await repo.findOneByOrFail({ id: row.id })).status).toBe("failed");
    const list = await t.http().get("/api/outbox?status=failed").set(auth(owner));
    expect(list.body.mails.map((m: { id: number }) => m.id)).toContain(row.id);
    t.mail = await startMailFake({ smtpPort, httpPort: 0 });
    expect((await t.http().post(`/api/outbox/${row.id}/resend`).set(auth(owner))).status).toBe(202);
    await processOutbox(t.ctx);
    expect((await repo.findOneByOrFail({ id: row.id })).status).toBe("sent");
    expect(t.mail.messages.filter((m) => m.to.includes("stuck@place.test"))).toHaveLength(1);
    const again = await t.http().post(`/api/outbox/${row.id}/resend`).set(auth(owner));
    expect(again.status).toBe(409);
  });
});
