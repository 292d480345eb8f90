import fs from "node:fs";
import path from "node:path";
import zlib from "node:zlib";
import { parse as parseCsv } from "csv-parse/sync";
import sharp from "sharp";
import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { CustomerAccount } from "../../server/accounts/account.entity";

const NOW = "2026-06-10T15:00:00Z"; // Wed 10 Jun 10:00 CDT
let t: TestApp;
let owner: string;
let baker: string;
let buyer: string;
let accountId: number;
beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  t.ctx.config.uploadsDir = fs.mkdtempSync(path.join(require("node:os").tmpdir(), "panwise-uploads-"));
  await makeBakery(t.ds);
  accountId = (await makeAccount(t.ds, { businessName: "Price Café" })).id;
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  buyer = await tokenFor(t, await makeUser(t.ds, "buyer", { accountId }));
});
afterAll(async () => {
  fs.rmSync(t.ctx.config.uploadsDir, { recursive: true, force: true });
  await t.close();
});

const product = {
  name: "Dinner rolls", description: "Soft rolls", saleUnit: "tray of 15 rolls", saleUnitPlural: "trays of 15 rolls", piecesPerUnit: 15, pieceGrams: 67,
  panName: "9×13 in pan", panLengthMm: 330, panWidthMm: 229, unitsPerPan: 1, priceCents: 1800, minQuantity: 1, maxQuantity: 40,
  allergens: ["milk", "wheat", "gluten", "egg"], mayContain: "sesame", boughtIn: true,
};

/** A real 1×1 PNG (PNG spec: signature, IHDR, IDAT, IEND with CRC-32 from zlib). */
function tinyPng(): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4); len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type), data]);
    const crc = Buffer.alloc(4); crc.writeUInt32BE(zlib.crc32(td) >>> 0);
    return Buffer.concat([len, td, crc]);
  };
  const ihdr = Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", zlib.deflateSync(Buffer.from([0, 200, 120, 60]))), chunk("IEND", Buffer.alloc(0))]);
}
/** A decodable JPEG (photos are decoded and re-encoded when stored, so a header-only fake no longer passes). */
const tinyJpeg = () => sharp({ create: { width: 2, height: 2, channels: 3, background: "#d9a35f" } }).jpeg().toBuffer();

