import { In, type EntityManager } from "typeorm";
import type { AppContext } from "../http/context";
import { HttpError, badRequest } from "../http/errors";
import { StandingOrder } from "./standing-order.entity";
import { StandingOrderLine } from "./standing-order-line.entity";
import { Order } from "./order.entity";
import { OrderLine } from "./order-line.entity";
import { Product } from "../catalog/product.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { loadCalendarSettings, parseWeekdays, resolveAccount } from "../calendar/calendar.service";
import { pricingFor } from "../catalog/catalog.service";
import { createOrder, orderCutoff } from "./orders.service";
import { addDays, cutoffFor, dateStatus, daysBetween, localToday, weekdayOf, type Weekday } from "../../shared/calendar";
import { expandRule, weeklyRule } from "../../shared/recurrence";
import type { SessionUser } from "../../shared/schemas/auth";
import { MAX_ORDER_CENTS, type StandingDatePlan, type StandingOrderDto, type StandingOrderInput } from "../../shared/schemas/orders";
import { formatCalendarDate, localeOr } from "../../shared/format";
import type { MaterialiseResult } from "../../shared/contracts/standing";
import { quantityText, saleUnitFor } from "../../shared/quantity";

async function load(m: EntityManager, accountId: number) {
  const so = await m.getRepository(StandingOrder).findOneBy({ accountId });
  const lines = so ? await m.getRepository(StandingOrderLine).find({ where: { standingOrderId: so.id }, order: { productId: "ASC", weekday: "ASC" } }) : [];
  return { so, lines };
}

export async function getStandingOrder(ctx: AppContext, actor: SessionUser, accountId?: number): Promise<StandingOrderDto | null> {
  const account = await resolveAccount(ctx, actor, accountId);
  const { so, lines } = await load(ctx.dataSource.manager, account.id);
  if (!so) return null;
  return dto(ctx, so, lines);
}

async function dto(ctx: AppContext, so: StandingOrder, lines: StandingOrderLine[]): Promise<StandingOrderDto> {
  const settings = await loadCalendarSettings(ctx);
  const now = ctx.clock.now();
  const today = localToday(now, settings.timeZone);
  const skip = new Set<string>(JSON.parse(so.skipDates));
  const dates = lines.some((l) => l.quantity > 0) ? expandRule(so.rrule, today, addDays(today, settings.horizonDays)).filter((d) => !skip.has(d)) : [];
  const orders = dates.length ? await ctx.dataSource.getRepository(Order).findBy({ accountId: so.accountId, deliveryDate: In(dates) }) : [];
  const account = await ctx.dataSource.getRepository(CustomerAccount).findOneByOrFail({ id: so.accountId });
  const routeDays = parseWeekdays(account.routeWeekdays);
  const byDate = new Map(orders.map((o) => [o.deliveryDate, o]));
  return {
    accountId: so.accountId,
    startDate: so.startDate,
    endDate: so.endDate,
    intervalWeeks: so.intervalWeeks === 2 ? 2 : 1,
    skipDates: [...skip].sort(),
    lines: lines.map((l) => ({ productId: l.productId, weekday: l.weekday as Weekday, quantity: l.quantity })),
    active: so.active,
    rrule: so.rrule,
    upcoming: dates.map((date) => {
      const o = byDate.get(date) ?? null;
      const { plan, planText } = planFor(date, o, { so, account, settings, now, routeDays });
      const skippable = plan === "ordered" ? o!.status === "open" || o!.status === "cancelled" : plan === "waiting" || plan === "held";
      return { date, orderId: o?.id ?? null, editedByHand: o?.editedByHand ?? false, status: o?.status ?? null, plan, planText, skippable };
    }),
  };
}

/** What becomes of one date (shared/schemas/orders.ts StandingDatePlan), in the buyer's words. */
function planFor(
  date: string,
  o: Order | null,
  c: { so: StandingOrder; account: CustomerAccount; settings: Awaited<ReturnType<typeof loadCalendarSettings>>; now: Date; routeDays: Weekday[] | null },
): { plan: StandingDatePlan; planText: string } {
  const st = dateStatus(date, c.settings, c.now, c.routeDays);
  // A closed date says so even when an order was made before the bakery closed it (the job withdraws its own).
  if (st.reason === "closed") {
    const note = c.settings.closureNotes.get(date);
    return { plan: "closed", planText: note ? `Bakery closed: ${note}` : "Bakery closed" };
  }
  if (o) return { plan: "ordered", planText: "Order made" };
  if (st.reason === "not_delivery_day") return { plan: "no_delivery", planText: "No delivery to you that day" };
  if (st.reason === "past_cutoff") return { plan: "missed", planText: "Past the cut-off: not made" };
  if (!c.so.active) return { plan: "paused", planText: "Paused: not made" };
  if (c.account.status === "on_hold") {
    return {
      plan: "held",
      planText: c.account.creditHold
        ? "On hold: made only if the overdue invoices are paid before the cut-off"
        : "On hold: made only if the bakery lifts the hold before the cut-off",
    };
  }
  if (c.account.status !== "active") return { plan: "paused", planText: "Account closed: not made" };
  return { plan: "waiting", planText: "Made soon by the bakery" };
}

