import { createTestDatabase } from "./helpers/db";
import { seedDemo, DEMO_SIGN_INS, DEMO_PASSWORD, DEMO_CLOSURES, DEMO_PAYMENT_INSTRUCTIONS } from "../../server/seed/demo";
import { BakeryClosure } from "../../server/calendar/closure.entity";
import { User } from "../../server/users/user.entity";
import { CustomerAccount } from "../../server/accounts/account.entity";
import { Bakery } from "../../server/bakery/bakery.entity";
import { runLocked } from "../../server/jobs/scheduler";
import { buildContext } from "../../server/context";
import { verifyPassword } from "../../server/auth/password-hash";

let db: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => {
  db = await createTestDatabase();
});
afterAll(() => db?.drop());

it("the migrations match the entities exactly (no drift)", async () => {
  // The same comparison `typeorm migration:generate` makes: after every migration has run,
  // the schema builder must find nothing left to change.
  const sql = await db.dataSource.driver.createSchemaBuilder().log();
  expect(sql.upQueries.map((q) => q.query)).toEqual([]);
});

it("seeds the demo scenario idempotently", async () => {
  const first = await seedDemo(db.dataSource);
  expect(first.created).toBeGreaterThan(0);
  const second = await seedDemo(db.dataSource);
  expect(second.created).toBe(0);
  expect(await db.dataSource.getRepository(Bakery).count()).toBe(1);
  const bakery = await db.dataSource.getRepository(Bakery).findOneByOrFail({});
  expect(bakery).toMatchObject({ name: "Hollowbrook Bakehouse", timeZone: "America/Chicago", currency: "USD" });
  const accounts = await db.dataSource.getRepository(CustomerAccount).find({ order: { businessName: "ASC" } });
  expect(accounts.map((a) => a.businessName)).toEqual(["Juniper Table", "North Pier Coffee", "Tidewater Café"]);
  for (const s of DEMO_SIGN_INS) {
    const u = await db.dataSource.getRepository(User).findOneByOrFail({ email: s.email });
    expect(u.role).toBe(s.role);
    expect(await verifyPassword(DEMO_PASSWORD, u.passwordHash)).toBe(true);
    if (s.role === "buyer") expect(u.accountId).not.toBeNull();
  }
});

it("demo data cannot be taken for real: ZIP 00000, an invented bank, US holidays; older demo data is brought up to date", async () => {
  await seedDemo(db.dataSource);
  const bakeries = db.dataSource.getRepository(Bakery);
  const accounts = db.dataSource.getRepository(CustomerAccount);
  const closures = db.dataSource.getRepository(BakeryClosure);
  // ZIP 00000 belongs to no place (from memory: the lowest ZIP Code the USPS has issued is 00501).
  const addresses = [(await bakeries.findOneByOrFail({})).address, ...(await accounts.find()).map((a) => a.deliveryAddress)];
  for (const address of addresses) expect(address).toMatch(/, IL 00000\b/);
  // US federal holidays (5 U.S.C. § 6103); Boxing Day is not one.
  expect((await closures.find({ order: { date: "ASC" } })).map((c) => `${c.date} ${c.note}`)).toEqual(expect.arrayContaining(DEMO_CLOSURES.map((c) => `${c.date} ${c.note}`)));
  expect(await closures.existsBy({ note: "Boxing Day" })).toBe(false);
  expect(DEMO_PAYMENT_INSTRUCTIONS).toMatch(/Hollowbrook Test Savings \(demo, not a real bank\)/);
  expect(DEMO_PAYMENT_INSTRUCTIONS).not.toMatch(/cheque/);

  // A demo database seeded with the earlier values.
  const bakery = await bakeries.findOneByOrFail({});
  await bakeries.update({ id: bakery.id }, { address: "418 Millrace Lane, Hollowbrook, IL 60000", paymentInstructions: "Bank transfer to Hollowbrook Bakehouse, Prairie Mutual Bank, routing 000000000" });
  const tidewater = await accounts.findOneByOrFail({ businessName: "Tidewater Café" });
  await accounts.update({ id: tidewater.id }, { deliveryAddress: "12 Harbor Row, Hollowbrook, IL 60001 — back door on the alley, before 7:00" });
  await closures.insert({ date: "2026-12-26", note: "Boxing Day" });
  expect((await seedDemo(db.dataSource)).created).toBeGreaterThan(0);
  expect(await bakeries.findOneByOrFail({})).toMatchObject({ address: "418 Millrace Lane, Hollowbrook, IL 00000", paymentInstructions: DEMO_PAYMENT_INSTRUCTIONS });
  expect((await accounts.findOneByOrFail({ id: tidewater.id })).deliveryAddress).toBe("12 Harbor Row, Hollowbrook, IL 00000 — back door on the alley, before 7:00");
  expect(await closures.existsBy({ note: "Boxing Day" })).toBe(false);
  expect((await seedDemo(db.dataSource)).created).toBe(0);
});

it("a scheduled job runs under a MariaDB named lock: a second runner skips while the first holds it", async () => {
  const ctx = buildContext({ dataSource: db.dataSource });
  let release!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  let runs = 0;
  const job = { name: `test-${Date.now()}`, everyMs: 1000, run: async () => { runs++; await gate; } };
  const first = runLocked(ctx, job);
  await new Promise((r) => setTimeout(r, 200));
  const second = await runLocked(ctx, job);
  expect(second).toBe(false);
  release();
  expect(await first).toBe(true);
  expect(runs).toBe(1);
  ctx.mailer.close();
});
