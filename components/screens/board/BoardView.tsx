import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { AppText, Heading } from "../../ui/Text";
import type { BoardDto } from "../../api/board";
import { ordersLabel, productsLabel } from "../../ordering/quantities";
import { useIsWide } from "../../shell/useIsWide";
import { useMoney } from "../../ordering/useMoney";
import { quantityText, saleUnitFor } from "../../../shared/quantity";
import { colors, radii, space } from "../../theme";
import { BoardCards } from "./BoardCards";
import { BoardTable } from "./BoardTable";

/** A date's board: what to bake in total, then who gets what (a table on wide screens, cards on phones). */
export function BoardView({ board, showMoney }: { board: BoardDto; showMoney: boolean }) {
  const wide = useIsWide();
  const money = useMoney();
  return (
    <>
      <Card title="To bake in total" testID="board-totals">
        <View style={styles.tiles}>
          {board.products.map((p) => (
            <View key={p.id} style={styles.tile} testID={`board-total-${p.id}`} accessible accessibilityLabel={`${p.name}: ${quantityText(p.total, p)}`}>
              <AppText variant="display" style={styles.big}>
                {String(p.total)}
              </AppText>
              <AppText variant="bodyStrong">{p.name}</AppText>
              <AppText variant="small" color="muted">
                {saleUnitFor(p.total, p)}
              </AppText>
            </View>
          ))}
        </View>
        <AppText color="muted" testID="board-grand-total">
          {`${ordersLabel(board.rows.length)} · ${productsLabel(board.products.length)}${showMoney ? ` · ${money(board.totalCents)}` : ""}`}
        </AppText>
      </Card>
      <Heading level={2}>By account</Heading>
      {wide ? <BoardTable board={board} showMoney={showMoney} /> : <BoardCards board={board} showMoney={showMoney} />}
    </>
  );
}

const styles = StyleSheet.create({
  tiles: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  tile: { flexGrow: 1, flexBasis: 150, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  big: { fontSize: 40, lineHeight: 46 },
});
