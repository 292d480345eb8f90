import crypto from "node:crypto";
import { In, type EntityManager } from "typeorm";
import { DateTime } from "luxon";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, notFound } from "../http/errors";
import { Order } from "./order.entity";
import { OrderLine } from "./order-line.entity";
import { IdempotencyRecord } from "./idempotency-record.entity";
import { Product } from "../catalog/product.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { pricingFor } from "../catalog/catalog.service";
import { loadCalendarSettings, parseWeekdays, resolveAccount } from "../calendar/calendar.service";
import { getBakery } from "../bakery/bakery.service";
import { cutoffFor, dateStatus, formatLocal, REASON_TEXT, type CalendarSettings } from "../../shared/calendar";
import { formatCalendarDate, localeOr } from "../../shared/format";
import { sortAllergens } from "../../shared/allergens";
import { formatMoney } from "../../shared/money";
import type { FieldErrors } from "../../shared/errors";
import type { SessionUser } from "../../shared/schemas/auth";
import { MAX_ORDER_CENTS, ORDER_STATUS_LABELS, type OrderDto, type OrderStatus } from "../../shared/schemas/orders";
import { orderMail } from "../mail/templates";
import { retryOnDeadlock } from "../db/retry";
import { derivedAllergens } from "../production/formulas.service";
import { enqueueMail } from "../mail/outbox.service";
import { quantityText, saleUnitFor } from "../../shared/quantity";

type Settings = CalendarSettings;
interface LineInput { productId: number; quantity: number }

// ---- reading -------------------------------------------------------------------------------

export async function orderDtos(ctx: AppContext, orders: Order[], m: EntityManager = ctx.dataSource.manager): Promise<OrderDto[]> {
  if (orders.length === 0) return [];
  const settings = await loadCalendarSettings(ctx, m);
  const lines = await m.getRepository(OrderLine).find({ where: { orderId: In(orders.map((o) => o.id)) }, order: { id: "ASC" } });
  const products = new Map((await m.getRepository(Product).findBy({ id: In([...new Set(lines.map((l) => l.productId))].concat([0])) })).map((p) => [p.id, p]));
  const accounts = new Map((await m.getRepository(CustomerAccount).findBy({ id: In([...new Set(orders.map((o) => o.accountId))]) })).map((a) => [a.id, a]));
  const derived = await derivedAllergens(m, [...products.values()]);
  return orders.map((o) => {
    const own = lines.filter((l) => l.orderId === o.id);
    return {
      id: o.id,
      accountId: o.accountId,
      accountName: accounts.get(o.accountId)?.businessName ?? "",
      deliveryDate: o.deliveryDate,
      status: o.status,
      poNumber: o.poNumber,
      note: o.note,
      lines: own.map((l) => {
        const p = products.get(l.productId);
        return {
          productId: l.productId, productName: l.productName, saleUnit: l.saleUnit, saleUnitPlural: saleUnitFor(2, l), quantity: l.quantity,
          unitPriceCents: l.unitPriceCents, lineTotalCents: l.lineTotalCents,
          allergens: derived.get(l.productId) ?? sortAllergens((p?.allergens ?? "").split(",").filter(Boolean)), mayContain: p?.mayContain ?? "",
        };
      }),
      totalCents: o.totalCents,
      cutoffAt: orderCutoff(o.deliveryDate, settings, own.map((l) => products.get(l.productId)).filter((p): p is Product => !!p)).toISO()!,
      source: o.source,
      editedByHand: o.editedByHand,
      cutoffOverride: o.cutoffOverrideAt ? { at: o.cutoffOverrideAt.toISOString(), reason: o.cutoffOverrideReason ?? "", byId: o.cutoffOverrideById } : null,
      createdAt: o.createdAt.toISOString(),
      updatedAt: o.updatedAt.toISOString(),
    };
  });
}

/** The earliest of the date's cut-off and every product's own cut-off. */
export function orderCutoff(date: string, settings: Settings, products: Product[]): DateTime {
  return products.reduce((min, p) => {
    const c = cutoffFor(date, settings, p.leadDays);
    return c < min ? c : min;
  }, cutoffFor(date, settings));
}

export async function getOrder(ctx: AppContext, actor: SessionUser, id: number): Promise<OrderDto> {
  const o = await ctx.dataSource.getRepository(Order).findOneBy({ id });
  if (!o || (actor.role === "buyer" && o.accountId !== actor.accountId)) throw notFound("That order");
  return (await orderDtos(ctx, [o]))[0];
}

