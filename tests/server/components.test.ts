/**
 * Product components and allergens, on the seeded demo (not fixtures): the Hollowbrook Bakehouse's sesame buns, egg-washed
 * rolls, honey-oat topping and cinnamon filling as seedDemo writes them, read back through the API.
 *
 * Sources of the checks:
 * - Sesame is a major food allergen in the US since the FASTER Act of 2021 (amending FALCPA 2004, 21 U.S.C. 321(qq)),
 *   and in the EU (Regulation 1169/2011 Annex II point 11). Both require every major allergen used as an ingredient to be
 *   declared — a topping or a wash is an ingredient of the food as sold — so the declaration is the union over the
 *   dough and the components.
 * - EU Regulation 1169/2011 Annex II point 1: "Cereals containing gluten, namely: wheat …, rye, barley, oats".
 */
import { startTestApp, auth, waitForMail, type TestApp } from "./helpers/app";
import { seedDemo, DEMO_PASSWORD } from "../../server/seed/demo";
import { Product } from "../../server/catalog/product.entity";
import { ALLERGENS } from "../../shared/allergens";

/** Mon 9 Nov 2026 09:00 CST. Sat 14 Nov is a delivery day (North Pier's route); its cut-off is Fri 13 Nov 14:00. */
const NOW = "2026-11-09T15:00:00Z";
const SAT = "2026-11-14";

