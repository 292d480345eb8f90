import { In, MoreThan } from "typeorm";
import { stringify } from "csv-stringify/sync";
import { toDecimal } from "../../shared/money";
import { ORDER_STATUS_LABELS, type OrderStatus } from "../../shared/schemas/orders";
import { saleUnitFor } from "../../shared/quantity";
import type { AppContext } from "../http/context";
import { Product } from "../catalog/product.entity";
import { CustomerAccount } from "../accounts/account.entity";
import type { BoardDto, BoardHeldDto, BoardRowDto } from "../../shared/contracts/board";
import { StandingOrder } from "./standing-order.entity";
import { StandingOrderLine } from "./standing-order-line.entity";
import { expandRule } from "../../shared/recurrence";
import { weekdayOf } from "../../shared/calendar";

/** Accounts × products for one delivery date, summed in SQL. Cancelled orders are left out. */
export async function board(ctx: AppContext, date: string): Promise<BoardDto> {
  const cells: { orderId: number; accountId: number; status: OrderStatus; poNumber: string | null; totalCents: number; productId: number; qty: string }[] = await ctx.dataSource.query(
    `SELECT o.id AS orderId, o.accountId, o.status, o.poNumber, o.totalCents, l.productId, SUM(l.quantity) AS qty
       FROM customer_order o JOIN order_line l ON l.orderId = o.id
      WHERE o.deliveryDate = ? AND o.status <> 'cancelled'
      GROUP BY o.id, l.productId ORDER BY o.accountId`, [date]);
  const productIds = [...new Set(cells.map((c) => c.productId))];
  const products = productIds.length ? await ctx.dataSource.getRepository(Product).createQueryBuilder("p").whereInIds(productIds).orderBy("p.sortOrder").addOrderBy("p.name").getMany() : [];
  const all = await ctx.dataSource.getRepository(CustomerAccount).find();
  const accounts = new Map(all.map((a) => [a.id, a.businessName]));
  const rows = new Map<number, BoardRowDto>();
  const totals = new Map<number, number>();
  for (const c of cells) {
    const row = rows.get(c.orderId) ?? { accountId: c.accountId, accountName: accounts.get(c.accountId) ?? "", orderId: Number(c.orderId), status: c.status, poNumber: c.poNumber, quantities: {}, totalCents: Number(c.totalCents) };
    row.quantities[c.productId] = Number(c.qty);
    rows.set(c.orderId, row);
    totals.set(c.productId, (totals.get(c.productId) ?? 0) + Number(c.qty));
  }
  const list = [...rows.values()].sort((a, b) => a.accountName.localeCompare(b.accountName));
  return {
    date,
    products: products.map((p) => ({ id: p.id, name: p.name, saleUnit: p.saleUnit, saleUnitPlural: saleUnitFor(2, p), total: totals.get(p.id) ?? 0 })),
    rows: list,
    totalCents: list.reduce((s, r) => s + r.totalCents, 0),
    held: await heldOn(ctx, date, all.filter((a) => a.status === "on_hold" && !list.some((r) => r.accountId === a.id))),
  };
}

/** Of the held accounts given, those whose standing order delivers on `date` (not skipped, with lines that weekday). */
async function heldOn(ctx: AppContext, date: string, onHold: CustomerAccount[]): Promise<BoardHeldDto[]> {
  if (!onHold.length) return [];
  // Two queries for all held accounts: their active standing orders, and which of those have lines that weekday.
  const orders = await ctx.dataSource.getRepository(StandingOrder).findBy({ accountId: In(onHold.map((a) => a.id)), active: true });
  const due = orders.filter((so) => !(JSON.parse(so.skipDates) as string[]).includes(date) && expandRule(so.rrule, date, date).includes(date));
  const withLines = new Set(
    (due.length ? await ctx.dataSource.getRepository(StandingOrderLine).findBy({ standingOrderId: In(due.map((so) => so.id)), weekday: weekdayOf(date), quantity: MoreThan(0) }) : []).map((l) => l.standingOrderId),
  );
  const making = new Set(due.filter((so) => withLines.has(so.id)).map((so) => so.accountId));
  return onHold
    .filter((a) => making.has(a.id))
    .map((a): BoardHeldDto => ({ accountId: a.id, accountName: a.businessName, hold: a.creditHold ? "credit" : "paused" }))
    .sort((x, y) => x.accountName.localeCompare(y.accountName));
}

/** A money cell: a decimal string, kept as written even when negative (see boardCsv). */
interface MoneyCell { money: string }

/**
 * The board as CSV (RFC 4180 through csv-stringify): one row per account, a column per product, a totals row.
 * Text cells that start with = + - @ TAB or CR are prefixed with ' (csv-stringify `escape_formulas`; OWASP
 * "CSV Injection"), so a PO number or account name cannot run as a spreadsheet formula. Quantities are
 * numbers, which csv-stringify never escapes. Amounts are decimal strings ("18.00", to keep the cents);
 * escape_formulas would turn a negative one into "'-1.50", so a money cell — only ever digits, a point and
 * perhaps a leading minus, which no spreadsheet reads as a formula — is written with escaping off.
 * Order totals are never negative today; this keeps them numbers if that changes.
 */
export function boardCsv(b: BoardDto, currency: string): string {
  // Fixed headers in Title Case plain words (the CSV spec in DEVELOPERS.md); a product column is named by the
  // product and its sale unit as the catalog writes them. The status is the label people read, not the code.
  const header = ["Delivery Date", "Account", "Status", "PO Number", ...b.products.map((p) => `${p.name} (${p.saleUnit})`), `Order Total (${currency})`];
  const money = (c: number): MoneyCell => ({ money: toDecimal(c, currency) });
  const rows = b.rows.map((r) => [b.date, r.accountName, ORDER_STATUS_LABELS[r.status], r.poNumber ?? "", ...b.products.map((p) => r.quantities[p.id] ?? 0), money(r.totalCents)]);
  const totals = [b.date, "Total", "", "", ...b.products.map((p) => p.total), money(b.totalCents)];
  return stringify([header, ...rows, totals], {
    escape_formulas: true,
    cast: {
      object: (v) => {
        const m = (v as Partial<MoneyCell>).money;
        if (typeof m === "string" && /^-?\d+(\.\d+)?$/.test(m)) return { value: m, escape_formulas: false };
        return JSON.stringify(v);
      },
    },
  });
}