export async function listOrders(ctx: AppContext, actor: SessionUser, q: { from?: string; to?: string; accountId?: number; status?: OrderStatus }): Promise<OrderDto[]> {
  const qb = ctx.dataSource.getRepository(Order).createQueryBuilder("o").orderBy("o.deliveryDate", "ASC").addOrderBy("o.id", "ASC");
  if (actor.role === "buyer") qb.andWhere("o.accountId = :a", { a: actor.accountId });
  else if (q.accountId) qb.andWhere("o.accountId = :a", { a: q.accountId });
  if (q.from) qb.andWhere("o.deliveryDate >= :from", { from: q.from });
  if (q.to) qb.andWhere("o.deliveryDate <= :to", { to: q.to });
  if (q.status) qb.andWhere("o.status = :s", { s: q.status });
  return orderDtos(ctx, await qb.take(1000).getMany());
}

// ---- checks shared by every write ------------------------------------------------------------

function refuseIfAccountBlocked(account: CustomerAccount, bakery: { name: string; phone: string; email: string }) {
  if (account.status === "on_hold" && account.creditHold) {
    throw new HttpError(403, "account_on_hold", `${account.businessName} is on credit hold: it has overdue invoices, so new orders and changes wait. Pay them under Invoices and ordering opens again at once, or call ${bakery.name} on ${bakery.phone || bakery.email}.`, undefined, { creditHold: true });
  }
  if (account.status === "on_hold") {
    throw new HttpError(403, "account_on_hold", `${account.businessName} is paused by the bakery, so new orders and changes wait. Please call ${bakery.name} on ${bakery.phone || bakery.email} to start it again.`);
  }
  if (account.status === "closed") throw new HttpError(403, "account_closed", `${account.businessName} is closed. Ask ${bakery.name} to reopen it.`);
}

function cutoffPassed(at: DateTime, tz: string, date: string, locale?: string): HttpError {
  const d = formatCalendarDate(date, "dayShort", localeOr(locale));
  return new HttpError(409, "cutoff_passed", `Orders for ${d} closed at the cut-off, ${formatLocal(at, tz, localeOr(locale))}. Call the bakery if something has gone wrong.`, undefined, { cutoffAt: at.toISO() });
}

/** Products, quantities and cut-offs for a set of lines; field errors keyed "lines.i.field". */
async function checkLines(ctx: AppContext, m: EntityManager, lines: LineInput[], date: string, settings: Settings, existingProducts: Product[] = [], override: Override | null = null) {
  const products = new Map((await m.getRepository(Product).findBy({ id: In(lines.map((l) => l.productId).concat([0])) })).map((p) => [p.id, p]));
  const fields: FieldErrors = {};
  lines.forEach((l, i) => {
    const p = products.get(l.productId);
    if (!p) fields[`lines.${i}.productId`] = "This product does not exist.";
    else if (!p.active) fields[`lines.${i}.productId`] = `${p.name} is no longer offered.`;
    else if (l.quantity > p.maxQuantity) fields[`lines.${i}.quantity`] = `At most ${quantityText(p.maxQuantity, p)} per order.`;
    else if (l.quantity < p.minQuantity) fields[`lines.${i}.quantity`] = `At least ${quantityText(p.minQuantity, p)} per order.`;
  });
  if (Object.keys(fields).length) throw badRequest(Object.keys(fields).length === 1 ? Object.values(fields)[0] : "Some lines need attention.", fields);
  const now = ctx.clock.now().getTime();
  const all = [...existingProducts, ...lines.map((l) => products.get(l.productId)!)];
  const cutoff = orderCutoff(date, settings, all);
  if (now >= cutoff.toMillis() && !override) throw cutoffPassed(cutoff, settings.timeZone, date, settings.locale);
  return products;
}

// ---- the owner's cut-off override (phone orders) ----------------------------------------------

/** An owner's confirmed "take it anyway" for a date past its cut-off. */
export interface Override {
  byId: number;
  reason: string;
}

/** Only the owner may set the cut-off aside; anyone else asking is refused, even before the cut-off. */
export function authoriseOverride(actor: SessionUser | null, input: { reason: string } | undefined): Override | null {
  if (!input) return null;
  if (!actor || actor.role !== "owner") throw new HttpError(403, "override_owner_only", "Only the owner can take or change an order past its cut-off.");
  return { byId: actor.id, reason: input.reason };
}

