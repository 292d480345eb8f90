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

export interface BoardDto {
  date: string;
  products: BoardProductDto[];
  rows: BoardRowDto[];
  totalCents: number;
}
