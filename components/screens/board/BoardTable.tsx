import React from "react";
import { ScrollView, StyleSheet, View } from "react-native";
import { AppText } from "../../ui/Text";
import type { BoardDto } from "../../api/board";
import { ordersLabel } from "../../ordering/quantities";
import { OrderStatusBadge } from "../ordering/OrderStatusBadge";
import { useMoney } from "../../ordering/useMoney";
import { colors, layout, radii, space } from "../../theme";

// A column per product and a total row: it scrolls sideways, so the columns have fixed widths.
const ACCOUNT_W = 200;
const STATUS_W = 150;
const PO_W = 110;
const QTY_W = 96;
const TOTAL_W = 110;

/** The board as a table: an account per row, a product per column, the totals last. */
export function BoardTable({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const money = useMoney();
  return (
    <ScrollView horizontal style={styles.tableScroll} contentContainerStyle={styles.tableContent}>
      <View style={styles.table} testID="board-table" role="table">
        <View style={[styles.tr, styles.th]} role="row">
          <Cell w={ACCOUNT_W} header>
            Account
          </Cell>
          <Cell w={STATUS_W} header>
            Status
          </Cell>
          <Cell w={PO_W} header>
            PO
          </Cell>
          {board.products.map((p) => (
            <Cell key={p.id} w={QTY_W} header right>
              {p.name}
            </Cell>
          ))}
          {showMoney ? (
            <Cell w={TOTAL_W} header right>
              Total
            </Cell>
          ) : null}
        </View>
        {board.rows.map((r) => (
          <View key={r.orderId} style={[styles.tr, styles.divider]} role="row" testID={`board-row-${r.orderId}`}>
            <Cell w={ACCOUNT_W} strong>
              {r.accountName}
            </Cell>
            <View style={[styles.td, { width: STATUS_W }]} role="cell">
              <OrderStatusBadge status={r.status} />
            </View>
            <Cell w={PO_W}>{r.poNumber ?? "—"}</Cell>
            {board.products.map((p) => (
              <Cell key={p.id} w={QTY_W} right muted={!r.quantities[p.id]}>
                {r.quantities[p.id] ? String(r.quantities[p.id]) : "–"}
              </Cell>
            ))}
            {showMoney ? (
              <Cell w={TOTAL_W} right>
                {money(r.totalCents)}
              </Cell>
            ) : null}
          </View>
        ))}
        <View style={[styles.tr, styles.totalRow]} role="row" testID="board-total-row">
          <Cell w={ACCOUNT_W} strong>
            Total
          </Cell>
          <Cell w={STATUS_W}>{ordersLabel(board.rows.length)}</Cell>
          <Cell w={PO_W}> </Cell>
          {board.products.map((p) => (
            <Cell key={p.id} w={QTY_W} right strong>
              {String(p.total)}
            </Cell>
          ))}
          {showMoney ? (
            <Cell w={TOTAL_W} right strong>
              {money(board.totalCents)}
            </Cell>
          ) : null}
        </View>
      </View>
    </ScrollView>
  );
}

function Cell({ w, children, header, right, strong, muted }: { w: number; children: React.ReactNode; header?: boolean; right?: boolean; strong?: boolean; muted?: boolean }) {
  const grow = w === ACCOUNT_W;
  return (
    <View style={[styles.td, grow ? { minWidth: w, flexGrow: 1, flexBasis: w } : { width: w }, right && styles.right]} role={header ? "columnheader" : "cell"}>
      <AppText variant={header ? "caption" : strong ? "bodyStrong" : "body"} color={header || muted ? "muted" : "ink"} align={right ? "right" : undefined}>
        {children}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  tableScroll: { flexGrow: 0 },
  tableContent: { flexGrow: 1 },
  table: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, overflow: "hidden", flexGrow: 1 },
  tr: { flexDirection: "row", alignItems: "center", minHeight: layout.minTouch + 8, paddingHorizontal: space.sm },
  th: { backgroundColor: colors.sunken, minHeight: layout.minTouch },
  td: { paddingHorizontal: space.sm, paddingVertical: space.sm, justifyContent: "center" },
  right: { alignItems: "flex-end" },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  totalRow: { borderTopWidth: 2, borderTopColor: colors.inputBorder, backgroundColor: colors.sunken },
});