/** What an order records when an override was used (the cut-off had passed); nothing when it was not needed. */
function overrideColumns(override: Override | null, cutoffPassedNow: boolean, now: Date): Partial<Order> {
  return override && cutoffPassedNow ? { cutoffOverrideById: override.byId, cutoffOverrideAt: now, cutoffOverrideReason: override.reason } : {};
}

async function priceLines(ctx: AppContext, m: EntityManager, accountId: number, lines: LineInput[], products: Map<number, Product>, currency: string, locale?: string) {
  const pricing = await pricingFor(ctx, accountId, m);
  const priced = lines.map((l) => {
    const p = products.get(l.productId)!;
    const unit = pricing.price(p);
    return { productId: p.id, productName: p.name, saleUnit: p.saleUnit, saleUnitPlural: saleUnitFor(2, p), quantity: l.quantity, unitPriceCents: unit, lineTotalCents: unit * l.quantity };
  });
  // Line and order totals live in INT columns: above 2^31 − 1 cents the database would refuse the row.
  const most = formatMoney(MAX_ORDER_CENTS, currency, localeOr(locale));
  const fields: FieldErrors = {};
  priced.forEach((l, i) => {
    if (l.lineTotalCents > MAX_ORDER_CENTS) fields[`lines.${i}.quantity`] = `This line comes to ${formatMoney(l.lineTotalCents, currency, localeOr(locale))}; one line can be at most ${most}.`;
  });
  if (Object.keys(fields).length) throw badRequest(Object.keys(fields).length === 1 ? Object.values(fields)[0] : `Some lines come to more than ${most}, the most one line can be.`, fields);
  const total = priced.reduce((s, l) => s + l.lineTotalCents, 0);
  if (total > MAX_ORDER_CENTS) throw badRequest(`This order comes to ${formatMoney(total, currency, localeOr(locale))}; one order can be at most ${most}.`, { lines: `One order can be at most ${most}.` });
  return { priced, total };
}

/** The same products and quantities, whatever their order. */
function sameLines(a: LineInput[], b: LineInput[]): boolean {
  const key = (ls: LineInput[]) => ls.map((l) => `${l.productId}:${l.quantity}`).sort().join(",");
  return a.length === b.length && key(a) === key(b);
}

function refuseBelowMinimum(account: CustomerAccount, total: number, currency: string, locale?: string) {
  if (total < account.minimumOrderCents) {
    const shortfall = account.minimumOrderCents - total;
    throw new HttpError(422, "below_minimum", `The minimum order for ${account.businessName} is ${formatMoney(account.minimumOrderCents, currency, localeOr(locale))}; add ${formatMoney(shortfall, currency, localeOr(locale))} more.`, undefined, { shortfallCents: shortfall, minimumOrderCents: account.minimumOrderCents });
  }
}

// ---- writes ---------------------------------------------------------------------------------

export interface CreateInput { deliveryDate: string; lines: LineInput[]; poNumber?: string; note?: string; accountId?: number }

