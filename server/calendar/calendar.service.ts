import type { EntityManager } from "typeorm";
import { localeOr } from "../../shared/format";
import type { AppContext } from "../http/context";
import { Bakery } from "../bakery/bakery.entity";
import { BakeryClosure } from "./closure.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { Order } from "../orders/order.entity";
import { getBakery } from "../bakery/bakery.service";
import { badRequest, notFound } from "../http/errors";
import { REASON_TEXT, dateRange, dateStatus, daysBetween, isSupportedDate, localToday, weekdayOf, type CalendarSettings, type Weekday } from "../../shared/calendar";
import { CALENDAR_MAX_DAYS, DATE_LIMIT_MESSAGE, type CalendarDayDto, type CalendarSettingsDto, type CalendarSettingsInput } from "../../shared/schemas/calendar";
import type { SessionUser } from "../../shared/schemas/auth";

export const parseWeekdays = (s: string | null): Weekday[] | null =>
  s === null ? null : s.split(",").filter(Boolean).map(Number).filter((n) => n >= 1 && n <= 7) as Weekday[];
export const formatWeekdays = (w: Weekday[] | null): string | null => (w === null ? null : [...w].sort().join(","));

export async function loadCalendarSettings(ctx: AppContext, m: EntityManager = ctx.dataSource.manager): Promise<CalendarSettings & { closureNotes: Map<string, string> }> {
  const bakery = await getBakery(ctx, m);
  const closures = await m.getRepository(BakeryClosure).find({ order: { date: "ASC" } });
  return {
    timeZone: bakery.timeZone,
    locale: bakery.locale,
    deliveryWeekdays: parseWeekdays(bakery.deliveryWeekdays) ?? [],
    cutoffTime: bakery.cutoffTime,
    leadDays: bakery.leadDays,
    horizonDays: bakery.horizonDays,
    closures: closures.map((c) => c.date),
    closureNotes: new Map(closures.map((c) => [c.date, c.note])),
  };
}

export async function getSettingsDto(ctx: AppContext): Promise<CalendarSettingsDto> {
  const s = await loadCalendarSettings(ctx);
  return {
    timeZone: s.timeZone,
    locale: localeOr(s.locale),
    deliveryWeekdays: s.deliveryWeekdays,
    cutoffTime: s.cutoffTime,
    leadDays: s.leadDays,
    horizonDays: s.horizonDays,
    closures: s.closures.map((date) => ({ date, note: s.closureNotes.get(date) ?? "" })),
  };
}

export async function putSettings(ctx: AppContext, input: CalendarSettingsInput & { closures: { date: string; note: string }[] }): Promise<CalendarSettingsDto> {
  const bakery = await getBakery(ctx);
  await ctx.dataSource.transaction(async (m) => {
    await m.getRepository(Bakery).update({ id: bakery.id }, {
      timeZone: input.timeZone,
      ...(input.locale ? { locale: input.locale } : {}),
      deliveryWeekdays: formatWeekdays(input.deliveryWeekdays as Weekday[])!,
      cutoffTime: input.cutoffTime,
      leadDays: Number(input.leadDays),
      horizonDays: Number(input.horizonDays),
    });
    await m.getRepository(BakeryClosure).clear();
    const unique = new Map(input.closures.map((c) => [c.date, c.note]));
    if (unique.size) await m.getRepository(BakeryClosure).insert([...unique].map(([date, note]) => ({ date, note })));
  });
  return getSettingsDto(ctx);
}

/** A date after today in the bakery's zone is refused with a 400 on `field` (say, a statement period that ends in the future). */
export async function refuseAfterToday(ctx: AppContext, date: string | undefined, field: string, message: string): Promise<void> {
  if (date === undefined) return;
  const today = localToday(ctx.clock.now(), (await getBakery(ctx)).timeZone);
  if (daysBetween(today, date) > 0) throw badRequest(message, { [field]: message });
}

/** Office users name the account; buyers always get their own. */
export async function resolveAccount(ctx: AppContext, actor: SessionUser, accountId: number | undefined, m: EntityManager = ctx.dataSource.manager): Promise<CustomerAccount> {
  let id: number;
  if (actor.role === "buyer") {
    if (accountId !== undefined && accountId !== actor.accountId) throw notFound("That account");
    id = actor.accountId!;
  } else {
    if (!accountId) throw badRequest("Choose an account.", { accountId: "Choose an account." });
    id = accountId;
  }
  const account = await m.getRepository(CustomerAccount).findOneBy({ id });
  if (!account) throw notFound("That account");
  return account;
}

export async function calendarFor(ctx: AppContext, actor: SessionUser, q: { from: string; to: string; accountId?: number }): Promise<CalendarDayDto[]> {
  // The span is checked from day counts before anything is built or read (calendarQuerySchema checks it too).
  if (!isSupportedDate(q.from) || !isSupportedDate(q.to)) throw badRequest(DATE_LIMIT_MESSAGE, { to: DATE_LIMIT_MESSAGE });
  const span = daysBetween(q.from, q.to) + 1;
  if (span < 1) throw badRequest("The end date must not be before the start.", { to: "The end date must not be before the start." });
  if (span > CALENDAR_MAX_DAYS) throw badRequest(`Ask for at most ${CALENDAR_MAX_DAYS} days at a time.`, { to: `At most ${CALENDAR_MAX_DAYS} days after the start.` });
  const account = await resolveAccount(ctx, actor, q.accountId);
  const settings = await loadCalendarSettings(ctx);
  const routeDays = parseWeekdays(account.routeWeekdays);
  const orders = await ctx.dataSource.getRepository(Order).createQueryBuilder("o")
    .leftJoin("o.lines", "l")
    .select(["o.id AS id", "o.deliveryDate AS deliveryDate", "o.status AS status", "o.totalCents AS totalCents", "o.source AS source"])
    .addSelect("COUNT(l.id)", "productCount") // lines are one per product; their quantities are in unlike units
    .where("o.accountId = :a AND o.deliveryDate BETWEEN :from AND :to", { a: account.id, from: q.from, to: q.to })
    .groupBy("o.id").getRawMany<{ id: number; deliveryDate: string; status: string; totalCents: number; source: string; productCount: string }>();
  const byDate = new Map(orders.map((o) => [String(o.deliveryDate).slice(0, 10), o]));
  const now = ctx.clock.now();
  return dateRange(q.from, q.to, CALENDAR_MAX_DAYS).map((date) => {
    const st = dateStatus(date, settings, now, routeDays);
    const o = byDate.get(date);
    return {
      date,
      weekday: weekdayOf(date),
      orderable: st.orderable,
      reason: st.reason,
      reasonText: st.reason ? (st.reason === "closed" && settings.closureNotes.get(date) ? `${REASON_TEXT.closed}: ${settings.closureNotes.get(date)}` : REASON_TEXT[st.reason]) : null,
      cutoffAt: st.cutoffAt,
      order: o && o.status !== "cancelled" ? { id: Number(o.id), status: o.status, totalCents: Number(o.totalCents), productCount: Number(o.productCount), source: o.source } : null,
    };
  });
}

