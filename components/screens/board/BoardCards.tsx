import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText } from "../../ui/Text";
import type { BoardDto } from "../../api/board";
import { saleUnitFor } from "../../../shared/quantity";
import { OrderStatusBadge } from "../ordering/OrderStatusBadge";
import { useMoney } from "../../ordering/useMoney";
import { colors, radii, space } from "../../theme";

/** The board on a phone: a card per order with its lines. */
export function BoardCards({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const money = useMoney();
  const names = new Map(board.products.map((p) => [p.id, p]));
  const lineName = (p: BoardDto["products"][number] | undefined, q: number) => (p ? `${p.name} (${saleUnitFor(q, p)})` : "Product");
  return (
    <View style={styles.cards} testID="board-list">
      {board.rows.map((r) => (
        <View key={r.orderId} style={styles.card} testID={`board-row-${r.orderId}`}>
          <View style={styles.cardTop}>
            <AppText variant="bodyStrong" style={styles.flex}>
              {r.accountName}
            </AppText>
            <OrderStatusBadge status={r.status} />
          </View>
          {r.poNumber ? <AppText variant="small" color="muted">{`PO ${r.poNumber}`}</AppText> : null}
          <View>
            {Object.entries(r.quantities)
              .filter(([, q]) => q > 0)
              .map(([id, q]) => (
                <View key={id} style={styles.line}>
                  <AppText variant="bodyStrong" style={styles.qty}>
                    {String(q)}
                  </AppText>
                  <AppText style={styles.flex}>{lineName(names.get(Number(id)), q)}</AppText>
                </View>
              ))}
          </View>
          {showMoney ? (
            <AppText variant="label" align="right">
              {money(r.totalCents)}
            </AppText>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  cards: { gap: space.sm },
  card: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, padding: space.lg, gap: space.xs },
  cardTop: { flexDirection: "row", alignItems: "center", gap: space.sm },
  line: { flexDirection: "row", alignItems: "baseline", gap: space.sm, paddingVertical: 2 },
  qty: { minWidth: 32, textAlign: "right" },
});