/** Place an order. Used by the API and by the standing-order job (source "standing"). */
export async function createOrder(ctx: AppContext, actor: SessionUser | null, input: CreateInput & { cutoffOverride?: { reason: string } }, opts: { source?: "one_off" | "standing"; manager?: EntityManager; accountId?: number; skipMail?: boolean; inTransaction?: (m: EntityManager, order: OrderDto) => Promise<void> } = {}): Promise<OrderDto> {
  const bakery = await getBakery(ctx);
  const settings = await loadCalendarSettings(ctx);
  const override = authoriseOverride(actor, input.cutoffOverride);
  const run = async (m: EntityManager) => {
    const account = actor ? await resolveAccount(ctx, actor, input.accountId, m) : await m.getRepository(CustomerAccount).findOneByOrFail({ id: opts.accountId! });
    // Serialise writers per account, so one date never gets two orders.
    await m.getRepository(CustomerAccount).createQueryBuilder("a").setLock("pessimistic_write").where("a.id = :id", { id: account.id }).getOne();
    refuseIfAccountBlocked(account, bakery);
    const st = dateStatus(input.deliveryDate, settings, ctx.clock.now(), parseWeekdays(account.routeWeekdays));
    // The owner's override sets aside the cut-off only: a closed date or a day without delivery stays refused.
    if (st.reason === "past_cutoff" && !override) throw cutoffPassed(DateTime.fromISO(st.cutoffAt, { setZone: true }), settings.timeZone, input.deliveryDate, settings.locale);
    if (!st.orderable && st.reason !== "past_cutoff") throw new HttpError(409, "date_not_orderable", `You can't order for this date: ${REASON_TEXT[st.reason!].toLowerCase()}.`, undefined, { reason: st.reason });
    const products = await checkLines(ctx, m, input.lines, input.deliveryDate, settings, [], override);
    const late = ctx.clock.now().getTime() >= orderCutoff(input.deliveryDate, settings, [...products.values()]).toMillis();
    const overridden = overrideColumns(override, late, ctx.clock.now());
    const { priced, total } = await priceLines(ctx, m, account.id, input.lines, products, bakery.currency, bakery.locale);
    refuseBelowMinimum(account, total, bakery.currency, bakery.locale);
    const orders = m.getRepository(Order);
    const existing = await orders.findOneBy({ accountId: account.id, deliveryDate: input.deliveryDate });
    let order: Order;
    if (existing && existing.status !== "cancelled") {
      throw new HttpError(409, "order_exists", "There is already an order for this date; change that one instead.", undefined, { orderId: existing.id });
    } else if (existing) {
      // A cancelled order for the date comes back to life with the new lines.
      await m.getRepository(OrderLine).delete({ orderId: existing.id });
      await orders.update({ id: existing.id }, { status: "open", poNumber: input.poNumber || null, note: input.note || null, totalCents: total, source: opts.source ?? "one_off", editedByHand: false, createdById: actor?.id ?? null, ...overridden });
      order = (await orders.findOneBy({ id: existing.id }))!;
    } else {
      order = await orders.save(orders.create({ accountId: account.id, deliveryDate: input.deliveryDate, status: "open", poNumber: input.poNumber || null, note: input.note || null, totalCents: total, source: opts.source ?? "one_off", editedByHand: false, createdById: actor?.id ?? null, ...overridden }));
    }
    await m.getRepository(OrderLine).insert(priced.map((l) => ({ ...l, orderId: order.id })));
    const dto = (await orderDtos(ctx, [order], m))[0];
    if (!opts.skipMail) await queueOrderMail(ctx, m, dto, "placed");
    await opts.inTransaction?.(m, dto);
    return dto;
  };
  // READ COMMITTED: after waiting on the account lock, the check for an existing order must see what the other writer committed.
  return opts.manager ? run(opts.manager) : retryOnDeadlock(() => ctx.dataSource.transaction("READ COMMITTED", run));
}

/** Replace lines, PO number or note of an open order before its cut-off. A request that changes nothing writes nothing and mails nothing. */
export async function updateOrder(ctx: AppContext, actor: SessionUser, id: number, input: { lines?: LineInput[]; poNumber?: string; note?: string; cutoffOverride?: { reason: string } }): Promise<OrderDto> {
  const bakery = await getBakery(ctx);
  const settings = await loadCalendarSettings(ctx);
  const override = authoriseOverride(actor, input.cutoffOverride);
  const dto = await lockAfterRefusal(ctx, retryOnDeadlock(() => ctx.dataSource.transaction(async (m) => {
    const order = await lockOrderForWrite(ctx, m, actor, id, settings, bakery, override);
    const existingLines = await m.getRepository(OrderLine).findBy({ orderId: order.id });
    const oldProducts = await m.getRepository(Product).findBy({ id: In(existingLines.map((l) => l.productId).concat([0])) });
    const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: order.accountId });
    const patch: Partial<Order> = { editedByHand: order.source === "standing" ? true : order.editedByHand };
    if (input.poNumber !== undefined && (input.poNumber || null) !== order.poNumber) patch.poNumber = input.poNumber || null;
    if (input.note !== undefined && (input.note || null) !== order.note) patch.note = input.note || null;
    const newLines = input.lines && !sameLines(input.lines, existingLines) ? input.lines : undefined;
    if (newLines) {
      const products = await checkLines(ctx, m, newLines, order.deliveryDate, settings, oldProducts, override);
      const { priced, total } = await priceLines(ctx, m, account.id, newLines, products, bakery.currency, bakery.locale);
      refuseBelowMinimum(account, total, bakery.currency, bakery.locale);
      Object.assign(patch, overrideColumns(override, ctx.clock.now().getTime() >= orderCutoff(order.deliveryDate, settings, [...oldProducts, ...products.values()]).toMillis(), ctx.clock.now()));
      await m.getRepository(OrderLine).delete({ orderId: order.id });
      await m.getRepository(OrderLine).insert(priced.map((l) => ({ ...l, orderId: order.id })));
      patch.totalCents = total;
    } else {
      const c = orderCutoff(order.deliveryDate, settings, oldProducts);
      const late = ctx.clock.now().getTime() >= c.toMillis();
      if (late && !override) throw cutoffPassed(c, settings.timeZone, order.deliveryDate, settings.locale);
      if (late && ("poNumber" in patch || "note" in patch)) Object.assign(patch, overrideColumns(override, true, ctx.clock.now()));
      // Same lines, same PO number, same note: nothing changed, so no write and no "Order changed" mail.
      if (!("poNumber" in patch) && !("note" in patch)) return (await orderDtos(ctx, [order], m))[0];
    }
    await m.getRepository(Order).update({ id: order.id }, patch);
    const changed = (await orderDtos(ctx, [(await m.getRepository(Order).findOneBy({ id: order.id }))!], m))[0];
    await queueOrderMail(ctx, m, changed, "changed");
    return changed;
  })));
  return dto;
}

