import { DateTime } from "luxon";
import { In, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest } from "../http/errors";
import { BakeDay } from "./bake-day.entity";
import { Product } from "../catalog/product.entity";
import { getBakery } from "../bakery/bakery.service";
import { loadCalendarSettings } from "../calendar/calendar.service";
import { formulaSpec, ingredientInfo, ingredientLibrary } from "./formulas.service";
import { cutoffFor, localToday, addDays } from "../../shared/calendar";
import { expandRule } from "../../shared/recurrence";
import { Ingredient } from "./ingredient.entity";
import { DEFAULT_MILK_C, DEFAULT_TAP_C, liquidNeedsAttention, planDough, planProduct, roundGrams, type FormulaSpec, type PlannedProduct } from "../../shared/production";
import { liquidAdviceText } from "../../shared/cautions";
import { scheduleDay } from "../../shared/schedule";
import { loadProductionSettings, resourcesOf } from "./settings.service";
import type { PlanDto, PlanProgressDto, ProgressBody } from "../../shared/schemas/production";
import type { BakeDayInput, ForecastDto, PlanView } from "../../shared/contracts/production";
import { componentCards, componentTotals, resolveBake } from "../../shared/components";
import { componentLine, productMakeup } from "../catalog/components.service";

interface DayRow { productId: number; units: string; openUnits: string }

/** Units per product for a delivery date, summed in SQL (not a loop over rows). */
async function unitsByProduct(m: EntityManager, date: string): Promise<DayRow[]> {
  return m.query(
    `SELECT l.productId AS productId, SUM(l.quantity) AS units, SUM(CASE WHEN o.status = 'open' THEN l.quantity ELSE 0 END) AS openUnits
       FROM customer_order o JOIN order_line l ON l.orderId = o.id
      WHERE o.deliveryDate = ? AND o.status IN ('open', 'locked', 'delivered')
      GROUP BY l.productId`, [date]);
}

/** For writes: make sure the day's row exists (INSERT IGNORE, so two first writers never collide), then read it. */
async function bakeDayForWrite(m: EntityManager, date: string): Promise<BakeDay> {
  await m.query(`INSERT IGNORE INTO bake_day (date, extraPans, progress) VALUES (?, '{}', '{"mixes":[],"waves":[]}')`, [date]);
  return m.getRepository(BakeDay).findOneByOrFail({ date });
}

async function bakeDay(m: EntityManager, date: string): Promise<BakeDay> {
  const repo = m.getRepository(BakeDay);
  const found = await repo.findOneBy({ date });
  if (found) return found;
  return repo.create({ date, extraPans: "{}", roomC: "22", flourC: "20", pasteC: "30", tapC: String(DEFAULT_TAP_C), milkC: String(DEFAULT_MILK_C), frozenPlan: null, frozenAt: null, progress: JSON.stringify({ mixes: [], waves: [] }) });
}

/**
 * Standing-order quantities expected on a date from accounts that have no order row for it yet
 * (beyond the materialised horizon, or before the job has run). For the purchasing forecast.
 */
async function expectedStanding(m: EntityManager, date: string): Promise<DayRow[]> {
  const rows: { accountId: number; rrule: string; skipDates: string; productId: number; weekday: number; quantity: number }[] = await m.query(
    `SELECT s.accountId, s.rrule, s.skipDates, l.productId, l.weekday, l.quantity
       FROM standing_order s JOIN standing_order_line l ON l.standingOrderId = s.id
       JOIN customer_account a ON a.id = s.accountId AND a.status = 'active'
      WHERE s.active = 1 AND l.weekday = ?
        AND NOT EXISTS (SELECT 1 FROM customer_order o WHERE o.accountId = s.accountId AND o.deliveryDate = ?)`, [DateTime.fromISO(date).weekday, date]);
  const sums = new Map<number, number>();
  const closed = await m.query("SELECT 1 FROM bakery_closure WHERE date = ?", [date]);
  if (closed.length) return [];
  const ruleCache = new Map<string, boolean>();
  for (const r of rows) {
    const key = `${r.accountId}`;
    if (!ruleCache.has(key)) ruleCache.set(key, expandRule(r.rrule, date, date).length === 1 && !(JSON.parse(r.skipDates) as string[]).includes(date));
    if (ruleCache.get(key)) sums.set(r.productId, (sums.get(r.productId) ?? 0) + r.quantity);
  }
  return [...sums].map(([productId, units]) => ({ productId, units: String(units), openUnits: String(units) }));
}

