import type { AppContext } from "../http/context";
import { Invoice } from "../billing/invoice.entity";
import { OutboxMail } from "../mail/outbox.entity";
import { getBakery } from "./bakery.service";
import { loadCalendarSettings } from "../calendar/calendar.service";
import { amountDue } from "../../shared/billing";
import { addDays, dateStatus, localToday } from "../../shared/calendar";
import { outboxKindsFor } from "../../shared/mail";
import type { OfficeOverviewDto } from "../../shared/schemas/bakery";
import type { Role } from "../../shared/roles";

/**
 * The office's figures for the day: today's and tomorrow's orders (how many, how many units, what they are worth),
 * what is owed and overdue, the next cut-off still ahead, and mail that could not be sent (the kinds the role sees).
 */
export async function officeOverview(ctx: AppContext, role: Role): Promise<OfficeOverviewDto> {
  const bakery = await getBakery(ctx);
  const settings = await loadCalendarSettings(ctx);
  const now = ctx.clock.now();
  const today = localToday(now, bakery.timeZone);
  const dates = [today, addDays(today, 1)];
  // Both days at once: orders and their value per date, then the units on those orders per date.
  const where = "o.deliveryDate IN (?, ?) AND o.status <> 'cancelled'";
  const rows: { date: string; orders: string; total: string | null }[] = await ctx.dataSource.query(
    `SELECT DATE_FORMAT(o.deliveryDate, '%Y-%m-%d') AS date, COUNT(*) AS orders, SUM(o.totalCents) AS total FROM customer_order o WHERE ${where} GROUP BY o.deliveryDate`, dates);
  const unitRows: { date: string; units: string | null }[] = await ctx.dataSource.query(
    `SELECT DATE_FORMAT(o.deliveryDate, '%Y-%m-%d') AS date, SUM(l.quantity) AS units FROM order_line l JOIN customer_order o ON o.id = l.orderId WHERE ${where} GROUP BY o.deliveryDate`, dates);
  const units = new Map(unitRows.map((r) => [r.date, Number(r.units ?? 0)]));
  const byDate = new Map(rows.map((r) => [r.date, r]));
  const days = dates.map((date) => {
    const r = byDate.get(date);
    return { date, orders: Number(r?.orders ?? 0), units: units.get(date) ?? 0, totalCents: Number(r?.total ?? 0) };
  });
  const open = (await ctx.dataSource.getRepository(Invoice).find({ where: { status: "open" } })).filter((i) => amountDue(i) > 0);
  const overdue = open.filter((i) => i.dueDate < today);
  let nextCutoff: OfficeOverviewDto["nextCutoff"] = null;
  for (let i = 0; i <= settings.horizonDays && !nextCutoff; i++) {
    const st = dateStatus(addDays(today, i), settings, now, null);
    if (st.orderable) nextCutoff = { date: st.date, at: st.cutoffAt };
  }
  const kinds = role === "owner" || role === "bookkeeper" ? outboxKindsFor(role) : [];
  const failedQuery = ctx.dataSource.getRepository(OutboxMail).createQueryBuilder("m").where("m.status = 'failed'");
  if (kinds) failedQuery.andWhere(kinds.length ? "m.kind IN (:...kinds)" : "1 = 0", { kinds });
  return {
    currency: bakery.currency,
    days,
    owedCents: open.reduce((s, i) => s + amountDue(i), 0),
    overdueCents: overdue.reduce((s, i) => s + amountDue(i), 0),
    overdueInvoices: overdue.length,
    nextCutoff,
    failedMail: await failedQuery.getCount(),
  };
}