describe("catalog", () => {
  let id: number;
  it("the owner creates a product; allergens are kept in the fixed list's order", async () => {
    const res = await t.http().post("/api/products").set(auth(owner)).send(product);
    expect(res.status).toBe(201);
    id = res.body.product.id;
    expect(res.body.product).toMatchObject({ name: "Dinner rolls", listPriceCents: 1800, priceCents: 1800, photoUrl: null, active: true });
    expect(res.body.product.allergens).toEqual(["gluten", "wheat", "egg", "milk"]);
  });

  it("stores the sale unit's plural as the owner writes it, and needs one on create", async () => {
    const loaf = await t.http().post("/api/products").set(auth(owner)).send({ ...product, name: "Rye loaf", saleUnit: "loaf", saleUnitPlural: "loaves", piecesPerUnit: 1 });
    expect(loaf.status).toBe(201);
    expect(loaf.body.product).toMatchObject({ saleUnit: "loaf", saleUnitPlural: "loaves" });
    expect((await t.http().get(`/api/products/${loaf.body.product.id}`).set(auth(owner))).body.product.saleUnitPlural).toBe("loaves");
    const renamed = await t.http().patch(`/api/products/${loaf.body.product.id}`).set(auth(owner)).send({ saleUnitPlural: "loaves, sliced" });
    expect(renamed.body.product.saleUnitPlural).toBe("loaves, sliced");
    // Sale units and names reach the calendar feed, e-mail and CSVs: a line break or control character is refused
    // (RFC 5545 §3.3.11, RFC 5322 §2.2) and the stored value is kept.
    for (const bad of ["trays\u0000x", "trays\r\nBCC: x"]) {
      const refused = await t.http().patch(`/api/products/${loaf.body.product.id}`).set(auth(owner)).send({ saleUnitPlural: bad });
      expect(refused.status).toBe(400);
      expect(refused.body.error.fields.saleUnitPlural).toMatch(/one line/);
    }
    expect((await t.http().patch(`/api/products/${loaf.body.product.id}`).set(auth(owner)).send({ name: "Rye\nloaf" })).status).toBe(400);
    expect((await t.http().get(`/api/products/${loaf.body.product.id}`).set(auth(owner))).body.product.saleUnitPlural).toBe("loaves, sliced");
    const { saleUnitPlural: _none, ...withoutPlural } = product;
    const missing = await t.http().post("/api/products").set(auth(owner)).send({ ...withoutPlural, name: "No plural" });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.saleUnitPlural).toBe("Enter the plural of the sale unit, e.g. trays of 15 rolls.");
    // The error names the field as the form labels it ("Days of notice", "Maximum per order").
    const bad = await t.http().post("/api/products").set(auth(owner)).send({ ...product, name: "Too slow", leadDays: 30, maxQuantity: 20000 });
    expect(bad.body.error.fields).toMatchObject({ leadDays: "Days of notice can be at most 14.", maxQuantity: "Maximum per order can be at most 10000." });
  });

  it("refuses bad products with field messages", async () => {
    const res = await t.http().post("/api/products").set(auth(owner)).send({ ...product, name: "", pieceGrams: 0, minQuantity: 5, maxQuantity: 2, allergens: ["gluten", "plutonium"], priceCents: 12.5 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({ name: expect.any(String), pieceGrams: expect.stringMatching(/at least 1/), "allergens.1": "Choose allergens from the list.", priceCents: expect.stringMatching(/whole number/) });
    const minmax = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ minQuantity: 50 });
    expect(minmax.status).toBe(400);
    expect(minmax.body.error.fields.maxQuantity).toMatch(/at least the minimum/);
    expect((await t.http().post("/api/products").set(auth(baker)).send(product)).status).toBe(403);
  });

  it("buyers see their own prices: a percentage list rounds half up to the cent; a fixed list sets per product", async () => {
    const pct = await t.http().post("/api/price-lists").set(auth(owner)).send({ name: "Partners", kind: "percent", percentOff: 12.5 });
    expect(pct.status).toBe(201);
    await t.http().put(`/api/accounts/${accountId}/delivery`).set(auth(owner)).send({ routeWeekdays: null, minimumOrderCents: 0, priceListId: pct.body.priceList.id });
    let list = await t.http().get("/api/products").set(auth(buyer));
    expect(list.body.products.find((p: { id: number }) => p.id === id)).toMatchObject({ listPriceCents: 1800, priceCents: 1575 }); // 1800 × 0.875
    const odd = await makeProduct(t.ds, { name: "Odd price", priceCents: 999 });
    list = await t.http().get("/api/products").set(auth(buyer));
    expect(list.body.products.find((p: { id: number }) => p.id === odd.id).priceCents).toBe(874); // 874.125 → 874

    const fixed = await t.http().post("/api/price-lists").set(auth(owner)).send({ name: "Volume", kind: "fixed", items: [{ productId: id, priceCents: 1650 }] });
    await t.http().put(`/api/accounts/${accountId}/delivery`).set(auth(owner)).send({ routeWeekdays: [2, 4], minimumOrderCents: 2500, priceListId: fixed.body.priceList.id });
    list = await t.http().get("/api/products").set(auth(buyer));
    expect(list.body.products.find((p: { id: number }) => p.id === id).priceCents).toBe(1650);
    expect(list.body.products.find((p: { id: number }) => p.id === odd.id).priceCents).toBe(999);
    const order = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: "2026-06-11", lines: [{ productId: id, quantity: 2 }] });
    expect(order.body.order.lines[0].unitPriceCents).toBe(1650);
    const acct = await t.ds.getRepository(CustomerAccount).findOneByOrFail({ id: accountId });
    expect(acct).toMatchObject({ routeWeekdays: "2,4", minimumOrderCents: 2500 });
    const dup = await t.http().post("/api/price-lists").set(auth(owner)).send({ name: "Dupes", kind: "fixed", items: [{ productId: id, priceCents: 1 }, { productId: id, priceCents: 2 }] });
    expect(dup.body.error.fields["items.1.productId"]).toMatch(/twice/);
  });

  describe("made from a formula, or bought in", () => {
    let flourId: number;
    let sesameId: number;
    let eggId: number;
    let formulaId: number;
    beforeAll(async () => {
      const ing = async (name: string, kind: string, allergens: string[]) =>
        (await t.http().post("/api/ingredients").set(auth(owner)).send({ name, kind, waterPercent: 0, allergens, packName: "bag", packGrams: 1000 })).body.ingredient.id as number;
      flourId = await ing("Catalog flour", "flour", ["gluten", "wheat"]);
      sesameId = await ing("Catalog sesame", "inclusion", ["sesame"]);
      eggId = await ing("Catalog egg", "egg", ["egg"]);
      const f = await t.http().post("/api/formulas").set(auth(owner)).send({
        name: "Catalog dough", lossPercent: 2, ddtC: 26, frictionC: 12, paste: null, lines: [{ ingredientId: flourId, percent: 100 }],
        steps: [{ kind: "bake", minutes: 27, temperatureC: 177 }, { kind: "cool", minutes: 30 }],
      });
      expect(f.status).toBe(201);
      formulaId = f.body.formula.id;
    });
    const { boughtIn: _b, allergens: _a, ...base } = product;

    it("a new product on offer needs a formula or the explicit bought-in choice, not neither and not both", async () => {
      const neither = await t.http().post("/api/products").set(auth(owner)).send({ ...base, name: "Unplanned bun" });
      expect(neither.status).toBe(400);
      expect(neither.body.error.fields.formulaId).toBe("Choose the formula it is baked from, or mark it bought in / not planned: otherwise buyers could order what production cannot plan.");
      const both = await t.http().post("/api/products").set(auth(owner)).send({ ...base, name: "Both bun", formulaId, boughtIn: true });
      expect(both.status).toBe(400);
      expect(both.body.error.fields.boughtIn).toMatch(/not both/);
      const archived = await t.http().post("/api/products").set(auth(owner)).send({ ...base, name: "Draft bun", active: false });
      expect(archived.status).toBe(201); // not on offer: may wait for its formula
      const restore = await t.http().patch(`/api/products/${archived.body.product.id}`).set(auth(owner)).send({ active: true });
      expect(restore.status).toBe(400);
      expect(restore.body.error.fields.formulaId).toMatch(/Choose the formula/);
      const missing = await t.http().post("/api/products").set(auth(owner)).send({ ...base, name: "Ghost bun", formulaId: 999999 });
      expect(missing.body.error.fields.formulaId).toBe("Choose an existing formula.");
    });

    let id: number;
    it("components are saved with the product, returned on GET, and feed its declared allergens", async () => {
      const res = await t.http().post("/api/products").set(auth(owner)).send({
        ...base, name: "Sesame test bun", formulaId,
        components: [
          { kind: "wash", name: "Egg wash", ingredientId: eggId, grams: 1.2, per: "piece" },
          { kind: "topping", name: "Sesame topping", ingredientId: sesameId, grams: 2, per: "piece", note: "Over the wash" },
        ],
      });
      expect(res.status).toBe(201);
      id = res.body.product.id;
      const got = (await t.http().get(`/api/products/${id}`).set(auth(owner))).body.product;
      expect(got.components).toEqual([
        { kind: "wash", name: "Egg wash", ingredientId: eggId, ingredientName: "Catalog egg", grams: 1.2, per: "piece", note: "", allergens: ["egg"] },
        { kind: "topping", name: "Sesame topping", ingredientId: sesameId, ingredientName: "Catalog sesame", grams: 2, per: "piece", note: "Over the wash", allergens: ["sesame"] },
      ]);
      expect(got.allergens).toEqual(["gluten", "wheat", "egg", "sesame"]);
      expect(got.derivedAllergens).toEqual(["gluten", "wheat", "egg", "sesame"]);
      expect(got.allergenSources).toEqual({ gluten: ["Catalog dough dough"], wheat: ["Catalog dough dough"], egg: ["Egg wash"], sesame: ["Sesame topping"] });
      expect(got).toMatchObject({ formulaName: "Catalog dough", boughtIn: false, formulaBake: { bakeTempC: 177, bakeMinutes: 27, coolMinutes: 30 }, bake: { bakeTempC: 177, bakeMinutes: 27, coolMinutes: 30 } });
    });

    it("a patch without components keeps them; a patch with them replaces them; the product may add allergens", async () => {
      const keep = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ priceCents: 1900, mayContain: "tree_nuts", allergens: ["gluten", "wheat", "egg", "sesame", "mustard"] });
      expect(keep.status).toBe(200);
      expect(keep.body.product.components).toHaveLength(2);
      expect(keep.body.product.allergens).toEqual(["gluten", "wheat", "egg", "mustard", "sesame"]);
      expect(keep.body.product.addedAllergens).toEqual(["mustard"]);
      expect(keep.body.product.allergenSources.mustard).toEqual(["Added by the bakery"]);
      // Without the topping, sesame is no longer derived; the added mustard stays.
      const replaced = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ components: [{ kind: "wash", name: "Egg wash", ingredientId: eggId, grams: 1.5, per: "pan" }] });
      expect(replaced.status).toBe(200);
      expect(replaced.body.product.components).toEqual([expect.objectContaining({ ingredientId: eggId, grams: 1.5, per: "pan" })]);
      expect(replaced.body.product.allergens).toEqual(["gluten", "wheat", "egg", "mustard"]);
    });

    it("refuses bad components with field messages", async () => {
      const bad = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({
        components: [
          { kind: "sprinkle", ingredientId: eggId, grams: 1, per: "piece" },
          { kind: "wash", ingredientId: eggId, grams: 0.05, per: "piece" },
          { kind: "wash", ingredientId: eggId, grams: 1.25, per: "tray" },
        ],
      });
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields).toMatchObject({
        "components.0.kind": "Choose topping, wash, filling or garnish.",
        "components.1.grams": "Weigh at least 0.1 g.",
        "components.2.grams": "Use at most one decimal, e.g. 1.5 g.",
        "components.2.per": "Choose per piece or per pan.",
      });
      const twice = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({
        components: [
          { kind: "topping", name: "Seeds", ingredientId: sesameId, grams: 2, per: "piece" },
          { kind: "topping", name: "Seeds", ingredientId: sesameId, grams: 3, per: "piece" },
        ],
      });
      expect(twice.body.error.fields).toEqual({ "components.1.ingredientId": "This ingredient is already in this component." });
      const unknown = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ components: [{ kind: "wash", ingredientId: 999999, grams: 1, per: "piece" }] });
      expect(unknown.status).toBe(400);
      expect(unknown.body.error.fields["components.0.ingredientId"]).toBe("Choose an ingredient from the library.");
      const boughtIn = await t.http().post("/api/products").set(auth(owner)).send({ ...base, name: "Bought bun", boughtIn: true, components: [{ kind: "wash", ingredientId: eggId, grams: 1, per: "piece" }], bakeMinutes: 20 });
      expect(boughtIn.status).toBe(400);
      expect(boughtIn.body.error.fields.components).toMatch(/bought-in product has no components/);
      expect(boughtIn.body.error.fields.bakeMinutes).toMatch(/not baked here/);
    });

    it("the product's own bake temperature and minutes override the formula's, one value at a time", async () => {
      const res = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ bakeMinutes: 16, coolMinutes: 90 });
      expect(res.status).toBe(200);
      expect(res.body.product).toMatchObject({ bakeTempC: null, bakeMinutes: 16, coolMinutes: 90, bake: { bakeTempC: 177, bakeMinutes: 16, coolMinutes: 90 } });
      const bad = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ bakeTempC: 500, bakeMinutes: 0, coolMinutes: 2000 });
      expect(bad.body.error.fields).toMatchObject({ bakeTempC: "Bake temperature can be at most 300.", bakeMinutes: "Bake time must be at least 1.", coolMinutes: "Cooling time can be at most 1440." });
      const back = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ bakeMinutes: null });
      expect(back.body.product.bake.bakeMinutes).toBe(27);
    });

    it("switching a product to bought in keeps its own declaration only", async () => {
      const res = await t.http().patch(`/api/products/${id}`).set(auth(owner)).send({ formulaId: null, boughtIn: true, components: [], coolMinutes: null, allergens: ["gluten", "wheat"] });
      expect(res.status).toBe(200);
      expect(res.body.product).toMatchObject({ boughtIn: true, formulaId: null, allergens: ["gluten", "wheat"], derivedAllergens: [], components: [], formulaBake: null });
    });
  });

  it("archiving hides a product from buyers but not from the owner", async () => {
    const p = await makeProduct(t.ds, { name: "Seasonal loaf" });
    expect((await t.http().post(`/api/products/${p.id}/archive`).set(auth(owner))).body.product.active).toBe(false);
    const buyerList = await t.http().get("/api/products").set(auth(buyer));
    expect(buyerList.body.products.map((x: { name: string }) => x.name)).not.toContain("Seasonal loaf");
    expect((await t.http().get(`/api/products/${p.id}`).set(auth(buyer))).status).toBe(404);
    const ownerList = await t.http().get("/api/products?all=1").set(auth(owner));
    expect(ownerList.body.products.map((x: { name: string }) => x.name)).toContain("Seasonal loaf");
  });

  describe("photos (checked by content, not by name)", () => {
    it("accepts a PNG, stores it under a generated name, serves it with long cache headers", async () => {
      const res = await t.http().put(`/api/products/${id}/photo`).set(auth(owner)).attach("photo", tinyPng(), { filename: "rolls.txt", contentType: "text/plain" });
      expect(res.status).toBe(200);
      // SHA-256 of the stored bytes; the sizes screens show are WebP, whatever was uploaded.
      expect(res.body.product.photoUrl).toMatch(/^\/api\/uploads\/[a-f0-9]{64}\.webp$/);
      expect(res.body.product.photoThumbUrl).toMatch(/^\/api\/uploads\/[a-f0-9]{64}\.webp$/);
      const img = await t.http().get(res.body.product.photoUrl);
      expect(img.status).toBe(200);
      expect(img.headers["content-type"]).toBe("image/webp");
      expect(img.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
      expect(img.headers["x-content-type-options"]).toBe("nosniff");
    });

    it("replacing a photo removes the old files", async () => {
      const files = (sub = "") => fs.readdirSync(path.join(t.ctx.config.uploadsDir, sub)).filter((f) => fs.statSync(path.join(t.ctx.config.uploadsDir, sub, f)).isFile());
      const before = [...files(), ...files("originals")];
      const res = await t.http().put(`/api/products/${id}/photo`).set(auth(owner)).attach("photo", await tinyJpeg(), { filename: "rolls.png", contentType: "image/png" });
      expect(res.status).toBe(200);
      expect(res.body.product.photoUrl).toMatch(/\.webp$/);
      // Two public sizes (a tiny photo's two sizes may be the same bytes, hence one or two files) and the original.
      const after = files();
      expect(after.length).toBeGreaterThanOrEqual(1);
      expect(after.length).toBeLessThanOrEqual(2);
      expect(files("originals")).toEqual([expect.stringMatching(/^[a-f0-9]{64}\.jpg$/)]);
      for (const f of [...after, ...files("originals")]) expect(before).not.toContain(f);
    });

    it("415 for anything that is not JPEG, PNG or WebP, whatever its name", async () => {
      const res = await t.http().put(`/api/products/${id}/photo`).set(auth(owner)).attach("photo", Buffer.from("<svg xmlns='http://www.w3.org/2000/svg'/>"), { filename: "photo.png", contentType: "image/png" });
      expect(res.status).toBe(415);
      expect(res.body.error.code).toBe("unsupported_media_type");
      const gif = await t.http().put(`/api/products/${id}/photo`).set(auth(owner)).attach("photo", Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "binary"), { filename: "a.jpg" });
      expect(gif.status).toBe(415);
    });

    it("413 when larger than 5 MB, and nothing is stored", async () => {
      const before = fs.readdirSync(t.ctx.config.uploadsDir);
      const big = Buffer.concat([tinyPng(), Buffer.alloc(5 * 1024 * 1024 + 1)]);
      const res = await t.http().put(`/api/products/${id}/photo`).set(auth(owner)).attach("photo", big, { filename: "big.png" });
      expect(res.status).toBe(413);
      expect(fs.readdirSync(t.ctx.config.uploadsDir)).toEqual(before);
    });
  });
});

