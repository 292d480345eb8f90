import { In, LessThan } from "typeorm";
import type { AppContext } from "../http/context";
import { badRequest } from "../http/errors";
import { DeliveryAdjustment } from "./delivery-adjustment.entity";
import type { Invoice } from "./invoice.entity";
import { Order } from "../orders/order.entity";
import { OrderLine } from "../orders/order-line.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { getBakery } from "../bakery/bakery.service";
import { retryOnDeadlock } from "../db/retry";
import { localToday } from "../../shared/calendar";
import type { DispatchAdjustment } from "../../shared/schemas/billing";
import type { DispatchResult } from "../../shared/contracts/billing";
import { issueInvoice } from "./invoices.service";

// ---- deliveries ------------------------------------------------------------------------------------

/**
 * Confirm a day's dispatch: every locked (or open) order for the date becomes delivered; adjustments
 * record what went out short. Accounts paying by card get their invoice at once.
 */
export async function confirmDispatch(ctx: AppContext, date: string, adjustments: DispatchAdjustment[]): Promise<DispatchResult> {
  const result = await ctx.dataSource.transaction(async (m) => {
    const orders = await m.getRepository(Order).createQueryBuilder("o").setLock("pessimistic_write")
      .where("o.deliveryDate = :d AND o.status IN ('open', 'locked')", { d: date }).getMany();
    const ids = new Set(orders.map((o) => o.id));
    const lines = orders.length ? await m.getRepository(OrderLine).findBy({ orderId: In([...ids]) }) : [];
    const fields: Record<string, string> = {};
    adjustments.forEach((a, i) => {
      const line = lines.find((l) => l.orderId === a.orderId && l.productId === a.productId);
      if (!ids.has(a.orderId)) fields[`adjustments.${i}.orderId`] = "That order is not waiting for dispatch on this date.";
      else if (!line) fields[`adjustments.${i}.productId`] = "That product is not on the order.";
      else if (a.deliveredQuantity > line.quantity) fields[`adjustments.${i}.deliveredQuantity`] = `At most the ${line.quantity} ordered.`;
    });
    if (Object.keys(fields).length) throw badRequest("Some adjustments need attention.", fields);
    for (const a of adjustments) {
      await m.getRepository(DeliveryAdjustment).upsert({ orderId: a.orderId, productId: a.productId, deliveredQuantity: a.deliveredQuantity, reason: a.reason ?? "", creditNoteId: null }, ["orderId", "productId"]);
    }
    if (ids.size) await m.getRepository(Order).update({ id: In([...ids]) }, { status: "delivered" });
    return orders;
  });
  const invoices = await invoiceCardOrders(ctx, result.map((o) => o.id));
  return { delivered: result.length, invoices: invoices.map((i) => i.number) };
}

/** Card accounts: one invoice per delivered order. An order another process just invoiced is skipped. */
async function invoiceCardOrders(ctx: AppContext, orderIds: number[]): Promise<Invoice[]> {
  if (!orderIds.length) return [];
  const orders = await ctx.dataSource.getRepository(Order).findBy({ id: In(orderIds), status: "delivered" });
  const out: Invoice[] = [];
  for (const o of orders) {
    try {
      const inv = await retryOnDeadlock(() => ctx.dataSource.transaction(async (m) => {
        const account = await m.getRepository(CustomerAccount).findOneByOrFail({ id: o.accountId });
        if (account.paymentTerms !== "card") return null;
        return issueInvoice(ctx, m, account, [o.id], "order");
      }));
      if (inv) out.push(inv);
    } catch (err) {
      if ((err as { driverError?: { errno?: number } }).driverError?.errno !== 1062) throw err; // its lines are on another invoice
    }
  }
  return out;
}

/** The job: delivered orders of card accounts that have no invoice yet (after a failure, or a change of terms). */
export async function invoiceUninvoicedCardOrders(ctx: AppContext): Promise<number> {
  const rows: { id: number }[] = await ctx.dataSource.query(
    `SELECT DISTINCT o.id FROM customer_order o JOIN customer_account a ON a.id = o.accountId AND a.paymentTerms = 'card'
       JOIN order_line l ON l.orderId = o.id LEFT JOIN invoice_line il ON il.orderLineId = l.id
      WHERE o.status = 'delivered' AND il.id IS NULL LIMIT 500`);
  return (await invoiceCardOrders(ctx, rows.map((r) => Number(r.id)))).length;
}

/** The job: orders not confirmed by the end of their delivery day are delivered as ordered (and invoiced). */
export async function autoDeliver(ctx: AppContext): Promise<number> {
  const bakery = await getBakery(ctx);
  const today = localToday(ctx.clock.now(), bakery.timeZone);
  const due = await ctx.dataSource.getRepository(Order).findBy({ deliveryDate: LessThan(today), status: In(["locked", "open"]) });
  if (!due.length) return 0;
  await ctx.dataSource.getRepository(Order).update({ id: In(due.map((o) => o.id)), status: In(["locked", "open"]) }, { status: "delivered" });
  await invoiceCardOrders(ctx, due.map((o) => o.id));
  return due.length;
}
