import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText } from "../../ui/Text";
import { ListCard, ListCardText, ListCardTitle, ListCardTop, ListCards } from "../../ui/ListCard";
import type { BoardDto } from "../../api/board";
import { saleUnitFor } from "../../../shared/quantity";
import { OrderStatusBadge } from "../ordering/OrderStatusBadge";
import { useMoney } from "../../ordering/useMoney";
import { space } from "../../theme";

/** The board on a phone: a card per order with its lines. */
export function BoardCards({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const money = useMoney();
  const names = new Map(board.products.map((p) => [p.id, p]));
  const lineName = (p: BoardDto["products"][number] | undefined, q: number) => (p ? `${p.name} (${saleUnitFor(q, p)})` : "Product");
  return (
    <ListCards testID="board-list">
      {board.rows.map((r) => (
        <ListCard key={r.orderId} testID={`board-row-${r.orderId}`}>
          <ListCardText>
            <ListCardTop>
              <ListCardTitle>{r.accountName}</ListCardTitle>
              <OrderStatusBadge status={r.status} />
            </ListCardTop>
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
          </ListCardText>
        </ListCard>
      ))}
    </ListCards>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  line: { flexDirection: "row", alignItems: "baseline", gap: space.sm, paddingVertical: 2 },
  qty: { minWidth: 32, textAlign: "right" },
});
