import http from "node:http";
import type { AddressInfo } from "node:net";
import request from "supertest";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "../../../fakes/stripe/stripe-fake";
import type { DataSource } from "typeorm";
import { buildContext } from "../../../server/context";
import { createApp } from "../../../server/app";
import { FixedClock } from "../../../server/clock";
import { loadConfig } from "../../../server/config";
import { createSmtpMailer } from "../../../server/mail/mailer";
import { createLogger } from "../../../server/logger";
import { startMailFake, type MailFake } from "../../../fakes/mail/mail-fake";
import { createTestDatabase } from "./db";
import { Bakery } from "../../../server/bakery/bakery.entity";
import { CustomerAccount } from "../../../server/accounts/account.entity";
import { User } from "../../../server/users/user.entity";
import { closePasswordHashing, hashPassword } from "../../../server/auth/password-hash";
import type { Role } from "../../../shared/roles";
import type { AppContext } from "../../../server/http/context";
import { processOutbox } from "../../../server/mail/outbox.service";
import { suggestPlural } from "../../../shared/quantity";

export const TEST_PASSWORD = "correct horse battery";

export interface TestApp {
  /** With `stripe: true`: the Stripe fake, its webhooks going to this app listening on a loopback port. */
  stripe?: StripeFake;
  baseUrl?: string;
  ctx: AppContext;
  app: ReturnType<typeof createApp>;
  clock: FixedClock;
  mail: MailFake;
  ds: DataSource;
  http: () => ReturnType<typeof request>;
  close(): Promise<void>;
}

/** A real app on a real throw-away database, a fixed clock, and the real mail fake on free ports. */
export async function startTestApp(opts: { now?: string; stripe?: boolean } = {}): Promise<TestApp> {
  const db = await createTestDatabase();
  const mail = await startMailFake({ smtpPort: 0, httpPort: 0 });
  const config = { ...loadConfig(), publicUrl: "http://panwise.test", logLevel: process.env.TEST_LOG_LEVEL || "silent" };
  const clock = new FixedClock(opts.now ?? "2026-06-10T15:00:00Z");
  const mailer = createSmtpMailer(`smtp://127.0.0.1:${mail.smtpPort}`, "orders@bakery.test", createLogger("silent"));
  let app: ReturnType<typeof createApp> | null = null;
  let server: http.Server | null = null;
  let stripeFake: StripeFake | undefined;
  let stripe: Stripe | undefined;
  let baseUrl: string | undefined;
  if (opts.stripe) {
    server = http.createServer((req, res) => app!(req, res));
    await new Promise<void>((r) => server!.listen(0, "127.0.0.1", () => r()));
    baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    stripeFake = await startStripeFake({ port: 0, webhookUrl: `${baseUrl}/api/webhooks/stripe`, webhookSecret: config.stripe.webhookSecret, webhookRetry: { attempts: 3, baseMs: 20, maxMs: 100 } });
    stripe = new Stripe(config.stripe.secretKey, { host: "127.0.0.1", port: stripeFake.port, protocol: "http", maxNetworkRetries: 0 });
  }
  const ctx = buildContext({ config, dataSource: db.dataSource, clock, mailer, stripe });
  app = createApp(ctx);
  const t: TestApp = {
    stripe: stripeFake,
    baseUrl,
    ctx,
    app,
    clock,
    mail,
    ds: db.dataSource,
    http: () => request(app),
    async close() {
      await stripeFake?.close();
      if (server) await new Promise<void>((r) => { server!.closeAllConnections(); server!.close(() => r()); });
      mailer.close();
      await t.mail.close(); // a test may have swapped in a new mail fake
      if (t.mail !== mail) await mail.close();
      await db.drop();
      await closePasswordHashing();
    },
  };
  return t;
}

let seq = 0;
/** Test fixtures (not the demo): a bakery, and people and accounts made on demand. */
export async function makeBakery(ds: DataSource, over: Partial<Bakery> = {}) {
  const repo = ds.getRepository(Bakery);
  return repo.save(repo.create({ name: "Test Bakery", timeZone: "America/Chicago", currency: "USD", email: "hi@bakery.test", phone: "", address: "1 Test St", ...over }));
}

export async function makeAccount(ds: DataSource, over: Partial<CustomerAccount> = {}) {
  const repo = ds.getRepository(CustomerAccount);
  seq++;
  return repo.save(repo.create({ businessName: `Account ${seq}`, deliveryAddress: `${seq} Test Rd`, contactName: "", contactPhone: "", billingEmail: `billing${seq}@acct.test`, status: "active", notes: "", ...over }));
}

const hashCache = new Map<string, Promise<string>>();
export async function makeUser(ds: DataSource, role: Role, over: Partial<User> = {}) {
  const repo = ds.getRepository(User);
  seq++;
  const password = TEST_PASSWORD;
  if (!hashCache.has(password)) hashCache.set(password, hashPassword(password));
  let accountId = over.accountId ?? null;
  if (role === "buyer" && !accountId) accountId = (await makeAccount(ds)).id;
  return repo.save(repo.create({ email: `${role}${seq}@people.test`, name: `${role} ${seq}`, role, passwordHash: await hashCache.get(password)!, disabled: false, ...over, accountId }));
}

export async function tokenFor(t: TestApp, user: { email: string }): Promise<string> {
  const res = await t.http().post("/api/auth/sign-in").send({ email: user.email, password: TEST_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in failed for ${user.email}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.token;
}

/** Wait for a mail to someone to arrive at the fake (SMTP delivery is asynchronous). */
export async function waitForMail(t: TestApp, to: string, opts: { subject?: RegExp; timeoutMs?: number } | number = {}) {
  const { subject, timeoutMs = 5000 } = typeof opts === "number" ? { timeoutMs: opts } : opts;
  const until = Date.now() + timeoutMs;
  for (;;) {
    await processOutbox(t.ctx);
    const m = [...t.mail.messages].reverse().find((x) => x.to.includes(to) && (!subject || subject.test(x.subject)));
    if (m) return m;
    if (Date.now() > until) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

export function linkToken(text: string): string {
  const m = /[?&]token=([^&\s]+)/.exec(text);
  if (!m) throw new Error("no token link in mail");
  return decodeURIComponent(m[1]);
}

export async function makeProduct(ds: DataSource, over: Partial<import("../../../server/catalog/product.entity").Product> = {}) {
  const { Product } = await import("../../../server/catalog/product.entity");
  const repo = ds.getRepository(Product);
  seq++;
  return repo.save(repo.create({
    name: `Product ${seq}`, description: "", photoFile: null, saleUnit: "tray of 15 rolls", saleUnitPlural: suggestPlural(over.saleUnit ?? "tray of 15 rolls"), piecesPerUnit: 15, pieceGrams: 67,
    panName: "9×13 in pan", panLengthMm: 330, panWidthMm: 229, unitsPerPan: 1, priceCents: 1800, minQuantity: 1, maxQuantity: 40,
    leadDays: null, allergens: "gluten,wheat,milk", mayContain: "", active: true, formulaId: null, sortOrder: seq, ...over,
  }));
}

export const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
