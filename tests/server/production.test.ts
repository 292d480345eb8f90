import { startTestApp, makeAccount, makeBakery, makeProduct, makeUser, tokenFor, auth, type TestApp } from "./helpers/app";
import { Order } from "../../server/orders/order.entity";
import { OrderLine } from "../../server/orders/order-line.entity";
import { ALLERGENS } from "../../shared/allergens";
import { Product } from "../../server/catalog/product.entity";
import { seedDemo } from "../../server/seed/demo";
import { seedHistory } from "../../server/seed/history";
import { materialiseAll } from "../../server/orders/standing.service";
import { scheduleProblems } from "../shared/schedule-checks";

/** Clock: Wed 10 Jun 2026 10:00 CDT. Thu 11 Jun's cut-off: Wed 14:00 CDT. */
const NOW = "2026-06-10T15:00:00Z";
const THU = "2026-06-11";
let t: TestApp;
let baker: string;
let owner: string;
let buyer: string;
const ing: Record<string, number> = {};

beforeAll(async () => {
  t = await startTestApp({ now: NOW });
  await makeBakery(t.ds, { name: "Plan Bakery" });
  baker = await tokenFor(t, await makeUser(t.ds, "baker"));
  owner = await tokenFor(t, await makeUser(t.ds, "owner"));
  buyer = await tokenFor(t, await makeUser(t.ds, "buyer"));
});
afterAll(() => t.close());

const post = (url: string, body: object, token = baker) => t.http().post(url).set(auth(token)).send(body);

