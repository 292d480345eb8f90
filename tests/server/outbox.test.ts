import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { processOutbox, MAX_ATTEMPTS, MARK_SENT_RETRY_MS, enqueueMail } from "../../server/mail/outbox.service";
import { QueryFailedError } from "typeorm";
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
  }, 30_000); // a loaded 2-core machine takes longer than Jest's 5 s default

  it("500 confirmations queued while the mail server is down for a minute all arrive, exactly once", async () => {
    const smtpPort = t.mail.smtpPort;
    await t.mail.close();
    const { enqueueMail } = await import("../../server/mail/outbox.service");
    await t.ds.transaction(async (m) => {
      for (let i = 0; i < 500; i++) await enqueueMail(m, t.ctx, "order_placed", { to: `burst${i}@cafe.test`, fromName: "Test Bakery", subject: `Order placed #${i}`, html: `<p>${i}</p>`, text: String(i) });
    });
    // A minute of the server being down: the worker keeps trying and backing off.
    for (let s = 0; s < 6; s++) {
      await processOutbox(t.ctx, 500);
      t.clock.advance(10_000);
    }
    t.mail = await startMailFake({ smtpPort, httpPort: 0 });
    for (let i = 0; i < 20 && t.mail.messages.filter((m) => m.subject.startsWith("Order placed #")).length < 500; i++) {
      t.clock.advance(5 * 60 * 1000);
      await processOutbox(t.ctx, 500);
    }
    const burst = t.mail.messages.filter((m) => m.subject.startsWith("Order placed #"));
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

  it("the bookkeeper sees invoice and receipt mail only, and may send a failed one again (issue 12, item 4)", async () => {
    const bookkeeper = await tokenFor(t, await makeUser(t.ds, "bookkeeper"));
    const repo = t.ds.getRepository(OutboxMail);
    const base = { fromName: "Test", html: "<p>x</p>", text: "x", status: "failed" as const, attempts: MAX_ATTEMPTS, nextAttemptAt: t.clock.now() };
    const invoice = await repo.save(repo.create({ ...base, messageId: "<inv.kinds@panwise.test>", kind: "invoice", toAddress: "ap@cafe.test", subject: "Invoice HB-1" }));
    const receipt = await repo.save(repo.create({ ...base, messageId: "<rcpt.kinds@panwise.test>", kind: "receipt", toAddress: "ap@cafe.test", subject: "Receipt" }));
    const reset = await repo.save(repo.create({ ...base, messageId: "<reset.kinds@panwise.test>", kind: "password_reset", toAddress: "someone@cafe.test", subject: "Reset" }));
    const seen = (await t.http().get("/api/outbox").set(auth(bookkeeper))).body.mails.map((m: { id: number; kind: string }) => m.kind);
    expect(new Set(seen)).toEqual(new Set(["invoice", "receipt"]));
    const all = (await t.http().get("/api/outbox").set(auth(owner))).body.mails.map((m: { id: number }) => m.id);
    expect(all).toEqual(expect.arrayContaining([invoice.id, receipt.id, reset.id]));
    // A password reset is not the bookkeeper's: as if it did not exist.
    expect((await t.http().post(`/api/outbox/${reset.id}/resend`).set(auth(bookkeeper))).status).toBe(404);
    expect((await repo.findOneByOrFail({ id: reset.id })).status).toBe("failed");
    expect((await t.http().post(`/api/outbox/${invoice.id}/resend`).set(auth(bookkeeper))).status).toBe(202);
    await processOutbox(t.ctx);
    expect((await repo.findOneByOrFail({ id: invoice.id })).status).toBe("sent");
    expect(t.mail.messages.filter((m) => m.subject === "Invoice HB-1")).toHaveLength(1);
  });
});

describe("a database crash right after the mail server accepted a mail", () => {
  // What mysql2 gives TypeORM when MariaDB is gone: a fatal ECONNREFUSED (see tests/reliability/db-unavailable.test.ts).
  const refused = () => new QueryFailedError("UPDATE `mail_outbox` …", [], Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3307"), { code: "ECONNREFUSED", fatal: true }));

  /** Make the outbox's "sent" updates fail while `down()` says the database is away. */
  function failSentUpdates(down: () => boolean) {
    const repo = t.ds.getRepository(OutboxMail);
    const original = repo.update.bind(repo);
    const seen = { refused: 0 };
    const spy = jest.spyOn(repo, "update").mockImplementation(((criteria: unknown, partial: { status?: string }) => {
      if (partial?.status === "sent" && down()) {
        seen.refused++;
        return Promise.reject(refused());
      }
      return original(criteria as never, partial as never);
    }) as typeof repo.update);
    return { seen, restore: () => spy.mockRestore() };
  }

  async function queue(to: string) {
    const row = await t.ds.transaction((m) => enqueueMail(m, t.ctx, "order_placed", { to, fromName: "Test Bakery", subject: `Order placed for ${to}`, html: "<p>x</p>", text: "x" }));
    return row;
  }

  async function deliveredTo(to: string) {
    // SMTP delivery to the fake is asynchronous: give it a moment.
    await new Promise((r) => setTimeout(r, 100));
    return t.mail.messages.filter((m) => m.to.includes(to));
  }

  it("a blip shorter than the retries: recorded as sent at once, sent once", async () => {
    const row = await queue("blip@cafe.test");
    let failures = 2;
    const db = failSentUpdates(() => failures-- > 0);
    try {
      await expect(processOutbox(t.ctx)).resolves.toMatchObject({ sent: 1 });
    } finally {
      db.restore();
    }
    expect(db.seen.refused).toBe(2);
    expect((await t.ds.getRepository(OutboxMail).findOneByOrFail({ id: row.id })).status).toBe("sent");
    t.clock.advance(10 * 60 * 1000);
    await processOutbox(t.ctx);
    const got = await deliveredTo("blip@cafe.test");
    expect(got).toHaveLength(1);
    expect(got[0].messageId).toBe(row.messageId);
  });

  it("an outage longer than the retries: remembered, recorded when the database is back, never sent twice", async () => {
    const row = await queue("outage@cafe.test");
    const later = await queue("later@cafe.test");
    let down = true;
    const db = failSentUpdates(() => down);
    try {
      await processOutbox(t.ctx);
      expect(db.seen.refused).toBe(MARK_SENT_RETRY_MS.length + 1);
      // Accepted by the mail server, but the database still says "sending"; the next mail waits its turn.
      expect((await t.ds.getRepository(OutboxMail).findOneByOrFail({ id: row.id })).status).toBe("sending");
      expect((await t.ds.getRepository(OutboxMail).findOneByOrFail({ id: later.id })).status).toBe("pending");
      down = false;
      // Well past the 5 minutes after which a row left "sending" goes back in the queue.
      t.clock.advance(10 * 60 * 1000);
      await processOutbox(t.ctx);
      t.clock.advance(10 * 60 * 1000);
      await processOutbox(t.ctx);
    } finally {
      db.restore();
    }
    const stored = await t.ds.getRepository(OutboxMail).findOneByOrFail({ id: row.id });
    expect(stored.status).toBe("sent");
    expect(stored.attempts).toBe(1);
    const got = await deliveredTo("outage@cafe.test");
    expect(got).toHaveLength(1);
    expect(got[0].messageId).toBe(row.messageId);
    expect(await deliveredTo("later@cafe.test")).toHaveLength(1);
  }, 30_000);
});