describe("calendar settings and the calendar", () => {
  it("the owner sets delivery days, cut-off, lead days, horizon and closures; bad values get field messages", async () => {
    const bad = await t.http().put("/api/settings/calendar").set(auth(owner)).send({ timeZone: "Mars/Olympus", deliveryWeekdays: [], cutoffTime: "25:00", leadDays: -1, horizonDays: 0, closures: [{ date: "2026-13-01" }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["closures.0.date", "cutoffTime", "deliveryWeekdays", "horizonDays", "leadDays", "timeZone"]);
    const ok = await t.http().put("/api/settings/calendar").set(auth(owner)).send({ timeZone: "America/Chicago", deliveryWeekdays: [6, 2, 3, 4, 5], cutoffTime: "13:30", leadDays: 1, horizonDays: 14, closures: [{ date: "2026-06-23", note: "Staff training day" }] });
    expect(ok.status).toBe(200);
    expect(ok.body.settings).toMatchObject({ deliveryWeekdays: [2, 3, 4, 5, 6], cutoffTime: "13:30", horizonDays: 14, closures: [{ date: "2026-06-23", note: "Staff training day" }] });
  });

  it("GET /api/calendar gives each date's status, reason, cut-off with offset, and the account's order", async () => {
    const res = await t.http().get("/api/calendar?from=2026-06-10&to=2026-06-26").set(auth(buyer));
    expect(res.status).toBe(200);
    const day = (d: string) => res.body.days.find((x: { date: string }) => x.date === d);
    expect(day("2026-06-10")).toMatchObject({ orderable: false, reason: "not_delivery_day" }); // a Wednesday; the account's route days are Tue and Thu
    expect(day("2026-06-11")).toMatchObject({ orderable: true, cutoffAt: "2026-06-10T13:30:00.000-05:00", order: { status: "open", totalCents: 3300, productCount: 1 } });
    expect(day("2026-06-13")).toMatchObject({ orderable: false, reason: "not_delivery_day" });
    expect(day("2026-06-16")).toMatchObject({ orderable: true, order: null });
    expect(day("2026-06-25")).toMatchObject({ orderable: false, reason: "beyond_horizon" });
    expect(day("2026-06-23")).toMatchObject({ orderable: false, reason: "closed", reasonText: "The bakery is closed: Staff training day" });
    const office = await t.http().get(`/api/calendar?from=2026-06-18&to=2026-06-19&accountId=${accountId}`).set(auth(owner));
    expect(office.status).toBe(200);
    const bad = await t.http().get("/api/calendar?from=2026-06-19&to=2026-06-01").set(auth(buyer));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.to).toBeDefined();
  });
});

describe("orders board", () => {
  it("totals accounts × products for a date in SQL and exports CSV that a CSV parser reads back", async () => {
    const other = await makeAccount(t.ds, { businessName: "Another, \"quoted\" Bistro" });
    const products = (await t.http().get("/api/products").set(auth(owner))).body.products;
    const rolls = products.find((p: { name: string }) => p.name === "Dinner rolls");
    await t.http().post("/api/orders").set(auth(owner)).send({ accountId: other.id, deliveryDate: "2026-06-11", lines: [{ productId: rolls.id, quantity: 5 }] });
    const board = await t.http().get("/api/orders/board?date=2026-06-11").set(auth(baker));
    expect(board.status).toBe(200);
    expect(board.body.board.products.find((p: { id: number }) => p.id === rolls.id).total).toBe(7);
    expect(board.body.board.rows.map((r: { accountName: string }) => r.accountName)).toEqual(["Another, \"quoted\" Bistro", "Price Café"]);
    const csv = await t.http().get("/api/orders/board.csv?date=2026-06-11").set(auth(owner));
    expect(csv.headers["content-type"]).toMatch(/text\/csv/);
    expect(csv.headers["content-disposition"]).toContain("orders-2026-06-11.csv");
    const rows: string[][] = parseCsv(csv.text);
    expect(rows[0][0]).toBe("Delivery Date");
    expect(rows[1][1]).toBe("Another, \"quoted\" Bistro");
    expect(rows.at(-1)![1]).toBe("Total");
    const col = rows[0].indexOf("Dinner rolls (tray of 15 rolls)");
    expect(rows.at(-1)![col]).toBe("7");
    expect(rows.at(-1)!.at(-1)).toBe((3300 + 5 * 1800) / 100 + ".00");
  });
});
