import { startTestApp, auth, tokenFor, TEST_PASSWORD, type TestApp } from "./helpers/app";
import { seedDemo } from "../../server/seed/demo";
import { User } from "../../server/users/user.entity";
import { hashPassword } from "../../server/auth/password-hash";
import { iceGrams } from "../../shared/production";
import type { PlanDto } from "../../shared/schemas/production";

/** The bake day's numbers through the API, on the seeded demo: supply temperatures, ice, readings, formula inputs. */
const NOW = "2026-12-02T15:00:00Z";
const SAT = "2026-12-05";
let t: TestApp;
let token: string;

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await seedDemo(t.ds);
  const baker = await t.ds.getRepository(User).findOneByOrFail({ email: "baker@hollowbrook.test" });
  await t.ds.getRepository(User).update({ id: baker.id }, { passwordHash: await hashPassword(TEST_PASSWORD) });
  token = await tokenFor(t, baker);
});
afterAll(() => t.close());

let extraPans: Record<string, number> = {};
const put = (body: object) => t.http().put(`/api/production/bake-days/${SAT}`).set(auth(token)).send(body);

describe("supply temperatures and ice", () => {
  it("stores tap water and milk per bake day and works the honey-oat water line's ice out from them", async () => {
    // A warm room makes cold liquid: honey-oat (DDT 26, friction 12, paste 30): 26 × 4 − (30 + 28 + 12 + 30) = 4 °C.
    // No orders are placed yet: extra pans put honey-oat rolls and dinner rolls on the day.
    const products = (await t.http().get("/api/products").set(auth(token))).body.products as { id: number; name: string }[];
    const id = (name: string) => products.find((p) => p.name === name)!.id;
    extraPans = { [id("Honey-oat rolls")]: 2, [id("Milk-bread dinner rolls")]: 2 };
    const res = await put({ extraPans, roomC: 30, flourC: 28, pasteC: 30, tapC: 20, milkC: 8 });
    expect(res.status).toBe(200);
    const plan = res.body.plan as PlanDto;
    expect(plan.inputs).toMatchObject({ tapC: 20, milkC: 8 });
    const oat = plan.doughs.find((d) => d.name === "Honey-oat milk bread")!;
    const mix = oat.mixes[0];
    expect(mix.liquidTempC).toBe(4);
    const water = oat.ingredients.find((i) => i.name === "Water")!;
    const milk = oat.ingredients.find((i) => i.name === "Whole milk")!;
    const W = mix.ingredients.find((i) => i.ingredientId === water.ingredientId)!.finalMixGrams;
    const M = mix.ingredients.find((i) => i.ingredientId === milk.ingredientId)!.finalMixGrams;
    // Heat balance (common practice, treating milk as water): I = [W (T_tap − T) + M (T_milk − T)] ÷ (T_tap + 80); without
    // milk it is the plain formula, ice = W × (T_supply − T_wanted) ÷ (T_supply + 80).
    expect(mix.liquid).toMatchObject({ action: "ice", waterIngredientId: water.ingredientId, otherIngredientIds: [milk.ingredientId] });
    expect(M).toBeGreaterThan(0);
    expect(mix.liquid!.iceGrams).toBeCloseTo((W * (20 - 4) + M * (8 - 4)) / (20 + 80), 0);
    expect(mix.liquid!.iceGrams).toBeGreaterThan(iceGrams(W, 20, 4)); // the milk's share of the cooling is carried by the ice
    // Milk bread has no water line: its milk is chilled, never iced.
    const milkBread = plan.doughs.find((d) => d.name === "Milk bread")!;
    expect(milkBread.mixes[0].liquidTempC).toBe(4);
    expect(milkBread.mixes[0].liquid).toMatchObject({ action: "chill", iceGrams: 0, chillToC: 4, waterIngredientId: null });
  });

  it("keeps the supply temperatures when a save leaves them out (extra pans), and refuses impossible ones", async () => {
    const res = await put({ extraPans, roomC: 22, flourC: 20, pasteC: 30 });
    expect(res.body.plan.inputs).toMatchObject({ tapC: 20, milkC: 8 });
    const bad = await put({ extraPans: {}, roomC: 22, flourC: 20, pasteC: 30, tapC: 75 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.tapC).toBe("Tap water temperature can be at most 60.");
  });
});

describe("internal temperature readings", () => {
  it("records the reading per oven load with the server's time, clears it, and refuses the implausible", async () => {
    const post = (body: object) => t.http().post(`/api/production/bake-days/${SAT}/progress`).set(auth(token)).send(body);
    const ok = await post({ kind: "internal", key: "2", valueC: 91.26 });
    expect(ok.status).toBe(200);
    expect(ok.body.progress.internal).toEqual({ "2": { c: 91.3, at: new Date(NOW).toISOString() } });
    const plan = await t.http().get("/api/production/plan").query({ date: SAT }).set(auth(token));
    expect(plan.body.plan.progress.internal["2"].c).toBe(91.3);
    expect((await post({ kind: "internal", key: "2", valueC: 400 })).status).toBe(400);
    expect((await post({ kind: "internal", key: "two", valueC: 90 })).status).toBe(400);
    const cleared = await post({ kind: "internal", key: "2", valueC: null });
    expect(cleared.body.progress.internal).toEqual({});
    // Ticks still work beside the readings.
    expect((await post({ kind: "wave", key: "1", done: true })).body.progress).toMatchObject({ waves: [1], internal: {} });
  });
});

describe("formula inputs", () => {
  const milkBread = async () => {
    const list = await t.http().get("/api/formulas").set(auth(token));
    return list.body.formulas.find((f: { name: string }) => f.name === "Milk bread");
  };
  const body = (f: Record<string, any>, over: Record<string, unknown>) => ({
    name: f.name, lossPercent: f.lossPercent, ddtC: f.ddtC, frictionC: f.frictionC, targetInternalC: f.targetInternalC, paste: f.paste,
    lines: f.lines.map((l: { ingredientId: number; percent: number }) => ({ ingredientId: l.ingredientId, percent: l.percent })), steps: f.steps, note: "", ...over,
  });

  it("refuses a paste cooked below 60 °C, where wheat starch does not gelatinise (common practice: 60–70 °C)", async () => {
    const f = await milkBread();
    const res = await t.http().put(`/api/formulas/${f.id}`).set(auth(token)).send(body(f, { paste: { ...f.paste, cookToC: 40 } }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields["paste.cookToC"]).toMatch(/60–100 °C: below about 60 °C the wheat starch does not gelatinize/);
  });

  it("accepts a friction factor of 26 (the baker decides; the form warns), since it is a valid °C value", async () => {
    const f = await milkBread();
    const res = await t.http().put(`/api/formulas/${f.id}`).set(auth(token)).send(body(f, { frictionC: 26 }));
    expect(res.status).toBe(200);
    expect(res.body.formula.frictionC).toBe(26);
  });
});