/** Work the plan out from the day's orders and the current formula versions (or the versions given). */
export async function computePlan(ctx: AppContext, date: string, opts: { versions?: Map<number, number>; includeStanding?: boolean } = {}): Promise<PlanDto> {
  const versions = opts.versions;
  const m = ctx.dataSource.manager;
  const bakery = await getBakery(ctx, m);
  const settings = await loadCalendarSettings(ctx, m);
  const day = await bakeDay(m, date);
  const extra: Record<string, number> = JSON.parse(day.extraPans);
  const rows = await unitsByProduct(m, date);
  if (opts.includeStanding) {
    for (const s of await expectedStanding(m, date)) {
      const r = rows.find((x) => Number(x.productId) === s.productId);
      if (r) { r.units = String(Number(r.units) + Number(s.units)); r.openUnits = String(Number(r.openUnits) + Number(s.units)); }
      else rows.push(s);
    }
  }
  const wantedIds = [...new Set([...rows.map((r) => Number(r.productId)), ...Object.keys(extra).map(Number)])];
  const products = wantedIds.length ? await m.getRepository(Product).findBy({ id: In(wantedIds) }) : [];
  const byId = new Map(rows.map((r) => [Number(r.productId), r]));
  const planned: (PlannedProduct & { panName: string; openUnits: number })[] = products
    .sort((a, b) => a.sortOrder - b.sortOrder || a.name.localeCompare(b.name))
    .map((p) => ({
      ...planProduct({ productId: p.id, name: p.name, units: Number(byId.get(p.id)?.units ?? 0), extraPans: extra[p.id] ?? 0, unitsPerPan: p.unitsPerPan, piecesPerUnit: p.piecesPerUnit, pieceGrams: p.pieceGrams, formulaId: p.formulaId }),
      panName: p.panName,
      openUnits: Number(byId.get(p.id)?.openUnits ?? 0),
    }))
    .filter((p) => p.pans > 0 || p.units > 0);

  const warnings: string[] = [];
  const boughtIn = new Set(products.filter((p) => p.boughtIn).map((p) => p.id));
  for (const p of planned) if (!p.formulaId && !boughtIn.has(p.productId)) warnings.push(`${p.name} has no formula yet, so its dough is not planned. Give it one under Formulas, or mark it bought in on the product.`);
  const lib = await ingredientLibrary(m);
  const info = new Map([...lib].map(([id, i]) => [id, ingredientInfo(i)]));
  const formulaIds = [...new Set(planned.map((p) => p.formulaId).filter((x): x is number => !!x))];
  const formulas = new Map<number, FormulaSpec & { targetInternalC: number | null }>();
  for (const id of formulaIds) formulas.set(id, await formulaSpec(m, id, versions?.get(id)));
  // Each product's own bake and cooling, else its formula's (the version this plan uses): for the scheduler.
  const byProduct = new Map(products.map((p) => [p.id, p]));
  for (const p of planned) {
    const own = byProduct.get(p.productId)!;
    Object.assign(p, resolveBake(own, p.formulaId ? formulas.get(p.formulaId)?.steps : null));
  }
  // Components (toppings, washes, fillings, garnishes): one weigh-out card per component per product.
  const makeup = await productMakeup(m, products, lib);
  const cards = componentCards(
    planned.filter((p) => p.formulaId),
    planned.flatMap((p) => (makeup.get(p.productId)?.components ?? []).map((c) => ({ ...componentLine(c), productId: p.productId }))),
    (id) => lib.get(id)?.name ?? "?",
  );
  const temps = { roomC: Number(day.roomC), flourC: Number(day.flourC), pasteC: Number(day.pasteC), tapC: Number(day.tapC), milkC: Number(day.milkC) };
  // Doughs are split to fit the largest mixer; the schedule puts each mix on a mixer that holds it.
  const production = await loadProductionSettings(ctx, m);
  const mixerCapacityKg = Math.max(...production.mixers.map((x) => x.capacityKg));
  const doughs = formulaIds.map((id) => {
    const f = formulas.get(id)!;
    return { ...planDough(f, info, planned.filter((p) => p.formulaId === id), mixerCapacityKg, temps), targetInternalC: f.targetInternalC };
  });
  // The liquid's ice, chilling or warming is on each card (worded in the reader's units, shared/cautions.ts); a liquid that
  // cannot be reached is also a warning, which the screens and the PDF word the same way (liquidWarnings).
  for (const d of doughs) {
    for (const mix of d.mixes) {
      if (mix.liquid && liquidNeedsAttention(mix.liquid)) mix.liquidTempAdvice = liquidAdviceText(mix.liquid, "metric", (id) => lib.get(id)?.name ?? "liquid", !!d.paste);
    }
  }

  const totals = new Map<number, number>();
  for (const d of doughs) for (const i of d.ingredients) totals.set(i.ingredientId, (totals.get(i.ingredientId) ?? 0) + i.grams);
  const fromComponents = componentTotals(cards);
  for (const [id, g] of fromComponents) totals.set(id, (totals.get(id) ?? 0) + g);
  // One schedule for the day: every mix on a mixer, dividing and shaping on the crew, oven loads, back from dispatch.
  const retard = new Map(production.retard.map((r) => [r.formulaId, r.hours]));
  const { entries: timeline, warnings: scheduleWarnings, ...schedule } = scheduleDay({
    date,
    timeZone: bakery.timeZone,
    locale: bakery.locale,
    dispatchTime: production.dispatchTime,
    resources: resourcesOf(production),
    formulas: formulaIds.map((id) => ({ id, name: formulas.get(id)!.name, steps: formulas.get(id)!.steps, retardHours: retard.get(id) ?? null })),
    products: planned.filter((p) => p.formulaId).map((p) => {
      const own = byProduct.get(p.productId)!;
      return {
        productId: p.productId, name: p.name, formulaId: p.formulaId, pans: p.pans, pieces: p.pieces, pieceGrams: p.pieceGrams, panLengthMm: own.panLengthMm, panWidthMm: own.panWidthMm,
        bakeTempC: p.bakeTempC ?? null, bakeMinutes: p.bakeMinutes ?? null, coolMinutes: p.coolMinutes ?? null,
      };
    }),
    mixes: doughs.flatMap((d) => d.mixes.map((x) => ({ formulaId: d.formulaId, index: x.index, doughGrams: x.doughGrams }))),
  });
  if (!production.shiftStart) schedule.conflicts = schedule.conflicts.filter((c) => c.kind !== "shift_start");
  if (!production.shiftStart) schedule.earlierStart = null;
  for (const c of schedule.conflicts) warnings.push(c.message);
  warnings.push(...scheduleWarnings);
  const scheduledMix = new Map(schedule.mixes.map((x) => [`${x.formulaId}:${x.index}`, x]));
  for (const d of doughs) {
    d.mixes = d.mixes.map((x) => {
      const s = scheduledMix.get(`${d.formulaId}:${x.index}`);
      return { ...x, scheduled: s ? { startsAt: s.startsAt, endsAt: s.endsAt, mixerName: s.mixerName, pasteStartsAt: s.pasteStartsAt, dayBefore: s.dayBefore } : null };
    });
  }
  const cutoff = cutoffFor(date, settings);
  const now = ctx.clock.now();
  return {
    date,
    final: now.getTime() >= cutoff.toMillis() && planned.every((p) => p.openUnits === 0),
    frozen: false,
    frozenAt: null,
    computedAt: DateTime.fromJSDate(now, { zone: bakery.timeZone }).toISO()!,
    cutoffAt: cutoff.toISO()!,
    inputs: { ...temps, mixerCapacityKg, dispatchAt: schedule.dispatchAt, packingMinutes: production.packingMinutes, packFrom: schedule.packFrom, crewPeople: production.crew.people, shiftStartAt: production.shiftStart ? schedule.shiftStartsAt : null },
    products: planned.map((p) => ({
      productId: p.productId, name: p.name, units: p.units, extraPans: p.extraPans, pans: p.pans, pieces: p.pieces, pieceGrams: p.pieceGrams, formulaId: p.formulaId, panName: p.panName, openUnits: p.openUnits,
      bakeTempC: p.bakeTempC ?? null, bakeMinutes: p.bakeMinutes ?? null, coolMinutes: p.coolMinutes ?? null,
      allergens: makeup.get(p.productId)?.allergens.declared ?? [],
    })),
    doughs,
    ingredients: [...totals]
      .map(([ingredientId, grams]) => ({ ingredientId, name: lib.get(ingredientId)?.name ?? "?", kind: lib.get(ingredientId)?.kind, grams: roundGrams(grams), ...(fromComponents.has(ingredientId) ? { componentGrams: roundGrams(fromComponents.get(ingredientId)!) } : {}) }))
      .sort((a, b) => b.grams - a.grams),
    components: cards,
    timeline,
    schedule,
    warnings,
    progress: JSON.parse(day.progress),
  };
}