/**
 * Skip dates newly added must be dates the standing order would deliver on: a past date or a date it does not
 * cover (another weekday, the off week of an every-other-week order, before its start or after its end) is
 * refused with a message that says which and why. Dates skipped before stay as they were.
 */
function checkNewSkipDates(input: { skipDates: string[]; startDate: string; endDate: string | null; intervalWeeks: number }, rule: string, before: Set<string>, today: string, locale: string): Record<string, string> {
  const fields: Record<string, string> = {};
  input.skipDates.forEach((d, i) => {
    if (before.has(d)) return;
    const day = formatCalendarDate(d, "dayShort", locale);
    if (d < today) fields[`skipDates.${i}`] = `${day} is in the past; choose a coming date to skip.`;
    else if (expandRule(rule, d, d).length === 0) {
      fields[`skipDates.${i}`] =
        input.endDate && d > input.endDate ? `${day} is after your standing order ends; nothing is made then to skip.`
        : d < input.startDate ? `${day} is before your standing order starts; nothing is made then to skip.`
        : `${day} is not one of your standing order's delivery dates${input.intervalWeeks === 2 ? " (it delivers every other week)" : ""}; nothing is made then to skip.`;
    }
  });
  return fields;
}

/**
 * The DTSTART the stored rule starts from. rrule walks every occurrence from DTSTART on, so a start in 2000
 * cost tens of milliseconds of CPU on each expansion. A start more than a week back moves forward by whole
 * periods (7 × interval days) to the last such date at least a week before today: every week the rule
 * picks (RFC 5545 §3.3.10, INTERVAL counted from DTSTART's week with WKST=MO) stays the same, and the
 * dates it leaves out are all in the past. The start date the person chose is kept as they wrote it.
 */
export function ruleStart(startDate: string, intervalWeeks: number, today: string): string {
  const period = 7 * intervalWeeks;
  const behind = daysBetween(startDate, today) - 7;
  return behind > 0 ? addDays(startDate, Math.floor(behind / period) * period) : startDate;
}

export async function putStandingOrder(ctx: AppContext, actor: SessionUser, input: ReturnType<typeof import("../../shared/schemas/orders").standingOrderSchema.parse>): Promise<StandingOrderDto> {
  const account = await resolveAccount(ctx, actor, input.accountId);
  if (account.status !== "active") throw new HttpError(403, account.status === "on_hold" ? "account_on_hold" : "account_closed", `${account.businessName} is ${account.status === "on_hold" ? (account.creditHold ? "on credit hold (an invoice is overdue; paying it lifts the hold)" : "paused by the bakery") : "closed"}; the standing order can't be changed now. Please call the bakery.`);
  const productIds = [...new Set(input.lines.map((l) => l.productId))];
  const products = new Map((await ctx.dataSource.getRepository(Product).findBy({ id: In(productIds.concat([0])) })).map((p) => [p.id, p]));
  const fields: Record<string, string> = {};
  input.lines.forEach((l, i) => {
    const p = products.get(l.productId);
    if (!p || !p.active) fields[`lines.${i}.productId`] = "This product is not offered.";
    else if (l.quantity > p.maxQuantity) fields[`lines.${i}.quantity`] = `At most ${quantityText(p.maxQuantity, p)} per order.`;
    else if (l.quantity > 0 && l.quantity < p.minQuantity) fields[`lines.${i}.quantity`] = `At least ${quantityText(p.minQuantity, p)} per order.`;
  });
  const settings = await loadCalendarSettings(ctx);
  const routeDays = parseWeekdays(account.routeWeekdays) ?? settings.deliveryWeekdays;
  input.lines.forEach((l, i) => {
    if (l.quantity > 0 && (!settings.deliveryWeekdays.includes(l.weekday as Weekday) || !routeDays.includes(l.weekday as Weekday))) fields[`lines.${i}.weekday`] = "There is no delivery to you on this weekday.";
  });
  if (Object.keys(fields).length) throw badRequest(Object.keys(fields).length === 1 ? Object.values(fields)[0] : "Some quantities need attention.", fields);

  const weekdays = [...new Set(input.lines.filter((l) => l.quantity > 0).map((l) => l.weekday as Weekday))];
  const today = localToday(ctx.clock.now(), settings.timeZone);
  const rule = weeklyRule({ startDate: ruleStart(input.startDate, input.intervalWeeks, today), endDate: input.endDate, intervalWeeks: input.intervalWeeks, weekdays: weekdays.length ? weekdays : [weekdayOf(input.startDate)] });
  if (weekdays.length) {
    const stored = await ctx.dataSource.getRepository(StandingOrder).findOneBy({ accountId: account.id });
    const skipFields = checkNewSkipDates(input, rule, new Set(stored ? (JSON.parse(stored.skipDates) as string[]) : []), today, localeOr(settings.locale));
    if (Object.keys(skipFields).length) throw badRequest(Object.values(skipFields)[0], skipFields);
  }
  await ctx.dataSource.transaction(async (m) => {
    const repo = m.getRepository(StandingOrder);
    let so = await repo.findOneBy({ accountId: account.id });
    const values = { startDate: input.startDate, endDate: input.endDate, intervalWeeks: input.intervalWeeks, rrule: rule, skipDates: JSON.stringify([...new Set(input.skipDates)].sort()), active: input.active };
    if (so) await repo.update({ id: so.id }, values);
    else so = await repo.save(repo.create({ accountId: account.id, ...values }));
    await m.getRepository(StandingOrderLine).delete({ standingOrderId: so.id });
    const kept = input.lines.filter((l) => l.quantity > 0);
    if (kept.length) await m.getRepository(StandingOrderLine).insert(kept.map((l) => ({ standingOrderId: so!.id, productId: l.productId, weekday: l.weekday, quantity: l.quantity })));
  });
  await materialiseAccount(ctx, account.id);
  return (await getStandingOrder(ctx, actor, account.id))!;
}