describe("ingredient library", () => {
  it("adds ingredients with kind, water content, allergens and purchase pack", async () => {
    const add = async (key: string, body: object) => {
      const res = await post("/api/ingredients", body);
      expect(res.status).toBe(201);
      ing[key] = res.body.ingredient.id;
    };
    await add("flour", { name: "Bread flour", kind: "flour", waterPercent: 12, allergens: ["wheat", "gluten"], packName: "25 kg sack", packGrams: 25000, packCostCents: 2450 });
    await add("milk", { name: "Whole milk", kind: "liquid", waterPercent: 88, allergens: ["milk"], packName: "1 gal jug", packGrams: 3900, packCostCents: 489 });
    await add("butter", { name: "Butter", kind: "fat", waterPercent: 16, allergens: ["milk"], packName: "1 lb block", packGrams: 454, packCostCents: 520 });
    await add("egg", { name: "Whole egg", kind: "egg", waterPercent: 76, allergens: ["egg"], packName: "5 lb carton", packGrams: 2268, packCostCents: 1295 });
    await add("sugar", { name: "Sugar", kind: "sugar", waterPercent: 0, packName: "25 lb bag", packGrams: 11340 });
    await add("salt", { name: "Salt", kind: "salt", waterPercent: 0, packName: "3 lb box", packGrams: 1361 });
    await add("yeast", { name: "Yeast", kind: "leavening", waterPercent: 5, packName: "1 lb pack", packGrams: 454 });
    const bad = await post("/api/ingredients", { name: "", kind: "rock", waterPercent: 120, packName: "", packGrams: -1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["kind", "name", "packGrams", "packName", "waterPercent"]);
    expect((await t.http().get("/api/ingredients").set(auth(buyer))).status).toBe(403);
  });
});

let formulaId: number;
const formula = () => ({
  name: "Milk bread", lossPercent: 2, ddtC: 26, frictionC: 12, targetInternalC: 89,
  paste: { flourIngredientId: ing.flour, liquidIngredientId: ing.milk, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
  lines: [
    { ingredientId: ing.flour, percent: 100 }, { ingredientId: ing.milk, percent: 60 }, { ingredientId: ing.egg, percent: 10 },
    { ingredientId: ing.butter, percent: 10 }, { ingredientId: ing.sugar, percent: 10 }, { ingredientId: ing.salt, percent: 2 }, { ingredientId: ing.yeast, percent: 1.5 },
  ],
  steps: [
    { kind: "paste", minutes: 40 }, { kind: "mix", minutes: 15 }, { kind: "bulk", minutes: 60 }, { kind: "divide", minutes: 20 }, { kind: "bench", minutes: 10 },
    { kind: "shape", minutes: 20 }, { kind: "proof", minutes: 50 }, { kind: "wash", minutes: 5 }, { kind: "bake", minutes: 27, temperatureC: 177 }, { kind: "cool", minutes: 30 },
  ],
});

describe("formulas", () => {
  it("creates a formula and answers GET /api/formulas/:id in the documented shape, with derived figures", async () => {
    const res = await post("/api/formulas", formula());
    expect(res.status).toBe(201);
    formulaId = res.body.formula.id;
    const got = await t.http().get(`/api/formulas/${formulaId}`).set(auth(owner));
    expect(got.body.formula).toMatchObject({
      id: formulaId, name: "Milk bread", lossPercent: 2, ddtC: 26, frictionC: 12, version: 1,
      paste: { flourIngredientId: ing.flour, liquidIngredientId: ing.milk, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
      lines: expect.arrayContaining([{ ingredientId: ing.flour, name: "Bread flour", kind: "flour", percent: 100 }]),
      figures: { totalPercent: 193.5, flourPercent: 100, hydrationPercent: 60, pasteSharePercent: 5, doughYieldPerKgFlour: 1935 },
      allergens: ["gluten", "wheat", "egg", "milk"],
    });
    expect(got.body.formula.steps).toHaveLength(10);
  });

  it("refuses invalid formulas with field messages", async () => {
    const f = formula();
    const flour90 = await post("/api/formulas", { ...f, name: "Bad 1", lines: f.lines.map((l) => (l.ingredientId === ing.flour ? { ...l, percent: 90 } : l)) });
    expect(flour90.status).toBe(400);
    expect(flour90.body.error.fields.lines).toMatch(/add up to 90 %/);
    const negative = await post("/api/formulas", { ...f, name: "Bad 2", lines: [...f.lines.slice(0, 6), { ingredientId: ing.yeast, percent: -1 }] });
    expect(negative.body.error.fields["lines.6.percent"]).toMatch(/more than 0/);
    const unknown = await post("/api/formulas", { ...f, name: "Bad 3", lines: [...f.lines, { ingredientId: 99999, percent: 1 }] });
    expect(unknown.body.error.fields["lines.7.ingredientId"]).toMatch(/not in the library/);
    const paste = await post("/api/formulas", { ...f, name: "Bad 4", paste: { ...f.paste, flourPercent: 20 } });
    expect(paste.body.error.fields["paste.liquidRatio"]).toMatch(/needs 100 % liquid/);
    const missing = await post("/api/formulas", { ...f, name: "Bad 5", lines: [{ ingredientId: ing.flour }] });
    expect(missing.status).toBe(400);
    expect((await post("/api/formulas", f, buyer)).status).toBe(403);
  });

  it("keeps history: an edit is a new version, the old one stays readable", async () => {
    const f = formula();
    const res = await t.http().put(`/api/formulas/${formulaId}`).set(auth(owner)).send({ ...f, lines: f.lines.map((l) => (l.ingredientId === ing.butter ? { ...l, percent: 12 } : l)), note: "More butter" });
    expect(res.body.formula.version).toBe(2);
    const history = await t.http().get(`/api/formulas/${formulaId}/history`).set(auth(baker));
    expect(history.body.versions.map((v: { version: number; note: string }) => [v.version, v.note])).toEqual([[2, "More butter"], [1, ""]]);
    const v1 = await t.http().get(`/api/formulas/${formulaId}?version=1`).set(auth(baker));
    expect(v1.body.formula.lines.find((l: { ingredientId: number }) => l.ingredientId === ing.butter).percent).toBe(10);
    // back to the original body for the plan checks below
    await t.http().put(`/api/formulas/${formulaId}`).set(auth(owner)).send({ ...f, note: "Back to 10 %" });
  });
});

describe("allergen derivation", () => {
  it("each allergen of the fixed list reaches the product from an ingredient carrying it, plus the product's own may-contain note", async () => {
    const ids: number[] = [];
    for (const a of ALLERGENS) {
      const res = await post("/api/ingredients", { name: `Carrier of ${a.code}`, kind: a.code === "wheat" || a.code === "gluten" ? "flour" : "other", waterPercent: 0, allergens: [a.code], packName: "bag", packGrams: 1000 });
      ids.push(res.body.ingredient.id);
    }
    const flourIds = ids.filter((_, i) => ALLERGENS[i].code === "wheat" || ALLERGENS[i].code === "gluten");
    const f = await post("/api/formulas", {
      name: "Everything dough", lossPercent: 2, ddtC: 26, frictionC: 12, paste: null, steps: [],
      lines: ids.map((id) => ({ ingredientId: id, percent: flourIds.includes(id) ? 50 : 1 })),
    });
    expect(f.status).toBe(201);
    const product = await makeProduct(t.ds, { name: "Everything bun", formulaId: f.body.formula.id, allergens: "", mayContain: "traces of mustard seed from shared lines" });
    const got = await t.http().get(`/api/products/${product.id}`).set(auth(buyer));
    expect(got.body.product.allergens).toEqual(ALLERGENS.map((a) => a.code));
    expect(got.body.product.mayContain).toBe("traces of mustard seed from shared lines");
    // Remove one carrier: its allergen no longer reaches the product.
    const without = ids.filter((_, i) => ALLERGENS[i].code !== "sesame");
    await t.http().put(`/api/formulas/${f.body.formula.id}`).set(auth(baker)).send({ name: "Everything dough", lossPercent: 2, ddtC: 26, frictionC: 12, paste: null, steps: [], lines: without.map((id) => ({ ingredientId: id, percent: flourIds.includes(id) ? 50 : 1 })) });
    const after = await t.http().get(`/api/products/${product.id}`).set(auth(buyer));
    expect(after.body.product.allergens).not.toContain("sesame");
    expect(after.body.product.allergens).toHaveLength(ALLERGENS.length - 1);
  });
});

describe("the plan for a bake day", () => {
  let rolls: { id: number };
  beforeAll(async () => {
    rolls = await makeProduct(t.ds, { name: "Dinner rolls", piecesPerUnit: 15, pieceGrams: 67, unitsPerPan: 1, formulaId, sortOrder: 0 });
    // Two accounts' orders for Thursday: 6 + 4 trays.
    for (const [qty, status] of [[6, "locked"], [4, "open"]] as const) {
      const acct = await makeAccount(t.ds);
      const o = await t.ds.getRepository(Order).save(t.ds.getRepository(Order).create({ accountId: acct.id, deliveryDate: THU, status, totalCents: qty * 1800, source: "one_off", editedByHand: false, createdById: null, poNumber: null, note: null }));
      await t.ds.getRepository(OrderLine).insert({ orderId: o.id, productId: rolls.id, productName: "Dinner rolls", saleUnit: "tray", quantity: qty, unitPriceCents: 1800, lineTotalCents: qty * 1800 });
    }
  });

  it("computes pans, dough, paste, mixes, liquid temperature and timeline; not final before the cut-off", async () => {
    await t.http().put(`/api/production/bake-days/${THU}`).set(auth(baker)).send({ extraPans: { [rolls.id]: 1 }, roomC: 24, flourC: 22, pasteC: 30 });
    const res = await t.http().get(`/api/production/plan?date=${THU}`).set(auth(baker));
    expect(res.status).toBe(200);
    const plan = res.body.plan;
    expect(plan).toMatchObject({ date: THU, final: false, frozen: false });
    expect(plan.products).toEqual([expect.objectContaining({ productId: rolls.id, name: "Dinner rolls", units: 10, extraPans: 1, pans: 11, pieces: 165, pieceGrams: 67, formulaId, openUnits: 4 })]);
    // The same numbers as the shared arithmetic (checked against worked examples in tests/shared/production.test.ts).
    expect(plan.doughs[0]).toMatchObject({ formulaId, formulaVersion: 3, doughGrams: 11281, flourGrams: 5830, paste: { flourGrams: 291, liquidGrams: 1457, cookToC: 65 } });
    expect(plan.doughs[0].mixes).toHaveLength(1); // default mixer 20 kg
    expect(plan.doughs[0].mixes[0].liquidTempC).toBe(16);
    expect(plan.ingredients.find((i: { name: string }) => i.name === "Bread flour").grams).toBe(5830);
    // Without bakehouse settings: one 20 kg mixer, one oven of six pan slots, 30 min packing (settings.service defaults).
    const bake = plan.timeline.filter((e: { step: string }) => e.step === "bake");
    expect(bake).toHaveLength(2); // 11 pans, one oven of 6 slots
    expect(plan.schedule.ovenLoads.map((l: { pans: number }) => l.pans).sort()).toEqual([5, 6]);
    // Every step ends by dispatch less the packing time; the last cooling ends exactly then.
    expect(plan.inputs).toMatchObject({ dispatchAt: "2026-06-11T06:30:00.000-05:00", packingMinutes: 30, packFrom: "2026-06-11T06:00:00.000-05:00" });
    const last = Math.max(...plan.timeline.map((e: { endsAt: string }) => Date.parse(e.endsAt)));
    expect(last).toBe(Date.parse("2026-06-11T06:00:00.000-05:00"));
    // The weigh-out card carries its own time on the timeline.
    const mixStep = plan.timeline.find((e: { step: string }) => e.step === "mix");
    expect(plan.doughs[0].mixes[0].scheduled).toMatchObject({ startsAt: mixStep.startsAt, endsAt: mixStep.endsAt, mixerName: "Mixer" });
  });

  it("splits the dough into equal mixes when the mixer is smaller", async () => {
    const before = (await t.http().get("/api/production/settings").set(auth(owner))).body.settings;
    expect((await t.http().put("/api/production/settings").set(auth(owner)).send({ ...before, mixers: [{ name: "Small spiral", capacityKg: 5 }] })).status).toBe(200);
    const plan = (await t.http().get(`/api/production/plan?date=${THU}`).set(auth(baker))).body.plan;
    expect(plan.doughs[0].mixes).toHaveLength(3); // 11,281 g ÷ 5 kg
    for (const i of plan.doughs[0].ingredients) {
      const sum = plan.doughs[0].mixes.reduce((s: number, m: { ingredients: { ingredientId: number; grams: number }[] }) => s + m.ingredients.find((x) => x.ingredientId === i.ingredientId)!.grams, 0);
      expect(Math.round(sum * 10) / 10).toBe(i.grams);
    }
    // One mixer: the three mixes follow each other, each its own mix step.
    const mixSteps = plan.timeline.filter((e: { step: string }) => e.step === "mix").sort((a: { startsAt: string }, b: { startsAt: string }) => Date.parse(a.startsAt) - Date.parse(b.startsAt));
    expect(mixSteps.map((e: { mix: number }) => e.mix).sort()).toEqual([1, 2, 3]);
    for (let k = 1; k < mixSteps.length; k++) expect(Date.parse(mixSteps[k].startsAt)).toBeGreaterThanOrEqual(Date.parse(mixSteps[k - 1].endsAt));
    await t.http().put("/api/production/settings").set(auth(owner)).send({ ...before, mixers: [{ name: "Mixer", capacityKg: 20 }] });
  });

  it("freezes at the cut-off: a formula edit never silently changes it; recalculating on purpose shows what changed", async () => {
    t.clock.set("2026-06-10T19:00:00Z");
    const frozen = (await t.http().get(`/api/production/plan?date=${THU}`).set(auth(baker))).body.plan;
    expect(frozen).toMatchObject({ frozen: true, final: false }); // one order still open
    const f = formula();
    await t.http().put(`/api/formulas/${formulaId}`).set(auth(owner)).send({ ...f, lines: f.lines.map((l) => (l.ingredientId === ing.sugar ? { ...l, percent: 12 } : l)) });
    const still = (await t.http().get(`/api/production/plan?date=${THU}`).set(auth(baker))).body.plan;
    expect(still.doughs[0].formulaVersion).toBe(3);
    expect(still.doughs[0].doughGrams).toBe(frozen.doughs[0].doughGrams);
    expect(still.changes).toEqual(expect.arrayContaining([expect.stringMatching(/formula version 3 → 4/)]));
    const recalc = await t.http().post(`/api/production/plan/recalculate?date=${THU}`).set(auth(baker));
    expect(recalc.body.plan.doughs[0].formulaVersion).toBe(4);
    expect(recalc.body.plan.changes).toEqual(expect.arrayContaining([expect.stringMatching(/formula version 3 → 4/)]));
    t.clock.set(NOW);
  });

  it("ticks mixes and waves off as done", async () => {
    const res = await post(`/api/production/bake-days/${THU}/progress`, { kind: "mix", key: `${formulaId}:1`, done: true });
    expect(res.body.progress).toEqual({ mixes: [`${formulaId}:1`], waves: [] });
    await post(`/api/production/bake-days/${THU}/progress`, { kind: "wave", key: "1", done: true });
    const plan = (await t.http().get(`/api/production/plan?date=${THU}`).set(auth(baker))).body.plan;
    expect(plan.progress).toEqual({ mixes: [`${formulaId}:1`], waves: [1] });
  });

  it("forecasts 7 days of ingredients in purchase packs, rounded up", async () => {
    const res = await t.http().get("/api/production/forecast?from=2026-06-11").set(auth(owner));
    expect(res.status).toBe(200);
    const flour = res.body.forecast.items.find((i: { name: string }) => i.name === "Bread flour");
    expect(flour.packs).toBe(Math.ceil(flour.grams / 25000));
    const butter = res.body.forecast.items.find((i: { name: string }) => i.name === "Butter");
    expect(butter.packs).toBe(Math.ceil(butter.grams / 454));
    expect(butter.costCents).toBe(butter.packs * 520);
  });

  it("renders the production sheet as a PDF", async () => {
    const res = await t.http().get(`/api/production/plan.pdf?date=${THU}&units=us`).set(auth(baker)).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (c: Buffer) => chunks.push(c));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    expect((res.body as Buffer).subarray(0, 5).toString()).toBe("%PDF-");
    expect((res.body as Buffer).length).toBeGreaterThan(3000);
  });

  it("is for the kitchen only", async () => {
    expect((await t.http().get(`/api/production/plan?date=${THU}`).set(auth(buyer))).status).toBe(403);
    expect((await t.http().get("/api/production/plan?date=2026-02-30").set(auth(baker))).status).toBe(400);
  });
});

describe("bakehouse settings", () => {
  const valid = () => ({
    dispatchTime: "06:30", shiftStart: "02:00", packingMinutes: 40,
    mixers: [{ name: "Spiral mixer", capacityKg: 20 }, { name: "Planetary", capacityKg: 12.5 }],
    ovens: [
      { name: "Deck oven", capacity: { kind: "area", areaCm2: 9100 }, tempChangeMinutes: 20, loadMinutes: 3, unloadMinutes: 3 },
      { name: "Convection oven", capacity: { kind: "slots", slots: ["Shelf 1", "Shelf 2", "Shelf 3"], slotLengthMm: 460, slotWidthMm: 335 }, tempChangeMinutes: 10, loadMinutes: 2, unloadMinutes: 2 },
    ],
    crew: { people: 3, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
    retard: [] as { formulaId: number; hours: number }[],
  });

  it("saves mixers, ovens by area or named slots, the crew, packing, shift start and retard, and answers them back", async () => {
    const res = await t.http().put("/api/production/settings").set(auth(owner)).send({ ...valid(), retard: [{ formulaId, hours: 12 }] });
    expect(res.status).toBe(200);
    const got = (await t.http().get("/api/production/settings").set(auth(baker))).body.settings;
    expect(got).toMatchObject({ ...valid(), retard: [{ formulaId, hours: 12 }] });
    expect(got.mixers.map((m: { id: number }) => typeof m.id)).toEqual(["number", "number"]);
    expect((await t.http().put("/api/production/settings").set(auth(baker)).send(valid())).status).toBe(403);
  });

  it("refuses settings that cannot work, with a message at each field", async () => {
    const bad = valid();
    const res = await t.http().put("/api/production/settings").set(auth(owner)).send({
      ...bad, shiftStart: "2:00", packingMinutes: -5, mixers: [{ name: "", capacityKg: 0 }],
      ovens: [{ ...bad.ovens[1], capacity: { kind: "slots", slots: [], slotLengthMm: 10, slotWidthMm: 335 } }],
      crew: { ...bad.crew, people: 0 }, retard: [{ formulaId, hours: 30 }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      shiftStart: "Use a 24-hour time such as 06:30.",
      packingMinutes: "Packing and loading minutes: at least 0.",
      "mixers.0.name": "Name the mixer.",
      "mixers.0.capacityKg": "Mixer capacity (kg) must be at least 1.",
      "ovens.0.capacity.slots": "Name at least one pan slot.",
      "ovens.0.capacity.slotLengthMm": "Slot length (mm): at least 50.",
      "crew.people": "People on the shift: at least 1.",
      "retard.0.hours": "Hours in the retarder can be at most 16.",
    });
    expect((await t.http().put("/api/production/settings").set(auth(owner)).send({ ...valid(), mixers: [] })).body.error.fields.mixers).toBe("Add at least one mixer.");
    const unknown = await t.http().put("/api/production/settings").set(auth(owner)).send({ ...valid(), retard: [{ formulaId: 99999, hours: 12 }] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.retard).toBe("Choose doughs from the formulas.");
  });

  it("plans with them: a retarded dough is mixed and shaped the day before; a late shift start is a conflict with an earlier start", async () => {
    await t.http().put("/api/production/settings").set(auth(owner)).send({ ...valid(), retard: [{ formulaId, hours: 12 }] });
    // Thursday's plan is frozen by now (the cut-off test above): recalculate it on purpose with the new settings.
    const retarded = (await t.http().post(`/api/production/plan/recalculate?date=${THU}`).set(auth(baker))).body.plan;
    expect(retarded.timeline.find((e: { step: string }) => e.step === "retard")).toBeTruthy();
    expect(retarded.timeline.filter((e: { step: string; dayBefore: boolean }) => e.step === "mix").every((e: { dayBefore: boolean }) => e.dayBefore)).toBe(true);
    expect(retarded.doughs[0].mixes[0].scheduled.dayBefore).toBe(true);

    await t.http().put("/api/production/settings").set(auth(owner)).send({ ...valid(), shiftStart: "04:30" });
    const late = (await t.http().post(`/api/production/plan/recalculate?date=${THU}`).set(auth(baker))).body.plan;
    const first = Math.min(...late.timeline.map((e: { startsAt: string }) => Date.parse(e.startsAt)));
    const short = (Date.parse("2026-06-11T04:30:00.000-05:00") - first) / 60_000;
    expect(short).toBeGreaterThan(0);
    expect(late.schedule.conflicts[0]).toMatchObject({ kind: "shift_start", minutes: short });
    expect(late.schedule.earlierStart.minutes).toBe(short);
    expect(Date.parse(late.schedule.earlierStart.startsAt)).toBe(first);
    expect(late.schedule.earlierStart.text).toMatch(/^Start (\d+ h )?(\d+ min )?earlier, at \d{1,2}:\d\d [AP]M\.$/);
    expect(late.warnings).toContain(late.schedule.conflicts[0].message);
    expect(late.inputs.shiftStartAt).toBe("2026-06-11T04:30:00.000-05:00");

    // Back to the defaults' shape for anything after.
    await t.http().put("/api/production/settings").set(auth(owner)).send({ ...valid(), shiftStart: null, mixers: [{ name: "Mixer", capacityKg: 20 }] });
  });
});

describe("the seeded demo over its horizon", () => {
  /** Tue 1 Dec 2026, 12:00 CST: the demo's standing orders run from 2 Nov; the horizon is 28 days. */
  let d: TestApp;
  let token: string;
  beforeAll(async () => {
    d = await startTestApp({ now: "2026-12-01T18:00:00Z" });
    await seedDemo(d.ds);
    await seedHistory(d.ctx);
    await materialiseAll(d.ctx);
    token = await tokenFor(d, await makeUser(d.ds, "owner"));
  });
  afterAll(() => d.close());

  const demoDates = async () => {
    const rows: { deliveryDate: string }[] = await d.ds.query("SELECT DISTINCT deliveryDate FROM customer_order WHERE deliveryDate >= '2026-12-01' AND deliveryDate <= '2026-12-29' AND status IN ('open','locked','delivered') ORDER BY deliveryDate");
    return rows.map((r) => r.deliveryDate);
  };

  it("every demo date: no overlaps on a mixer, an oven or the crew; one mix step per card; loads fit; all done before packing", async () => {
    const settings = (await d.http().get("/api/production/settings").set(auth(token))).body.settings;
    expect(settings).toMatchObject({ shiftStart: "23:30", packingMinutes: 45, crew: { people: 3 } });
    const products = await d.ds.getRepository(Product).find();
    const dates = await demoDates();
    expect(dates.length).toBeGreaterThanOrEqual(15);
    let loads = 0;
    for (const date of dates) {
      const plan = (await d.http().get(`/api/production/plan?date=${date}`).set(auth(token))).body.plan;
      const problems = scheduleProblems({
        entries: plan.timeline, schedule: plan.schedule, ovens: settings.ovens, packingMinutes: settings.packingMinutes,
        cards: plan.doughs.flatMap((x: { formulaId: number; mixes: { index: number }[] }) => x.mixes.map((m) => ({ formulaId: x.formulaId, index: m.index }))),
        products: plan.products.map((p: { productId: number; pans: number; formulaId: number | null }) => {
          const row = products.find((x) => x.id === p.productId)!;
          return { productId: p.productId, pans: p.pans, formulaId: p.formulaId, panLengthMm: row.panLengthMm, panWidthMm: row.panWidthMm };
        }),
      });
      expect({ date, problems }).toEqual({ date, problems: [] });
      for (const x of plan.doughs) for (const m of x.mixes) expect(m.scheduled).toBeTruthy();
      // The demo bakehouse's shift (23:30 the evening before) holds every demo day.
      expect({ date, conflicts: plan.schedule.conflicts }).toEqual({ date, conflicts: [] });
      loads += plan.schedule.ovenLoads.length;
    }
    expect(loads).toBeGreaterThan(dates.length);
  });

  it("bake and cool times of the demo products sit in the usual ranges (common practice, no source)", async () => {
    // Small separate buns about 15–18 min; a 900 g lidded (Pullman) loaf 35–45 min; 1–2 h cooling before slicing
    // or bagging. Pull-apart rolls baked touching in a 9×13 pan take longer than separate buns (from memory: about
    // 20–30 min), and are held to that.
    const seen = new Map<string, { bakeMinutes: number; coolMinutes: number; pieceGrams: number; panName: string }>();
    for (const date of await demoDates()) {
      const plan = (await d.http().get(`/api/production/plan?date=${date}`).set(auth(token))).body.plan;
      for (const p of plan.products) seen.set(p.name, p);
    }
    expect(seen.size).toBe(7);
    for (const [name, p] of seen) {
      expect({ name, cool: p.coolMinutes >= 60 && p.coolMinutes <= 120 }).toEqual({ name, cool: true });
      if (/buns/i.test(name)) expect({ name, bake: p.bakeMinutes >= 15 && p.bakeMinutes <= 18 }).toEqual({ name, bake: true });
      else if (/Pullman/.test(p.panName) && p.pieceGrams >= 800) expect({ name, bake: p.bakeMinutes >= 35 && p.bakeMinutes <= 45 }).toEqual({ name, bake: true });
      else expect({ name, bake: p.bakeMinutes >= 20 && p.bakeMinutes <= 30 }).toEqual({ name, bake: true });
    }
    expect(seen.get("Pullman milk loaf")).toMatchObject({ pieceGrams: 900 });
  });

  it("says what conflicts when the shift starts too late for the day", async () => {
    const settings = (await d.http().get("/api/production/settings").set(auth(token))).body.settings;
    await d.http().put("/api/production/settings").set(auth(token)).send({ ...settings, shiftStart: "03:30" });
    const saturday = (await demoDates()).find((x) => new Date(`${x}T12:00:00Z`).getUTCDay() === 6)!;
    const plan = (await d.http().get(`/api/production/plan?date=${saturday}`).set(auth(token))).body.plan;
    const c = plan.schedule.conflicts[0];
    expect(c).toMatchObject({ kind: "shift_start" });
    expect(c.message).toMatch(/^The day does not fit the shift: .+ has to start at (Fri )?\d{1,2}:\d\d [AP]M, (\d+ h )?(\d+ min )?before the shift starts at 3:30 AM/);
    expect(c.message).toContain(plan.schedule.earlierStart.text);
    expect(plan.schedule.earlierStart.minutes).toBe(c.minutes);
    await d.http().put("/api/production/settings").set(auth(token)).send(settings);
  });
});