/** What the baker sees: the frozen plan once the cut-off has passed (frozen then, if not yet), else the live one. */
export async function getPlan(ctx: AppContext, date: string): Promise<PlanView> {
  const m = ctx.dataSource.manager;
  const settings = await loadCalendarSettings(ctx, m);
  const day = await bakeDay(m, date);
  const pastCutoff = ctx.clock.now().getTime() >= cutoffFor(date, settings).toMillis();
  if (!day.frozenPlan && pastCutoff && (await unitsByProduct(m, date)).length > 0) return { ...(await freeze(ctx, date)), changes: [] };
  if (day.frozenPlan) {
    const frozen = JSON.parse(day.frozenPlan) as PlanDto;
    const live = await computePlan(ctx, date);
    return { ...frozen, progress: JSON.parse(day.progress), frozen: true, frozenAt: day.frozenAt?.toISOString() ?? null, changes: diffPlans(frozen, live) };
  }
  return { ...(await computePlan(ctx, date)), changes: [] };
}

/** Freeze (or deliberately recalculate): store the plan with the formula versions it used. */
export async function freeze(ctx: AppContext, date: string): Promise<PlanView> {
  const m = ctx.dataSource.manager;
  const day = await bakeDayForWrite(m, date);
  const before = day.frozenPlan ? (JSON.parse(day.frozenPlan) as PlanDto) : null;
  const plan = await computePlan(ctx, date);
  const frozenAt = ctx.clock.now();
  await m.getRepository(BakeDay).update({ date }, { frozenPlan: JSON.stringify(plan), frozenAt });
  return { ...plan, frozen: true, frozenAt: frozenAt.toISOString(), changes: before ? diffPlans(before, plan) : [] };
}