export async function cancelOrder(ctx: AppContext, actor: SessionUser, id: number, overrideReason?: string): Promise<OrderDto> {
  const bakery = await getBakery(ctx);
  const settings = await loadCalendarSettings(ctx);
  const override = authoriseOverride(actor, overrideReason === undefined ? undefined : { reason: overrideReason });
  const dto = await lockAfterRefusal(ctx, retryOnDeadlock(() => ctx.dataSource.transaction(async (m) => {
    const order = await lockOrderForWrite(ctx, m, actor, id, settings, bakery, override);
    const lines = await m.getRepository(OrderLine).findBy({ orderId: order.id });
    const products = await m.getRepository(Product).findBy({ id: In(lines.map((l) => l.productId).concat([0])) });
    const c = orderCutoff(order.deliveryDate, settings, products);
    const late = ctx.clock.now().getTime() >= c.toMillis();
    if (late && !override) throw cutoffPassed(c, settings.timeZone, order.deliveryDate, settings.locale);
    await m.getRepository(Order).update({ id: order.id }, { status: "cancelled", editedByHand: order.source === "standing" ? true : order.editedByHand, ...overrideColumns(override, late, ctx.clock.now()) });
    const cancelled = (await orderDtos(ctx, [(await m.getRepository(Order).findOneBy({ id: order.id }))!], m))[0];
    await queueOrderMail(ctx, m, cancelled, "cancelled");
    return cancelled;
  })));
  return dto;
}

/** Load an order for a change, row-locked; lock it for baking if its date's cut-off has passed. */
async function lockOrderForWrite(ctx: AppContext, m: EntityManager, actor: SessionUser, id: number, settings: Settings, bakery: { name: string; phone: string; email: string }, override: Override | null = null): Promise<Order> {
  const order = await m.getRepository(Order).createQueryBuilder("o").setLock("pessimistic_write").where("o.id = :id", { id }).getOne();
  if (!order || (actor.role === "buyer" && order.accountId !== actor.accountId)) throw notFound("That order");
  const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: order.accountId });
  const dateCutoff = cutoffFor(order.deliveryDate, settings);
  // The owner's override reaches an order past its cut-off, open or already locked for baking.
  if (override && (order.status === "open" || order.status === "locked")) {
    refuseIfAccountBlocked(account, bakery);
    return order;
  }
  if (order.status === "open" && ctx.clock.now().getTime() >= dateCutoff.toMillis()) {
    // The refusal rolls this transaction back; the caller locks the order afterwards (lockAfterRefusal).
    throw Object.assign(cutoffPassed(dateCutoff, settings.timeZone, order.deliveryDate, settings.locale), { lockOrderId: order.id });
  }
  if (order.status === "locked") throw cutoffPassed(dateCutoff, settings.timeZone, order.deliveryDate, settings.locale);
  if (order.status !== "open") throw new HttpError(409, "order_closed", `This order is ${ORDER_STATUS_LABELS[order.status].toLowerCase()} and can no longer be changed.`);
  refuseIfAccountBlocked(account, bakery);
  return order;
}

/** A write refused because the date's cut-off had passed locks the order at once (not waiting for the job). */
async function lockAfterRefusal<T>(ctx: AppContext, work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (err) {
    const id = (err as { lockOrderId?: number }).lockOrderId;
    if (id) await ctx.dataSource.getRepository(Order).update({ id, status: "open" }, { status: "locked" });
    throw err;
  }
}