let t: TestApp;
let owner: string;
let baker: string;
let buyer: string;
const signIn = async (email: string) => {
  const res = await t.http().post("/api/auth/sign-in").send({ email, password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in ${email}: ${res.status}`);
  return res.body.token as string;
};

interface ApiProduct { id: number; name: string; allergens: string[]; derivedAllergens: string[]; addedAllergens: string[]; allergenSources: Record<string, string[]>; formulaId: number | null; components: { ingredientId: number; name: string; kind: string; grams: number; per: string }[]; bake: { bakeTempC: number | null; bakeMinutes: number | null; coolMinutes: number | null } }

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await seedDemo(t.ds);
  owner = await signIn("owner@hollowbrook.test");
  baker = await signIn("baker@hollowbrook.test");
  buyer = await signIn("buyer@northpier.test");
});
afterAll(() => t.close());

/** The fixed list's order, for comparing sets as the API sorts them. */
const inListOrder = (codes: Iterable<string>) => {
  const set = new Set(codes);
  return ALLERGENS.map((a) => a.code as string).filter((c) => set.has(c));
};

/**
 * The union computed here from the database rows themselves (formula version body, component rows, ingredient flags),
 * not through the service code under test.
 */
async function unionFromRows(productId: number): Promise<string[]> {
  const [p] = await t.ds.query("SELECT formulaId FROM product WHERE id = ?", [productId]);
  const flags = new Map<number, string[]>(
    (await t.ds.query("SELECT id, allergens FROM ingredient")).map((r: { id: number; allergens: string }) => [r.id, r.allergens.split(",").filter(Boolean)]),
  );
  const ids: number[] = [];
  if (p.formulaId) {
    const [v] = await t.ds.query("SELECT v.body FROM formula f JOIN formula_version v ON v.formulaId = f.id AND v.version = f.currentVersion WHERE f.id = ?", [p.formulaId]);
    ids.push(...(JSON.parse(v.body).lines as { ingredientId: number }[]).map((l) => l.ingredientId));
  }
  ids.push(...(await t.ds.query("SELECT ingredientId FROM product_component WHERE productId = ?", [productId])).map((r: { ingredientId: number }) => r.ingredientId));
  return inListOrder(ids.flatMap((id) => flags.get(id) ?? []));
}

describe("seeded allergens", () => {
  it("rolled oats carry the gluten flag (EU 1169/2011 Annex II point 1 names oats among the cereals containing gluten)", async () => {
    const res = await t.http().get("/api/ingredients").set(auth(owner));
    expect(res.body.ingredients.find((i: { name: string }) => i.name === "Rolled oats").allergens).toEqual(["gluten"]);
  });

  it("every seeded product declares exactly the union over its formula and its components", async () => {
    const res = await t.http().get("/api/products?all=1").set(auth(owner));
    expect(res.status).toBe(200);
    const products: ApiProduct[] = res.body.products;
    expect(products.length).toBeGreaterThanOrEqual(7);
    for (const p of products) {
      const union = await unionFromRows(p.id);
      expect({ name: p.name, allergens: p.allergens }).toEqual({ name: p.name, allergens: union });
      expect(p.derivedAllergens).toEqual(union);
      expect(p.addedAllergens).toEqual([]); // the demo's products add nothing of their own: all is derived
    }
    // A 900 g lidded loaf bakes and cools longer than the dough's rolls (common practice: 35–45 min, 1–2 h cooling).
    expect(products.find((p) => p.name === "Pullman milk loaf")!.bake).toMatchObject({ bakeMinutes: 40, coolMinutes: 90 });
    const withComponents = products.filter((p) => p.components.length);
    expect(withComponents.map((p) => p.name).sort()).toEqual(["Brioche burger buns", "Cinnamon swirl loaf", "Honey-oat rolls", "Milk-bread dinner rolls", "Milk-bread slider buns", "Sesame brioche buns"]);
  });

  it("the sesame brioche buns declare sesame — from the toasted sesame topping, not the dough — in the buyer's products list and detail", async () => {
    const list = await t.http().get("/api/products").set(auth(buyer));
    const sesame: ApiProduct = list.body.products.find((p: ApiProduct) => p.name === "Sesame brioche buns");
    expect(sesame.allergens).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
    expect(sesame.allergenSources.sesame).toEqual(["Toasted sesame topping"]);
    expect(sesame.allergenSources.egg).toEqual(["Brioche dough", "Egg wash"]);
    expect(sesame.components).toEqual([]); // buyers see the declaration and its sources, not the recipe
    const brioche: ApiProduct = list.body.products.find((p: ApiProduct) => p.name === "Brioche burger buns");
    expect(brioche.allergens).not.toContain("sesame"); // same dough, no topping
    const detail = await t.http().get(`/api/products/${sesame.id}`).set(auth(buyer));
    expect(detail.body.product.allergens).toContain("sesame");
    const oat: ApiProduct = list.body.products.find((p: ApiProduct) => p.name === "Honey-oat rolls");
    expect(oat.allergens).toEqual(["gluten", "wheat", "milk"]); // no egg: the honey-oat rolls have no egg wash
    expect(oat.allergenSources.gluten).toEqual(["Honey-oat milk bread dough", "Honey-oat topping"]);
  });

  it("an order line and the order e-mail carry the sesame buns' sesame", async () => {
    const products: ApiProduct[] = (await t.http().get("/api/products").set(auth(buyer))).body.products;
    const sesame = products.find((p) => p.name === "Sesame brioche buns")!;
    const sliders = products.find((p) => p.name === "Milk-bread slider buns")!;
    const res = await t.http().post("/api/orders").set(auth(buyer)).send({ deliveryDate: SAT, lines: [{ productId: sesame.id, quantity: 3 }, { productId: sliders.id, quantity: 2 }] });
    expect(res.status).toBe(201);
    const line = res.body.order.lines.find((l: { productId: number }) => l.productId === sesame.id);
    expect(line.allergens).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
    const mail = await waitForMail(t, "buyer@northpier.test", { subject: /Order placed/ });
    expect(mail.text).toMatch(/Sesame brioche buns — 3 packs of 8 buns — \$[\d.]+\. Contains: Cereals containing gluten, Wheat, Egg, Milk, Sesame\./);
    expect(mail.text).toMatch(/Milk-bread slider buns — 2 dozen buns — .*Contains: Cereals containing gluten, Wheat, Egg, Milk\. May contain: Sesame\./);
    expect(mail.html).toContain("Egg, Milk, Sesame.");
    const office = await t.http().get(`/api/orders/${res.body.order.id}`).set(auth(owner));
    expect(office.body.order.lines.find((l: { productId: number }) => l.productId === sesame.id).allergens).toContain("sesame");
  });

  it("a product's own list never replaces the derived one (it would drop sesame, egg and gluten here)", async () => {
    const sesame = await t.ds.getRepository(Product).findOneByOrFail({ name: "Sesame brioche buns" });
    // Its own list says only mustard: if it replaced the derived list, the buns would declare mustard alone.
    await t.ds.getRepository(Product).update({ id: sesame.id }, { allergens: "mustard" });
    const got = await t.http().get(`/api/products/${sesame.id}`).set(auth(buyer));
    expect(got.body.product.allergens).toEqual(["gluten", "wheat", "egg", "milk", "mustard", "sesame"]);
    expect(got.body.product.addedAllergens).toEqual(["mustard"]);
    const line = await t.http().get("/api/orders").set(auth(buyer));
    expect(line.body.orders[0].lines.find((l: { productId: number }) => l.productId === sesame.id).allergens).toEqual(["gluten", "wheat", "egg", "milk", "mustard", "sesame"]);
    // The owner cannot take a derived allergen off: a clear 400 naming it and where it comes from.
    const res = await t.http().patch(`/api/products/${sesame.id}`).set(auth(owner)).send({ allergens: ["gluten", "wheat", "egg", "milk"] });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe("Sesame (from Toasted sesame topping) cannot be taken off: it comes from the product's ingredients. Change the formula or the component instead.");
    expect(res.body.error.fields.allergens).toBe(res.body.error.message);
    // Taking the added mustard off is fine; the derived ones stay.
    const ok = await t.http().patch(`/api/products/${sesame.id}`).set(auth(owner)).send({ allergens: ["gluten", "wheat", "egg", "milk", "sesame"] });
    expect(ok.status).toBe(200);
    expect(ok.body.product.allergens).toEqual(["gluten", "wheat", "egg", "milk", "sesame"]);
    expect((await t.ds.getRepository(Product).findOneByOrFail({ id: sesame.id })).allergens).toBe("");
  });
});

describe("components on the bake day", () => {
  it("per-product bake and cooling reach the plan: own values where set, the formula's otherwise", async () => {
    const res = await t.http().get(`/api/production/plan?date=${SAT}`).set(auth(baker));
    expect(res.status).toBe(200);
    const byName = (n: string) => res.body.plan.products.find((p: { name: string }) => p.name === n);
    // The formulas' own bake and cool steps, as seeded, are the defaults.
    const formulas: { name: string; steps: { kind: string; minutes: number; temperatureC?: number | null }[] }[] = (await t.http().get("/api/formulas").set(auth(owner))).body.formulas;
    const step = (formula: string, kind: string) => formulas.find((f) => f.name === formula)!.steps.find((s) => s.kind === kind)!;
    // Sliders set their own 16 min; the oven temperature and the cooling are Milk bread's.
    expect(byName("Milk-bread slider buns")).toMatchObject({ bakeTempC: step("Milk bread", "bake").temperatureC, bakeMinutes: 16, coolMinutes: step("Milk bread", "cool").minutes });
    expect(step("Milk bread", "bake").minutes).not.toBe(16);
    expect(byName("Milk-bread slider buns").bakeTempC).toBe(177);
    // The sesame buns set nothing: all three from Brioche's steps.
    expect(byName("Sesame brioche buns")).toMatchObject({ bakeTempC: 190, bakeMinutes: step("Brioche", "bake").minutes, coolMinutes: step("Brioche", "cool").minutes });
    expect(byName("Sesame brioche buns").allergens).toContain("sesame");
  });

  it("a weigh-out card per component: pieces × grams each, and the grams in the day's ingredient totals", async () => {
    const plan = (await t.http().get(`/api/production/plan?date=${SAT}`).set(auth(baker))).body.plan;
    const sesameBuns = plan.products.find((p: { name: string }) => p.name === "Sesame brioche buns");
    const sliders = plan.products.find((p: { name: string }) => p.name === "Milk-bread slider buns");
    // 3 packs of 8 on half sheets holding 2 packs: ceil(3 / 2) = 2 pans → 2 × 2 × 8 = 32 buns baked.
    expect(sesameBuns).toMatchObject({ units: 3, pans: 2, pieces: 32 });
    const topping = plan.components.find((c: { key: string }) => c.key === `${sesameBuns.productId}:topping:Toasted sesame topping`);
    expect(topping).toMatchObject({ name: "Toasted sesame topping", kind: "topping", totalGrams: 64 });
    expect(topping.lines).toEqual([expect.objectContaining({ name: "Toasted sesame seeds", per: "piece", count: 32, gramsEach: 2, grams: 64 })]);
    const wash = plan.components.find((c: { key: string }) => c.key === `${sesameBuns.productId}:wash:Egg wash`);
    expect(wash.lines.map((l: { name: string; grams: number }) => [l.name, l.grams])).toEqual([["Whole egg", 38.4], ["Whole milk", 9.6]]); // 32 × 1.2 g, 32 × 0.3 g
    const sliderWash = plan.components.find((c: { key: string }) => c.key === `${sliders.productId}:wash:Egg wash`);
    expect(sliderWash.lines[0]).toMatchObject({ count: sliders.pieces, gramsEach: 0.8 });
    // Only the topping uses sesame seeds, so the day's total is the card's; egg adds the washes to the doughs' egg.
    const total = (name: string) => plan.ingredients.find((i: { name: string }) => i.name === name);
    expect(total("Toasted sesame seeds")).toMatchObject({ grams: 64, componentGrams: 64 });
    const doughEgg = plan.doughs.flatMap((d: { ingredients: { name: string; grams: number }[] }) => d.ingredients).filter((i: { name: string }) => i.name === "Whole egg").reduce((s: number, i: { grams: number }) => s + i.grams, 0);
    const washEgg = plan.components.flatMap((c: { lines: { name: string; grams: number }[] }) => c.lines).filter((l: { name: string }) => l.name === "Whole egg").reduce((s: number, l: { grams: number }) => s + l.grams, 0);
    expect(total("Whole egg").grams).toBeCloseTo(doughEgg + washEgg, 0);
    expect(total("Whole egg").componentGrams).toBe(Math.round(washEgg)); // the plan's grams: to 1 g from 50 g up
  });

  it("the purchasing forecast buys the components' ingredients too", async () => {
    const res = await t.http().get(`/api/production/forecast?from=${SAT}`).set(auth(baker));
    expect(res.status).toBe(200);
    const sesame = res.body.forecast.items.find((i: { name: string }) => i.name === "Toasted sesame seeds");
    // The forecast adds expected standing orders: Juniper Table's Saturday standing order has 6 packs of sesame buns
    // (server/seed/demo.ts), so 3 + 6 = 9 packs → ceil(9 / 2) = 5 half sheets → 5 × 2 × 8 = 80 buns × 2 g = 160 g.
    expect(sesame.byDay[SAT]).toBe(160);
    expect(sesame).toMatchObject({ packName: "5 lb bag", packGrams: 2268 });
    expect(sesame.packs).toBe(Math.ceil(sesame.grams / 2268));
    expect(sesame.grams).toBeGreaterThanOrEqual(160);

    // The same forecast as CSV (issue 12): RFC 4180 read back with csv-parse, a row per ingredient, its grams on
    // each day, the cost a plain decimal, and a total row.
    const { parse: parseCsv } = await import("csv-parse/sync");
    const csv = await t.http().get(`/api/production/forecast.csv?from=${SAT}`).set(auth(baker));
    expect(csv.status).toBe(200);
    expect(csv.headers["content-type"]).toMatch(/^text\/csv/);
    expect(csv.headers["content-disposition"]).toContain(`purchasing-${res.body.forecast.from}-to-${res.body.forecast.to}.csv`);
    const rows = parseCsv(csv.text, { columns: true }) as Record<string, string>[];
    const line = rows.find((r) => r.Ingredient === "Toasted sesame seeds")!;
    expect(line).toMatchObject({ Grams: String(Math.round(sesame.grams)), Pack: "5 lb bag", "Pack Grams": "2268", "Packs To Buy": String(sesame.packs), Currency: "USD", [`Grams On ${SAT}`]: "160" });
    expect(line.Cost).toBe((sesame.costCents / 100).toFixed(2));
    const total = rows[rows.length - 1];
    expect(total).toMatchObject({ Ingredient: "Total", Cost: (res.body.forecast.totalCostCents / 100).toFixed(2) });
    expect(rows).toHaveLength(res.body.forecast.items.length + 1);
  });
});