/** Plain-language differences between two plans for the same day. */
export function diffPlans(a: PlanDto, b: PlanDto): string[] {
  const out: string[] = [];
  const pa = new Map(a.products.map((p) => [p.productId, p]));
  const pb = new Map(b.products.map((p) => [p.productId, p]));
  for (const [id, p] of pb) {
    const q = pa.get(id);
    if (!q) out.push(`${p.name}: new, ${p.units} ordered (${p.pans} pans).`);
    else if (q.units !== p.units || q.pans !== p.pans) out.push(`${p.name}: ${q.units} → ${p.units} ordered, ${q.pans} → ${p.pans} pans.`);
  }
  for (const [id, q] of pa) if (!pb.has(id)) out.push(`${q.name}: no longer ordered (was ${q.units}).`);
  const da = new Map(a.doughs.map((d) => [d.formulaId, d]));
  for (const d of b.doughs) {
    const e = da.get(d.formulaId);
    if (e && e.formulaVersion !== d.formulaVersion) out.push(`${d.name}: formula version ${e.formulaVersion} → ${d.formulaVersion}.`);
    if (e && Math.abs(e.doughGrams - d.doughGrams) >= 1) out.push(`${d.name}: dough ${e.doughGrams} g → ${d.doughGrams} g.`);
  }
  if (a.inputs.roomC !== b.inputs.roomC || a.inputs.flourC !== b.inputs.flourC || a.inputs.pasteC !== b.inputs.pasteC) out.push("Room, flour or paste temperature changed: liquid temperatures differ.");
  else if ((a.inputs.tapC ?? DEFAULT_TAP_C) !== (b.inputs.tapC ?? DEFAULT_TAP_C) || (a.inputs.milkC ?? DEFAULT_MILK_C) !== (b.inputs.milkC ?? DEFAULT_MILK_C)) out.push("Tap water or milk temperature changed: the ice and chilling on the cards differ.");
  return out;
}

export async function saveBakeDay(ctx: AppContext, date: string, input: BakeDayInput): Promise<PlanView> {
  const m = ctx.dataSource.manager;
  const ids = Object.keys(input.extraPans).map(Number);
  if (ids.length && (await m.getRepository(Product).countBy({ id: In(ids) })) !== ids.length) throw badRequest("Extra pans for a product that does not exist.", { extraPans: "Unknown product." });
  const day = await bakeDayForWrite(m, date);
  await m.getRepository(BakeDay).update({ date }, {
    extraPans: JSON.stringify(Object.fromEntries(Object.entries(input.extraPans).filter(([, n]) => n > 0))),
    roomC: String(input.roomC), flourC: String(input.flourC), pasteC: String(input.pasteC),
    ...(input.tapC === undefined ? {} : { tapC: String(input.tapC) }),
    ...(input.milkC === undefined ? {} : { milkC: String(input.milkC) }),
  });
  // A frozen day is recalculated on purpose: the baker just changed its inputs.
  return day.frozenPlan ? freeze(ctx, date) : { ...(await computePlan(ctx, date)), changes: [] };
}