/** The scheduled job: every open order whose date's cut-off has passed becomes locked. */
export async function lockPastCutoff(ctx: AppContext): Promise<number> {
  const settings = await loadCalendarSettings(ctx);
  const now = ctx.clock.now();
  const today = DateTime.fromJSDate(now, { zone: settings.timeZone }).toISODate()!;
  // Only dates up to today + lead days can have passed their cut-off.
  const until = DateTime.fromISO(today).plus({ days: settings.leadDays + 1 }).toISODate()!;
  const dates: { d: string }[] = await ctx.dataSource.query("SELECT DISTINCT deliveryDate AS d FROM customer_order WHERE status = 'open' AND deliveryDate <= ?", [until]);
  let locked = 0;
  for (const { d } of dates) {
    const date = String(d).slice(0, 10);
    if (now.getTime() >= cutoffFor(date, settings).toMillis()) {
      const res = await ctx.dataSource.getRepository(Order).update({ deliveryDate: date, status: "open" }, { status: "locked" });
      locked += res.affected ?? 0;
    }
  }
  return locked;
}

// ---- idempotency ------------------------------------------------------------------------------

/**
 * Run a POST once per (user, Idempotency-Key): a retry with the same key and body gets the stored
 * first answer. A concurrent twin is serialised by the account lock, finds the order already there,
 * and then answers with the first request's stored result.
 */
/**
 * Saves the stored answer of an idempotent request inside the write's own transaction, so a crash between
 * the order's commit and the record can never answer "nothing was saved" for an order that was saved.
 */
export type SaveIdempotent = (m: EntityManager, status: number, body: unknown) => Promise<void>;

export async function withIdempotency(ctx: AppContext, userId: number, key: string | undefined, body: unknown, exec: (save: SaveIdempotent | undefined) => Promise<{ status: number; body: unknown }>): Promise<{ status: number; body: unknown; replayed: boolean }> {
  if (!key) return { ...(await exec(undefined)), replayed: false };
  if (key.length > 100) throw badRequest("The Idempotency-Key header is too long (at most 100 characters).");
  const requestHash = crypto.createHash("sha256").update(JSON.stringify(body ?? null)).digest("hex");
  const repo = ctx.dataSource.getRepository(IdempotencyRecord);
  const stored = async () => {
    const row = await repo.findOneBy({ userId, idemKey: key });
    if (!row) return null;
    if (row.requestHash !== requestHash) throw new HttpError(422, "idempotency_mismatch", "This Idempotency-Key was already used with a different request.");
    return { status: row.status, body: JSON.parse(row.body), replayed: true };
  };
  const first = await stored();
  if (first) return first;
  let savedInside = false;
  const save: SaveIdempotent = async (m, status, answer) => {
    await m.getRepository(IdempotencyRecord).insert({ userId, idemKey: key, requestHash, status, body: JSON.stringify(answer) });
    savedInside = true;
  };
  try {
    const result = await exec(save);
    if (result.status < 300 && !savedInside) await repo.insert({ userId, idemKey: key, requestHash, status: result.status, body: JSON.stringify(result.body) });
    return { ...result, replayed: false };
  } catch (err) {
    // A concurrent twin got there first: its order_exists means "already done" — answer as it did.
    if (err instanceof HttpError && err.code === "order_exists") {
      for (let i = 0; i < 20; i++) {
        const again = await stored();
        if (again) return again;
        await new Promise((r) => setTimeout(r, 25));
      }
    }
    throw err;
  }
}

// ---- mail --------------------------------------------------------------------------------------

/** Queue the confirmation or change mail to the account's buyers, in the order's own transaction. */
export async function queueOrderMail(ctx: AppContext, m: EntityManager, order: OrderDto, kind: "placed" | "changed" | "cancelled") {
  const buyers = await m.getRepository(User).findBy({ accountId: order.accountId, disabled: false, role: "buyer" });
  if (!buyers.length) return;
  const bakery = await getBakery(ctx, m);
  const mail = orderMail({ bakeryName: bakery.name, currency: bakery.currency, timeZone: bakery.timeZone, locale: bakery.locale, order, kind, url: `${ctx.config.publicUrl}/buyer/order/${order.deliveryDate}` });
  for (const b of buyers) await enqueueMail(m, ctx, `order_${kind}`, { to: b.email, fromName: bakery.name, ...mail });
}
