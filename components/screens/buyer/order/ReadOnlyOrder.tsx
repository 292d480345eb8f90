import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Notice } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import { OrderStatusBadge } from "../../ordering/OrderStatusBadge";
import { CallBakery } from "../../common/CallBakery";
import { useMoney } from "../../../ordering/useMoney";
import { formatCutoff } from "../../../ordering/dates";
import { quantityText } from "../../../../shared/quantity";
import type { OrderDto } from "../../../../shared/schemas/orders";
import { colors, layout, space } from "../../../theme";

/** A locked or delivered order: what the bakery has, line by line. */
export function ReadOnlyOrder({ order, timeZone }: { order: OrderDto; timeZone?: string }) {
  const money = useMoney();
  return (
    <>
      <View style={styles.statusRow}>
        <OrderStatusBadge status={order.status} testID="order-status" />
      </View>
      <Notice
        tone="info"
        testID="order-readonly"
        message={
          order.status === "delivered"
            ? "This order has been delivered."
            : `This order is locked for baking: the cut-off was ${formatCutoff(order.cutoffAt, timeZone)}. Call the bakery if something has to change.`
        }
      />
      {order.status === "delivered" ? null : <CallBakery />}
      <Card title="What's coming" testID="order-lines">
        {order.lines.map((l, i) => (
          <View key={l.productId} style={[styles.receiptLine, i > 0 && styles.divider]}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong">{l.productName}</AppText>
              <AppText variant="small" color="muted">{`${quantityText(l.quantity, l)} · ${money(l.unitPriceCents)} per ${l.saleUnit}`}</AppText>
            </View>
            <AppText variant="bodyStrong">{money(l.lineTotalCents)}</AppText>
          </View>
        ))}
        <View style={[styles.receiptLine, styles.divider]}>
          <AppText variant="heading">Total</AppText>
          <AppText variant="heading" testID="order-total">
            {money(order.totalCents)}
          </AppText>
        </View>
        {order.poNumber ? <AppText color="muted">{`PO number: ${order.poNumber}`}</AppText> : null}
        {order.note ? <AppText color="muted">{`Note: ${order.note}`}</AppText> : null}
      </Card>
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  statusRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.md },
  receiptLine: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md, paddingVertical: space.sm, minHeight: layout.minTouch },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});
