import { DateTime } from "luxon";
import type { AppContext } from "../http/context";
import { StandingOrder } from "../orders/standing-order.entity";
import { StandingOrderLine } from "../orders/standing-order-line.entity";
import { Order } from "../orders/order.entity";
import { OrderLine } from "../orders/order-line.entity";
import { Product } from "../catalog/product.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { pricingFor } from "../catalog/catalog.service";
import { getBakery } from "../bakery/bakery.service";
import { loadCalendarSettings, parseWeekdays } from "../calendar/calendar.service";
import { addDays, cutoffFor, localToday, weekdayOf } from "../../shared/calendar";
import { expandRule } from "../../shared/recurrence";
import { saleUnitFor } from "../../shared/quantity";

/**
 * Demo history: the standing orders as they would have run for the past weeks (delivered) and for the
 * dates already past their cut-off but not yet dispatched (locked), so the next bake day has a full plan.
 * Only dates with no order yet are filled in: running it again adds nothing.
 */
export async function seedHistory(ctx: AppContext, weeksBack = 4): Promise<number> {
  const settings = await loadCalendarSettings(ctx);
  const bakery = await getBakery(ctx);
  const now = ctx.clock.now();
  const today = localToday(now, settings.timeZone);
  const from = addDays(today, -7 * weeksBack);
  const until = addDays(today, settings.leadDays + 1);
  const products = new Map((await ctx.dataSource.getRepository(Product).find()).map((p) => [p.id, p]));
  let created = 0;
  for (const so of await ctx.dataSource.getRepository(StandingOrder).find({ where: { active: true } })) {
    const account = await ctx.dataSource.getRepository(CustomerAccount).findOneBy({ id: so.accountId });
    if (!account) continue;
    const lines = await ctx.dataSource.getRepository(StandingOrderLine).findBy({ standingOrderId: so.id });
    const pricing = await pricingFor(ctx, account.id);
    const routeDays = parseWeekdays(account.routeWeekdays);
    const skip = new Set<string>(JSON.parse(so.skipDates));
    for (const date of expandRule(so.rrule, from, until)) {
      if (skip.has(date) || settings.closures.includes(date) || !settings.deliveryWeekdays.includes(weekdayOf(date))) continue;
      if (routeDays && !routeDays.includes(weekdayOf(date))) continue;
      if (now.getTime() < cutoffFor(date, settings).toMillis()) continue; // still orderable: the standing-order job makes those
      const dayLines = lines.filter((l) => l.weekday === weekdayOf(date) && l.quantity > 0 && products.get(l.productId)?.active);
      if (!dayLines.length) continue;
      if (await ctx.dataSource.getRepository(Order).existsBy({ accountId: account.id, deliveryDate: date })) continue;
      const priced = dayLines.map((l) => {
        const p = products.get(l.productId)!;
        const unit = pricing.price(p);
        return { productId: p.id, productName: p.name, saleUnit: p.saleUnit, saleUnitPlural: saleUnitFor(2, p), quantity: l.quantity, unitPriceCents: unit, lineTotalCents: unit * l.quantity };
      });
      const [h, m] = bakery.dispatchTime.split(":").map(Number);
      const dispatched = DateTime.fromISO(date, { zone: settings.timeZone }).set({ hour: h, minute: m }).toMillis() <= now.getTime();
      await ctx.dataSource.transaction(async (tx) => {
        const order = await tx.getRepository(Order).save(tx.getRepository(Order).create({
          accountId: account.id, deliveryDate: date, status: dispatched && date < today ? "delivered" : "locked", poNumber: null, note: null,
          totalCents: priced.reduce((s, l) => s + l.lineTotalCents, 0), source: "standing", editedByHand: false, createdById: null,
        }));
        await tx.getRepository(OrderLine).insert(priced.map((l) => ({ ...l, orderId: order.id })));
      });
      created++;
    }
  }
  return created;
}
