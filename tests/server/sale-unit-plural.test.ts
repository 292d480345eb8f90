import { createTestDatabase } from "./helpers/db";
import { seedDemo } from "../../server/seed/demo";
import { Product } from "../../server/catalog/product.entity";
import { OrderLine } from "../../server/orders/order-line.entity";

/**
 * Migration 1796190000008 (SaleUnitPlural): rows written before plurals were stored get the plural
 * shared/quantity.ts suggests (common English plural rules), and re-seeding an older demo database fills them too.
 */
let db: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => {
  db = await createTestDatabase();
}, 60_000);
afterAll(() => db?.drop());

it("backfills existing products with a plural (order lines by the same statement), telling 'Loaf' and 'loaf' apart", async () => {
  const ds = db.dataSource;
  // Undo the migrations back to (and including) SaleUnitPlural; later ones come back with runMigrations below.
  for (let i = 0; i < 20; i++) {
    const [last] = await ds.query("SELECT name FROM migrations ORDER BY timestamp DESC LIMIT 1");
    await ds.undoLastMigration({ transaction: "each" });
    if (String(last.name).startsWith("SaleUnitPlural")) break;
  }
  expect((await ds.query("SHOW COLUMNS FROM product LIKE 'saleUnitPlural'")).length).toBe(0);
  await ds.query("INSERT INTO product (name, description, saleUnit, piecesPerUnit, pieceGrams, panName, panLengthMm, panWidthMm, unitsPerPan, priceCents, allergens, mayContain) VALUES ('Rolls', '', 'tray of 15 rolls', 15, 67, 'pan', 330, 229, 1, 1800, '', ''), ('Pullman', '', 'loaf', 1, 900, 'pan', 330, 102, 1, 950, '', ''), ('Big', '', 'Loaf', 1, 900, 'pan', 330, 102, 1, 950, '', ''), ('Sliders', '', 'dozen buns', 12, 45, 'pan', 457, 330, 2, 1440, '', '')");
  await ds.runMigrations({ transaction: "each" });
  const products = await ds.getRepository(Product).find({ order: { id: "ASC" } });
  expect(products.map((p) => [p.saleUnit, p.saleUnitPlural])).toEqual([
    ["tray of 15 rolls", "trays of 15 rolls"],
    ["loaf", "loaves"],
    ["Loaf", "Loaves"],
    ["dozen buns", "dozen buns"],
  ]);
  const sql = await ds.driver.createSchemaBuilder().log();
  expect(sql.upQueries.map((q) => q.query)).toEqual([]);
}, 60_000);

it("a demo database whose rows lost their plural gets them again on the next seed", async () => {
  const ds = db.dataSource;
  await ds.query("DELETE FROM product");
  await seedDemo(ds);
  await ds.query("UPDATE product SET saleUnitPlural = ''");
  await ds.query("UPDATE order_line SET saleUnitPlural = ''");
  await seedDemo(ds);
  const rolls = await ds.getRepository(Product).findOneByOrFail({ name: "Milk-bread dinner rolls" });
  expect(rolls.saleUnitPlural).toBe("trays of 15 rolls");
  expect((await ds.getRepository(Product).find()).filter((p) => !p.saleUnitPlural)).toEqual([]);
  expect(await ds.getRepository(OrderLine).countBy({ saleUnitPlural: "" })).toBe(0);
}, 120_000);