export async function setProgress(ctx: AppContext, date: string, input: ProgressBody): Promise<PlanProgressDto> {
  return ctx.dataSource.transaction(async (tx) => {
    await bakeDayForWrite(tx, date);
    await tx.query("SELECT date FROM bake_day WHERE date = ? FOR UPDATE", [date]);
    const day = await bakeDay(tx, date);
    const progress = JSON.parse(day.progress) as PlanProgressDto;
    if (input.kind === "internal") {
      // The internal temperature probed in an oven load, with when it was recorded (the server's clock).
      const internal = { ...(progress.internal ?? {}) };
      if (input.valueC === null) delete internal[input.key];
      else internal[input.key] = { c: Math.round(input.valueC * 10) / 10, at: ctx.clock.now().toISOString() };
      progress.internal = internal;
    } else if (input.kind === "mix") {
      progress.mixes = input.done ? [...new Set([...progress.mixes, input.key])] : progress.mixes.filter((k) => k !== input.key);
    } else {
      const n = Number(input.key);
      progress.waves = input.done ? [...new Set([...progress.waves, n])].sort((a, b) => a - b) : progress.waves.filter((w) => w !== n);
    }
    await tx.getRepository(BakeDay).update({ date }, { progress: JSON.stringify(progress) });
    return progress;
  });
}

/** The next bake day: the first delivery date whose dispatch is still ahead, in the bakery's zone. */
export async function nextBakeDay(ctx: AppContext): Promise<string> {
  const settings = await loadCalendarSettings(ctx);
  const bakery = await getBakery(ctx);
  const now = DateTime.fromJSDate(ctx.clock.now(), { zone: bakery.timeZone });
  const [h, min] = bakery.dispatchTime.split(":").map(Number);
  let d = localToday(ctx.clock.now(), bakery.timeZone);
  for (let i = 0; i < 14; i++, d = addDays(d, 1)) {
    const dispatch = DateTime.fromISO(d, { zone: bakery.timeZone }).set({ hour: h, minute: min });
    if (settings.deliveryWeekdays.includes(DateTime.fromISO(d).weekday as never) && !settings.closures.includes(d) && dispatch > now) return d;
  }
  return d;
}

/** Freeze every plan whose cut-off has passed (a scheduled job; reads freeze too, so it never waits on this). */
export async function freezeDue(ctx: AppContext): Promise<number> {
  const settings = await loadCalendarSettings(ctx);
  const today = localToday(ctx.clock.now(), settings.timeZone);
  let n = 0;
  for (let i = 0; i <= settings.leadDays + 1; i++) {
    const date = addDays(today, i);
    if (ctx.clock.now().getTime() < cutoffFor(date, settings).toMillis()) continue;
    const day = await ctx.dataSource.getRepository(BakeDay).findOneBy({ date });
    if (day?.frozenPlan) continue;
    const hasOrders = (await unitsByProduct(ctx.dataSource.manager, date)).length > 0;
    if (!hasOrders) continue;
    await freeze(ctx, date);
    n++;
  }
  return n;
}


/** Ingredients for the next 7 days (orders placed plus standing orders expected), in purchase packs rounded up. */
export async function forecast(ctx: AppContext, from: string): Promise<ForecastDto> {
  const dates = Array.from({ length: 7 }, (_, i) => addDays(from, i));
  const plans = [];
  for (const d of dates) plans.push(await computePlan(ctx, d, { includeStanding: true }));
  const lib = new Map((await ctx.dataSource.getRepository(Ingredient).find()).map((i) => [i.id, i]));
  const grams = new Map<number, Record<string, number>>();
  plans.forEach((p) => {
    for (const i of p.ingredients) {
      const row = grams.get(i.ingredientId) ?? {};
      row[p.date] = (row[p.date] ?? 0) + i.grams;
      grams.set(i.ingredientId, row);
    }
  });
  const items = [...grams].map(([ingredientId, byDay]) => {
    const ing = lib.get(ingredientId)!;
    const total = roundGrams(Object.values(byDay).reduce((a, b) => a + b, 0));
    const packs = ing.packGrams > 0 ? Math.ceil(total / ing.packGrams - 1e-9) : 0;
    return { ingredientId, name: ing.name, grams: total, packName: ing.packName, packGrams: ing.packGrams, packs, costCents: packs * ing.packCostCents, byDay };
  }).sort((a, b) => b.grams - a.grams);
  return {
    from,
    to: dates[6],
    days: plans.map((p) => ({ date: p.date, doughGrams: roundGrams(p.doughs.reduce((s, d) => s + d.doughGrams, 0)), orderedUnits: p.products.reduce((s, x) => s + x.units, 0) })),
    items,
    totalCostCents: items.reduce((s, i) => s + i.costCents, 0),
  };
}
