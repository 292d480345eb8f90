/**
 * Production plan at scale: a delivery date with N accounts × 10 products (N = 20, 200, 2,000 → 200,
 * 2,000 and 20,000 order lines). Reports GET /api/production/plan p50/p99 for each size and how it grows,
 * and, as the baseline, the bare `SELECT productId, SUM(quantity) … GROUP BY` over the same rows. The plan includes
 * the day's one schedule (shared/schedule/); the scheduler's own time for a day of 10,000 pans is measured
 * in-process beside it (no database, no HTTP).
 *   node --import tsx bench/plan.ts     (needs the private MariaDB: npm start / npm run db)
 */
import "reflect-metadata";
import mysql from "mysql2/promise";
import bcrypt from "bcryptjs";
import { createDataSource } from "../server/db/data-source";
import { loadConfig } from "../server/config";
import { freePort, startServer, stop, summarise, waitHttp } from "./lib";
import { scheduleDay, type BakehouseResources, type ScheduleInput } from "../shared/schedule";
import type { StepSpec } from "../shared/production";

const SIZES = [20, 200, 2000];
const BENCH_STEPS: StepSpec[] = [{ kind: "paste", minutes: 40 }, { kind: "mix", minutes: 15 }, { kind: "bulk", minutes: 60 }, { kind: "shape", minutes: 20 }, { kind: "proof", minutes: 50 }, { kind: "bake", minutes: 27, temperatureC: 177 }, { kind: "cool", minutes: 30 }];
const BENCH_RESOURCES: BakehouseResources = {
  mixers: [{ id: 1, name: "Spiral mixer", capacityKg: 200 }],
  ovens: [1, 2, 3, 4].map((id) => ({ id, name: `Rack oven ${id}`, capacity: { kind: "area" as const, areaCm2: 38000 }, tempChangeMinutes: 20, loadMinutes: 3, unloadMinutes: 3 })),
  crew: { people: 6, divideMinutesPerPiece: 0.15, shapeMinutesPerPiece: 0.2, panMinutesPerPan: 0.5 },
  packingMinutes: 45,
  shiftStart: "22:00",
};

/** The scheduler alone on a day of `pans` pans (10 products of 15 × 67 g rolls in 9×13 pans, one dough): p50/p99 of `runs`. */
function schedulerAlone(pans: number, runs: number) {
  const each = pans / 10;
  const products = Array.from({ length: 10 }, (_, k) => ({ productId: k + 1, name: `Product ${k + 1}`, formulaId: 1, pans: each, pieces: each * 15, pieceGrams: 67, panLengthMm: 330, panWidthMm: 229, bakeTempC: null, bakeMinutes: null, coolMinutes: null }));
  const dough = products.reduce((s, p) => s + p.pieces * p.pieceGrams, 0) / 0.98;
  const n = Math.ceil(dough / 200_000);
  const input: ScheduleInput = {
    date: DATE, timeZone: "America/Chicago", dispatchTime: "06:30", resources: BENCH_RESOURCES,
    formulas: [{ id: 1, name: "Milk bread", steps: BENCH_STEPS, retardHours: null }], products,
    mixes: Array.from({ length: n }, (_, i) => ({ formulaId: 1, index: i + 1, doughGrams: dough / n })),
  };
  const ms: number[] = [];
  let out = scheduleDay(input);
  for (let i = 0; i < runs + 3; i++) {
    const s = performance.now();
    out = scheduleDay(input);
    if (i >= 3) ms.push(performance.now() - s);
  }
  const t = summarise(ms, 1);
  return { pans, mixes: n, ovenLoads: out.ovenLoads.length, timelineEntries: out.entries.length, p50ms: +t.p50.toFixed(1), p99ms: +t.p99.toFixed(1), maxMs: +t.max.toFixed(1) };
}
const RUNS = 30;
const DATE = "2030-06-14";

