/**
 * The orders board (GET /api/orders/board?date=): accounts × products for one delivery date, cancelled orders
 * left out. Made by server/orders/board.service.ts `board`, shown by the office and bakery board screens.
 */
import type { OrderStatus } from "../schemas/orders";

export interface BoardProductDto {
  id: number;
  name: string;
  saleUnit: string;
  saleUnitPlural: string;
  /** Units of this product over every row. */
  total: number;
}

export interface BoardRowDto {
  accountId: number;
  accountName: string;
  orderId: number;
  status: OrderStatus;
  poNumber: string | null;
  /** Units by product id (JSON object keys: the ids as strings). */
  quantities: Record<number, number>;
  totalCents: number;
}

/** An account on hold whose standing order would deliver on the date: no order is made for it while the hold lasts. */
export interface BoardHeldDto {
  accountId: number;
  accountName: string;
  /** "credit": held automatically for overdue invoices (paying lifts it); "paused": held by the bakery by hand. */
  hold: "credit" | "paused";
}

export interface BoardDto {
  date: string;
  products: BoardProductDto[];
  rows: BoardRowDto[];
  totalCents: number;
  /** Accounts left off the date because they are on hold (not on the board, so the office knows why). */
  held: BoardHeldDto[];
}