/**
 * Turn standing orders into orders for every orderable date within the horizon. Idempotent: an order
 * that exists is only brought in line with the standing order when the job made it and nobody has
 * changed it by hand since.
 */
export async function materialiseAll(ctx: AppContext): Promise<MaterialiseResult> {
  const all = await ctx.dataSource.getRepository(StandingOrder).find();
  const total = { created: 0, updated: 0, cancelled: 0 };
  for (const so of all) {
    const r = await materialiseAccount(ctx, so.accountId);
    total.created += r.created;
    total.updated += r.updated;
    total.cancelled += r.cancelled;
  }
  return total;
}

export async function materialiseAccount(ctx: AppContext, accountId: number) {
  const result = { created: 0, updated: 0, cancelled: 0 };
  const settings = await loadCalendarSettings(ctx);
  const { so, lines } = await load(ctx.dataSource.manager, accountId);
  const account = await ctx.dataSource.getRepository(CustomerAccount).findOneBy({ id: accountId });
  if (!so || !account || account.status !== "active") return result;
  const now = ctx.clock.now();
  const today = localToday(now, settings.timeZone);
  const horizonEnd = addDays(today, settings.horizonDays);
  const skip = new Set<string>(JSON.parse(so.skipDates));
  const wanted = new Map<string, { productId: number; quantity: number }[]>();
  if (so.active) {
    for (const date of expandRule(so.rrule, today, horizonEnd)) {
      const wd = weekdayOf(date);
      const dayLines = lines.filter((l) => l.weekday === wd && l.quantity > 0).map((l) => ({ productId: l.productId, quantity: l.quantity }));
      // A date the bakery has closed is not wanted: the job's own untouched order on it is withdrawn below.
      if (!skip.has(date) && dayLines.length && !settings.closures.includes(date)) wanted.set(date, dayLines);
    }
  }
  const existing = await ctx.dataSource.getRepository(Order).createQueryBuilder("o").where("o.accountId = :a AND o.deliveryDate BETWEEN :f AND :t", { a: accountId, f: today, t: horizonEnd }).getMany();
  const byDate = new Map(existing.map((o) => [o.deliveryDate, o]));
  const routeDays = parseWeekdays(account.routeWeekdays);
  const leadDays = new Map((await ctx.dataSource.getRepository(Product).findBy({ id: In(lines.map((l) => l.productId).concat([0])) })).map((p) => [p.id, p.leadDays]));

  for (const [date, dayLines] of wanted) {
    const st = dateStatus(date, settings, now, routeDays);
    if (!st.orderable) continue;
    const o = byDate.get(date);
    if (!o) {
      // A product that needs more notice than is left (its own cut-off has passed) stays off this date's order;
      // the rest of the delivery is still made, rather than the whole date failing on one product's lead time.
      const inTime = dayLines.filter((l) => cutoffFor(date, settings, leadDays.get(l.productId) ?? 0).toMillis() > now.getTime());
      if (inTime.length < dayLines.length) ctx.logger.info({ accountId, date, left: dayLines.length - inTime.length }, "standing order: products past their own cut-off left off");
      if (!inTime.length) continue;
      try {
        await createOrder(ctx, null, { deliveryDate: date, lines: inTime }, { source: "standing", accountId, skipMail: true });
        result.created++;
      } catch (err) {
        if (!(err instanceof HttpError)) throw err;
        ctx.logger.info({ accountId, date, code: err.code }, "standing order not placed for this date");
      }
    } else if (o.source === "standing" && !o.editedByHand && (o.status === "open" || o.status === "cancelled")) {
      if (await syncOrder(ctx, o, dayLines, settings)) result.updated++;
    }
  }
  // Dates the standing order no longer covers: cancel the job's own untouched orders.
  for (const o of existing) {
    if (wanted.has(o.deliveryDate) || o.source !== "standing" || o.editedByHand || o.status !== "open") continue;
    if (now.getTime() >= (await cutoffOf(ctx, o, settings))) continue;
    await ctx.dataSource.getRepository(Order).update({ id: o.id, status: "open", editedByHand: false, source: "standing" }, { status: "cancelled" });
    result.cancelled++;
  }
  return result;
}