async function main() {
  const dbName = `panwise_bench_plan_${Date.now().toString(36)}`;
  const base = loadConfig().db;
  const admin = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password, database: undefined, multipleStatements: false });
  await admin.query(`CREATE DATABASE \`${dbName}\``);
  await admin.end();
  const ds = createDataSource({ ...base, database: dbName });
  await ds.initialize();
  await ds.runMigrations();
  // A wholesale-sized bake house: 4 rack ovens of about 50 9×13 pans a load (38,000 cm²), a 200 kg mixer, 6 people.
  await ds.query("INSERT INTO bakery (name, timeZone, currency) VALUES ('Bench Bakery', 'America/Chicago', 'USD')");
  await ds.query("INSERT INTO production_settings (id, crewPeople, divideMinutesPerPiece, shapeMinutesPerPiece, panMinutesPerPan, packingMinutes, shiftStart, retard) VALUES (1, ?, ?, ?, ?, ?, ?, '[]')",
    [BENCH_RESOURCES.crew.people, BENCH_RESOURCES.crew.divideMinutesPerPiece, BENCH_RESOURCES.crew.shapeMinutesPerPiece, BENCH_RESOURCES.crew.panMinutesPerPan, BENCH_RESOURCES.packingMinutes, BENCH_RESOURCES.shiftStart]);
  await ds.query("INSERT INTO bakehouse_mixer (name, capacityKg) VALUES ('Spiral mixer', 200)");
  for (const o of BENCH_RESOURCES.ovens) {
    await ds.query("INSERT INTO bakehouse_oven (name, capacityKind, areaCm2, slotNames, tempChangeMinutes, loadMinutes, unloadMinutes, sortOrder) VALUES (?, 'area', ?, '[]', ?, ?, ?, ?)", [o.name, o.capacity.kind === "area" ? o.capacity.areaCm2 : 0, o.tempChangeMinutes, o.loadMinutes, o.unloadMinutes, o.id]);
  }
  await ds.query("INSERT INTO ingredient (name, kind, waterPercent, packName, packGrams) VALUES ('Flour','flour',12,'sack',25000),('Milk','liquid',88,'jug',3900),('Butter','fat',16,'block',454),('Egg','egg',76,'carton',2268),('Sugar','sugar',0,'bag',11340),('Salt','salt',0,'box',1361),('Yeast','leavening',5,'pack',454)");
  const body = { name: "Milk bread", lossPercent: 2, ddtC: 26, frictionC: 12, targetInternalC: 89, paste: { flourIngredientId: 1, liquidIngredientId: 2, flourPercent: 5, liquidRatio: 5, cookToC: 65 },
    lines: [{ ingredientId: 1, percent: 100 }, { ingredientId: 2, percent: 60 }, { ingredientId: 4, percent: 10 }, { ingredientId: 3, percent: 10 }, { ingredientId: 5, percent: 10 }, { ingredientId: 6, percent: 2 }, { ingredientId: 7, percent: 1.5 }],
    steps: BENCH_STEPS };
  await ds.query("INSERT INTO formula (name, currentVersion) VALUES ('Milk bread', 1)");
  await ds.query("INSERT INTO formula_version (formulaId, version, body, note) VALUES (1, 1, ?, '')", [JSON.stringify(body)]);
  for (let p = 1; p <= 10; p++) {
    await ds.query("INSERT INTO product (name, description, saleUnit, piecesPerUnit, pieceGrams, panName, panLengthMm, panWidthMm, unitsPerPan, priceCents, allergens, mayContain, formulaId, sortOrder) VALUES (?, '', 'tray', 15, 67, 'pan', 330, 229, 1, 1800, '', '', 1, ?)", [`Product ${p}`, p]);
  }
  await ds.query("INSERT INTO user (email, passwordHash, role, name) VALUES ('baker@bench.test', ?, 'baker', 'Baker')", [bcrypt.hashSync("bench-password-1", 4)]);
  const port = await freePort();
  const server = startServer({ PORT: String(port), DB_NAME: dbName, SMTP_URL: `smtp://127.0.0.1:${await freePort()}`, LOG_LEVEL: "warn", PANWISE_NO_JOBS: "1" });
  const pool = mysql.createPool({ host: base.host, port: base.port, user: base.user, password: base.password, database: dbName, connectionLimit: 2 });
  const results: Record<string, unknown>[] = [];
  const sizes: { lines: number; pans: number; ovenLoads: number; bytes: number; timeline: number }[] = [];
  try {
    await waitHttp(`http://127.0.0.1:${port}/api/health`);
    const { token } = (await (await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: "baker@bench.test", password: "bench-password-1" }) })).json()) as { token: string };
    let accounts = 0;
    for (const size of SIZES) {
      // Grow the day to `size` accounts, each with one order of 10 lines.
      while (accounts < size) {
        const batch = Math.min(500, size - accounts);
        const values: unknown[] = [];
        for (let i = 0; i < batch; i++) values.push(`Bench ${accounts + i}`, "1 St", `b${accounts + i}@bench.test`);
        await ds.query(`INSERT INTO customer_account (businessName, deliveryAddress, billingEmail, notes) VALUES ${Array.from({ length: batch }, () => "(?, ?, ?, '')").join(",")}`, values);
        const ids: { id: number }[] = await ds.query("SELECT id FROM customer_account ORDER BY id DESC LIMIT ?", [batch]);
        await ds.query(`INSERT INTO customer_order (accountId, deliveryDate, status, totalCents) VALUES ${ids.map(() => "(?, ?, 'open', 0)").join(",")}`, ids.flatMap((r) => [r.id, DATE]));
        const orders: { id: number }[] = await ds.query("SELECT id FROM customer_order ORDER BY id DESC LIMIT ?", [batch]);
        const lines: unknown[] = [];
        for (const o of orders) for (let p = 1; p <= 10; p++) lines.push(o.id, p, `Product ${p}`, "tray", 1 + ((o.id + p) % 5), 1800, 1800);
        await ds.query(`INSERT INTO order_line (orderId, productId, productName, saleUnit, quantity, unitPriceCents, lineTotalCents) VALUES ${orders.flatMap(() => Array.from({ length: 10 }, () => "(?, ?, ?, ?, ?, ?, ?)")).join(",")}`, lines);
        accounts += batch;
      }
      const api: number[] = [];
      const bare: number[] = [];
      for (let i = 0; i < RUNS + 3; i++) {
        const s = performance.now();
        const r = await fetch(`http://127.0.0.1:${port}/api/production/plan?date=${DATE}`, { headers: { authorization: `Bearer ${token}` } });
        const plan = (await r.json()) as { plan: { products: { units: number; pans: number }[]; timeline: unknown[]; schedule: { ovenLoads: unknown[] } } };
        if (!r.ok || plan.plan.products.length !== 10) throw new Error(`plan failed: ${r.status}`);
        if (i === 0) sizes.push({ lines: size * 10, pans: plan.plan.products.reduce((n, p) => n + p.pans, 0), ovenLoads: plan.plan.schedule.ovenLoads.length, bytes: JSON.stringify(plan).length, timeline: plan.plan.timeline.length });
        if (i >= 3) api.push(performance.now() - s); // first runs warm up
        const b = performance.now();
        await pool.query("SELECT l.productId, SUM(l.quantity) AS units FROM customer_order o JOIN order_line l ON l.orderId = o.id WHERE o.deliveryDate = ? AND o.status IN ('open','locked','delivered') GROUP BY l.productId", [DATE]);
        if (i >= 3) bare.push(performance.now() - b);
      }
      const a = summarise(api, 1);
      const g = summarise(bare, 1);
      results.push({ accounts: size, orderLines: size * 10, planP50ms: +a.p50.toFixed(1), planP99ms: +a.p99.toFixed(1), groupByP50ms: +g.p50.toFixed(1), groupByP99ms: +g.p99.toFixed(1), ratioP50: +(a.p50 / g.p50).toFixed(1) });
    }
    const growth = (results[2].planP50ms as number) / (results[1].planP50ms as number);
    const scheduler = schedulerAlone(10_000, RUNS);
    console.log(JSON.stringify({ runsPerSize: RUNS, results, responses: sizes, growth2000to20000LinesP50: +growth.toFixed(2), schedulerFor10000Pans: scheduler, target: { p99At2000AccountsUnderMs: 300, met: (results[2].planP99ms as number) < 300, linearOrBetter: growth <= 10 } }, null, 2));
  } finally {
    await pool.end();
    await stop(server);
    await ds.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
    await ds.destroy();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
