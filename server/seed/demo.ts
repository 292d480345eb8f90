import type { DataSource } from "typeorm";
import { Bakery } from "../bakery/bakery.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { hashPassword } from "../auth/auth.service";
import type { Role } from "../../shared/roles";

/** The invented demo scenario: the Hollowbrook Bakehouse and three wholesale customers. */
export const DEMO_PASSWORD = "panwise-demo";

export const DEMO_BAKERY = {
  name: "Hollowbrook Bakehouse",
  timeZone: "America/Chicago",
  currency: "USD",
  email: "hello@hollowbrook.test",
  phone: "+1 (555) 014-2290",
  address: "418 Millrace Lane, Hollowbrook, IL 60000",
};

export const DEMO_ACCOUNTS = [
  {
    businessName: "Tidewater Café",
    deliveryAddress: "12 Harbor Row, Hollowbrook, IL 60001 — back door on the alley, before 7:00",
    contactName: "Marisol Okafor",
    contactPhone: "+1 (555) 013-4410",
    billingEmail: "accounts@tidewater.test",
    notes: "Breakfast trade; wants rolls warm for the 7:00 opening.",
    buyer: { email: "buyer@tidewater.test", name: "Marisol Okafor" },
  },
  {
    businessName: "Juniper Table",
    deliveryAddress: "77 Orchard Street, Hollowbrook, IL 60002 — kitchen entrance",
    contactName: "Declan Reyes",
    contactPhone: "+1 (555) 013-8821",
    billingEmail: "office@junipertable.test",
    notes: "Dinner service; bread basket with every table.",
    buyer: { email: "buyer@junipertable.test", name: "Declan Reyes" },
  },
  {
    businessName: "North Pier Coffee",
    deliveryAddress: "3 Pier Road, Hollowbrook, IL 60003",
    contactName: "Ingrid Halvorsen",
    contactPhone: "+1 (555) 013-2057",
    billingEmail: "ingrid@northpier.test",
    notes: "Small orders, mostly buns at the weekend.",
    buyer: { email: "buyer@northpier.test", name: "Ingrid Halvorsen" },
  },
];

export const DEMO_STAFF: { email: string; name: string; role: Role }[] = [
  { email: "owner@hollowbrook.test", name: "Rosalind Hart", role: "owner" },
  { email: "baker@hollowbrook.test", name: "Tomas Lindqvist", role: "baker" },
  { email: "books@hollowbrook.test", name: "Priya Natarajan", role: "bookkeeper" },
];

export const DEMO_SIGN_INS = [
  ...DEMO_STAFF.map((s) => ({ email: s.email, role: s.role as Role })),
  ...DEMO_ACCOUNTS.map((a) => ({ email: a.buyer.email, role: "buyer" as Role, account: a.businessName })),
];

/** Idempotent: running it again changes nothing that is already there. */
export async function seedDemo(ds: DataSource): Promise<{ created: number }> {
  let created = 0;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await ds.transaction(async (m) => {
    const bakeries = m.getRepository(Bakery);
    if (!(await bakeries.findOne({ where: {} }))) {
      await bakeries.insert(DEMO_BAKERY);
      created++;
    }
    const users = m.getRepository(User);
    for (const s of DEMO_STAFF) {
      if (!(await users.existsBy({ email: s.email }))) {
        await users.insert({ ...s, passwordHash, accountId: null, disabled: false });
        created++;
      }
    }
    const accounts = m.getRepository(CustomerAccount);
    for (const { buyer, ...a } of DEMO_ACCOUNTS) {
      let account = await accounts.findOneBy({ businessName: a.businessName });
      if (!account) {
        account = await accounts.save(accounts.create({ ...a, status: "active" }));
        created++;
      }
      if (!(await users.existsBy({ email: buyer.email }))) {
        await users.insert({ ...buyer, role: "buyer", accountId: account.id, passwordHash, disabled: false });
        created++;
      }
    }
  });
  return { created };
}

/** The database is "empty" when it has no bakery yet. */
export async function isEmpty(ds: DataSource): Promise<boolean> {
  return (await ds.getRepository(Bakery).count()) === 0;
}
