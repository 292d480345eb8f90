import React from "react";
import { DataTable, NoValue, type Column } from "../../ui/DataTable";
import type { BoardDto, BoardRowDto } from "../../api/board";
import { ordersLabel } from "../../ordering/quantities";
import { OrderStatusBadge } from "../ordering/OrderStatusBadge";
import { useMoney } from "../../ordering/useMoney";

// A column per product: below about this width per column the table scrolls sideways.
const ACCOUNT_W = 200;
const STATUS_W = 150;
const PO_W = 110;
const QTY_W = 96;
const TOTAL_W = 110;

/** The board as a table: an account per row, a product per column, the totals last. */
export function BoardTable({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const money = useMoney();
  const columns: Column<BoardRowDto>[] = [
    { key: "account", label: "Account", flex: ACCOUNT_W / QTY_W, strong: true, render: (r) => r.accountName, footer: "Total" },
    { key: "status", label: "Status", flex: STATUS_W / QTY_W, render: (r) => <OrderStatusBadge status={r.status} />, footer: ordersLabel(board.rows.length) },
    { key: "po", label: "PO", flex: PO_W / QTY_W, render: (r) => r.poNumber ?? "—" },
    ...board.products.map(
      (p): Column<BoardRowDto> => ({
        key: `product-${p.id}`,
        label: p.name,
        align: "right",
        render: (r) => (r.quantities[p.id] ? String(r.quantities[p.id]) : <NoValue />),
        footer: String(p.total),
      }),
    ),
    ...(showMoney ? [{ key: "total", label: "Total", flex: TOTAL_W / QTY_W, align: "right" as const, render: (r: BoardRowDto) => money(r.totalCents), footer: money(board.totalCents) }] : []),
  ];
  const width = ACCOUNT_W + STATUS_W + PO_W + QTY_W * board.products.length + (showMoney ? TOTAL_W : 0);
  return (
    <DataTable
      columns={columns}
      rows={board.rows}
      rowKey={(r) => r.orderId}
      rowTestID={(r) => `board-row-${r.orderId}`}
      footer
      footerTestID="board-total-row"
      minWidth={width}
      testID="board-table"
    />
  );
}