async function cutoffOf(ctx: AppContext, o: Order, settings: Awaited<ReturnType<typeof loadCalendarSettings>>): Promise<number> {
  const lines = await ctx.dataSource.getRepository(OrderLine).findBy({ orderId: o.id });
  const products = await ctx.dataSource.getRepository(Product).findBy({ id: In(lines.map((l) => l.productId).concat([0])) });
  return orderCutoff(o.deliveryDate, settings, products).toMillis();
}

/** Bring a job-made order in line with the standing order; false when it already matches. */
async function syncOrder(ctx: AppContext, o: Order, dayLines: { productId: number; quantity: number }[], settings: Awaited<ReturnType<typeof loadCalendarSettings>>): Promise<boolean> {
  return ctx.dataSource.transaction(async (m) => {
    const locked = await m.getRepository(Order).createQueryBuilder("o").setLock("pessimistic_write").where("o.id = :id", { id: o.id }).getOne();
    if (!locked || locked.editedByHand || locked.source !== "standing" || !["open", "cancelled"].includes(locked.status)) return false;
    const current = await m.getRepository(OrderLine).findBy({ orderId: o.id });
    const same = locked.status === "open" && current.length === dayLines.length && dayLines.every((l) => current.some((c) => c.productId === l.productId && c.quantity === l.quantity));
    if (same) return false;
    const products = new Map((await m.getRepository(Product).findBy({ id: In(dayLines.map((l) => l.productId)) })).map((p) => [p.id, p]));
    if (dayLines.some((l) => !products.get(l.productId)?.active)) return false;
    // The cut-offs of the products on the order now count too: a line past its cut-off is not taken away.
    const currentProducts = await m.getRepository(Product).findBy({ id: In(current.map((c) => c.productId).concat([0])) });
    if (ctx.clock.now().getTime() >= orderCutoff(o.deliveryDate, settings, [...products.values(), ...currentProducts]).toMillis()) return false;
    const pricing = await pricingFor(ctx, o.accountId, m);
    const priced = dayLines.map((l) => {
      const p = products.get(l.productId)!;
      const unit = pricing.price(p);
      return { orderId: o.id, productId: p.id, productName: p.name, saleUnit: p.saleUnit, saleUnitPlural: saleUnitFor(2, p), quantity: l.quantity, unitPriceCents: unit, lineTotalCents: unit * l.quantity };
    });
    // Above 2^31 − 1 cents the INT columns would refuse the row: leave the order as it is (createOrder refuses such orders with a 400).
    if (priced.some((l) => l.lineTotalCents > MAX_ORDER_CENTS) || priced.reduce((s, l) => s + l.lineTotalCents, 0) > MAX_ORDER_CENTS) {
      ctx.logger.info({ orderId: o.id }, "standing order not synced: the order would exceed the most one order can be");
      return false;
    }
    await m.getRepository(OrderLine).delete({ orderId: o.id });
    await m.getRepository(OrderLine).insert(priced);
    await m.getRepository(Order).update({ id: o.id }, { status: "open", totalCents: priced.reduce((s, l) => s + l.lineTotalCents, 0) });
    return true;
  });
}
