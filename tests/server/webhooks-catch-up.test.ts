import http from "node:http";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import fs from "node:fs";
import { spawn, type ChildProcess } from "node:child_process";
import Stripe from "stripe";
import { startCardBilling, payOnHostedPage, type CardBilling } from "./helpers/card-billing";
import { makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { startStripeFake, type StripeFake } from "../../fakes/stripe/stripe-fake";
import { CheckoutSessionRecord } from "../../server/billing/checkout-session.entity";
import { Invoice } from "../../server/billing/invoice.entity";
import { Payment } from "../../server/billing/payment.entity";
import { Refund } from "../../server/billing/refund.entity";
import { catchUpEvents, catchUpSessions } from "../../server/jobs/stripe-catch-up";
import { startScheduler } from "../../server/jobs/scheduler";
import { jobs } from "../../server/jobs";

/**
 * Faults: webhooks can be lost (the Stripe fake killed after a payment, before delivering them). Stripe's
 * docs recommend listing events to recover missed ones ("Events" API: list events, `created` filter, kept
 * for 30 days) and retrieving objects rather than relying on delivery. The catch-up job does both, through
 * the webhook's own code path.
 */
const ROOT = path.resolve(__dirname, "../..");
let t: TestApp;
let buyer: string;
let accountId: number;
let rolls: { id: number };
let cb: CardBilling;
beforeAll(async () => {
  cb = await startCardBilling({ bakery: "Heal Bakery", invoicePrefix: "HL", stripe: false });
  ({ t, buyer, accountId, rolls } = cb);
});
afterAll(() => t.close());

const invoiceFor = (qty: number) => cb.invoiceFor(qty);

const stripeFor = (port: number) => new Stripe("sk_test_catch_up", { host: "127.0.0.1", port, protocol: "http", maxNetworkRetries: 0 });

describe("catch-up with webhooks dropped (in-process fake that sends none)", () => {
  let fake: StripeFake;
  beforeAll(async () => {
    fake = await startStripeFake({ port: 0 }); // no webhook endpoint: every event is "lost"
    t.ctx.stripe = stripeFor(fake.port);
  });
  afterAll(() => fake.close());

  it("listing events since the last one applies a missed payment and a refund made in Stripe's dashboard, once", async () => {
    const inv = await invoiceFor(2);
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    expect((await payOnHostedPage(body.url)).status).toBe(303);
    expect((await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).status).toBe("open");

    const first = await catchUpEvents(t.ctx);
    expect(first.applied).toBeGreaterThanOrEqual(1);
    expect(await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).toMatchObject({ status: "paid", paidCents: inv.totalCents });
    const [rows] = await t.ds.query("SELECT COUNT(*) AS n FROM stripe_event WHERE source = 'catch-up'");
    expect(Number(rows.n)).toBeGreaterThanOrEqual(1);

    const payment = await t.ds.getRepository(Payment).findOneByOrFail({ invoiceId: inv.id });
    await t.ctx.stripe.refunds.create({ charge: payment.stripeChargeId!, amount: 500 });
    await catchUpEvents(t.ctx);
    expect(await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).toMatchObject({ refundedCents: 500 });

    const again = await catchUpEvents(t.ctx);
    expect(again.applied).toBe(0);
    expect(await t.ds.getRepository(Payment).countBy({ invoiceId: inv.id })).toBe(1);
    expect(await t.ds.getRepository(Refund).countBy({ invoiceId: inv.id })).toBe(1);
  });

  it("checking open checkout sessions finds a paid one, and expires one whose amount is no longer owed", async () => {
    const paid = await invoiceFor(3);
    const a = await t.http().post(`/api/invoices/${paid.id}/checkout`).set(auth(buyer));
    await payOnHostedPage(a.body.url);
    const stale = await invoiceFor(4);
    const b = await t.http().post(`/api/invoices/${stale.id}/checkout`).set(auth(buyer));
    // Settled by transfer while Stripe was unreachable: the page could not be expired then.
    const real = t.ctx.stripe;
    t.ctx.stripe = stripeFor(9);
    await t.http().post(`/api/invoices/${stale.id}/payments`).set(auth(await tokenFor(t, await makeUser(t.ds, "bookkeeper")))).send({ amountCents: stale.totalCents, method: "bank_transfer", reference: "BT-9", receivedOn: "2026-06-10" });
    t.ctx.stripe = real;
    const staleId = /\/pay\/(cs_test_\w+)/.exec(b.body.url)![1];
    expect(fake.state.checkoutSessions[staleId].status).toBe("open");

    const result = await catchUpSessions(t.ctx, 0);
    expect(result).toMatchObject({ applied: 1, expired: 1 });
    expect(await t.ds.getRepository(Invoice).findOneByOrFail({ id: paid.id })).toMatchObject({ status: "paid", paidCents: paid.totalCents });
    expect(fake.state.checkoutSessions[staleId].status).toBe("expired");
    expect((await t.ds.getRepository(CheckoutSessionRecord).findOneByOrFail({ id: staleId })).status).toBe("expired");
    // Young sessions are left to their webhooks.
    const young = await invoiceFor(5);
    await t.http().post(`/api/invoices/${young.id}/checkout`).set(auth(buyer));
    expect((await catchUpSessions(t.ctx, 60 * 60 * 1000)).checked).toBe(0);
  });
});

describe("reliability: the Stripe fake (a child process) killed right after a payment, before its webhooks", () => {
  const stateFile = path.join(os.tmpdir(), `stripe-catch-up-${process.pid}-${Date.now()}.json`);
  const secret = "whsec_catch_up_test";
  let port: number;
  let child: ChildProcess | null = null;
  const held: http.ServerResponse[] = [];
  let hits = 0;
  // The webhook endpoint the fake posts to: it takes each delivery and never answers, so none completes.
  const blackHole = http.createServer((_req, res) => { hits++; held.push(res); });
  let stopScheduler: (() => Promise<void>) | null = null;

  const freePort = () => new Promise<number>((resolve) => { const s = net.createServer(); s.listen(0, "127.0.0.1", () => { const p = (s.address() as net.AddressInfo).port; s.close(() => resolve(p)); }); });
  async function startFake() {
    child = spawn(process.execPath, ["--import", "tsx", "fakes/stripe/main.ts"], {
      cwd: ROOT,
      env: { ...process.env, STRIPE_FAKE_PORT: String(port), STRIPE_FAKE_STATE: stateFile, STRIPE_WEBHOOK_URL: `http://127.0.0.1:${(blackHole.address() as net.AddressInfo).port}/hook`, STRIPE_WEBHOOK_SECRET: secret },
      stdio: "ignore",
    });
    for (let i = 0; i < 300; i++) {
      if (await fetch(`http://127.0.0.1:${port}/_fake/webhooks`).then((r) => r.ok, () => false)) return;
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error("the Stripe fake did not start");
  }
  beforeAll(async () => {
    await new Promise<void>((r) => blackHole.listen(0, "127.0.0.1", () => r()));
    port = await freePort();
    await startFake();
    t.ctx.stripe = stripeFor(port);
  }, 30000);
  afterAll(async () => {
    await stopScheduler?.();
    child?.kill("SIGKILL");
    for (const res of held) res.destroy();
    blackHole.closeAllConnections();
    await new Promise((r) => blackHole.close(r));
    fs.rmSync(stateFile, { force: true });
  });

  it("the invoice is paid within one catch-up interval after the fake is back, and the fake kept its state", async () => {
    const inv = await invoiceFor(6);
    const { body } = await t.http().post(`/api/invoices/${inv.id}/checkout`).set(auth(buyer));
    expect((await payOnHostedPage(body.url)).status).toBe(303);
    // The first webhook is on its way (held by the endpoint): kill the fake now, before any is delivered.
    for (let i = 0; hits === 0 && i < 200; i++) await new Promise((r) => setTimeout(r, 10));
    expect(hits).toBeGreaterThan(0);
    child!.kill("SIGKILL");
    await new Promise((r) => child!.once("exit", r));
    expect((await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).status).toBe("open");

    // The server's catch-up job runs on its schedule (a short interval here) while the fake is down: it fails quietly.
    const INTERVAL = 1000;
    t.ctx.config.stripe.catchUpEveryMs = INTERVAL;
    const scheduler = startScheduler(t.ctx, jobs.filter((j) => j.name === "stripe-catch-up"));
    stopScheduler = () => scheduler.stop();
    await new Promise((r) => setTimeout(r, 1.5 * INTERVAL));
    expect((await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).status).toBe("open");

    await startFake();
    const back = Date.now();
    let paidAfter = -1;
    while (Date.now() - back < 3 * INTERVAL) {
      if ((await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).status === "paid") { paidAfter = Date.now() - back; break; }
      await new Promise((r) => setTimeout(r, 25));
    }
    // One interval, plus the time one run takes.
    expect(paidAfter).toBeGreaterThanOrEqual(0);
    expect(paidAfter).toBeLessThan(INTERVAL + 1000);
    expect(await t.ds.getRepository(Invoice).findOneByOrFail({ id: inv.id })).toMatchObject({ paidCents: inv.totalCents });
    expect(await t.ds.getRepository(Payment).countBy({ invoiceId: inv.id })).toBe(1);
    // STRIPE_FAKE_STATE kept the payment across the kill.
    const session = await t.ctx.stripe.checkout.sessions.retrieve(/\/pay\/(cs_test_\w+)/.exec(body.url)![1]);
    expect(session).toMatchObject({ status: "complete", payment_status: "paid" });
  }, 30000);
});
