import { createTestDatabase } from "./helpers/db";
import { seedDemo, DEMO_SIGN_INS, DEMO_PASSWORD } from "../../server/seed/demo";
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
afterAll(() => db.drop());

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
