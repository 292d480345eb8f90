import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Link } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { LinkPressable } from "../../ui/LinkPressable";
import { AppText } from "../../ui/Text";
import { Badge } from "../../ui/Badge";
import { useBakeryQuery } from "../../api/bakery";
import { useOrdersQuery } from "../../api/orders";
import { addDays, dayHeading } from "../../ordering/dates";
import { OrderStatusBadge, buyerStatusLabel, useMoney } from "../ordering/parts";
import { productsLabel } from "../../ordering/quantities";
import { quantityText } from "../../../shared/quantity";
import type { OrderDto } from "../../../shared/schemas/orders";
import { colors, layout, radii, space } from "../../theme";

type Show = "upcoming" | "past";

/** How far back the history reaches. */
export const HISTORY_DAYS = 90;

/** The buyer's orders: coming ones soonest first, past ones newest first, each with its status. */
export function OrderHistoryScreen() {
  const bakery = useBakeryQuery();
  const today = bakery.data?.today;
  const [show, setShow] = useState<Show>("upcoming");
  const orders = useOrdersQuery(today ? { from: addDays(today, -HISTORY_DAYS), to: addDays(today, 180) } : {}, { enabled: !!today });

  let body: React.ReactNode;
  if (bakery.isError || orders.isError) {
    const q = bakery.isError ? bakery : orders;
    body = <ErrorState error={q.error} title="Your orders didn't load" onRetry={() => q.refetch()} retrying={q.isFetching} testID="history-error" />;
  } else if (!today || orders.isPending) {
    body = <LoadingState label="Loading your orders…" testID="history-loading" />;
  } else {
    const list = show === "upcoming" ? orders.data.filter((o) => o.deliveryDate >= today) : orders.data.filter((o) => o.deliveryDate < today).reverse();
    body =
      list.length === 0 ? (
        <EmptyState
          icon="list"
          title={show === "upcoming" ? "No orders coming up" : "No past orders yet"}
          message={show === "upcoming" ? "Open a delivery date from Home to place one." : `Orders from the last ${HISTORY_DAYS} days show here.`}
          testID="history-empty"
        />
      ) : (
        <View style={styles.list} testID="history-list">
          {list.map((o) => (
            <OrderRow key={o.id} order={o} today={today} />
          ))}
        </View>
      );
  }

  return (
    <Screen testID="history-screen">
      <PageHeader overline="Wholesale ordering" title="Orders" subtitle={`Coming orders, and what was delivered in the last ${HISTORY_DAYS} days.`} testID="history-title" />
      <ChoiceGroup<Show>
        label="Show"
        testID="history-show"
        value={show}
        onChange={setShow}
        choices={[
          { value: "upcoming", label: "Coming up" },
          { value: "past", label: "Past" },
        ]}
      />
      {body}
    </Screen>
  );
}

function OrderRow({ order: o, today }: { order: OrderDto; today: string }) {
  const money = useMoney();
  const what = o.lines.map((l) => `${l.productName} (${quantityText(l.quantity, l)})`).join(", ");
  return (
    <Link href={`/buyer/order/${o.deliveryDate}`} asChild>
      <LinkPressable
        accessibilityRole="link"
        accessibilityLabel={`${dayHeading(o.deliveryDate, today)}, ${buyerStatusLabel(o.status)}, ${money(o.totalCents)}`}
        testID={`history-order-${o.id}`}
        style={StyleSheet.flatten([styles.row, o.status === "cancelled" && styles.quiet])}
        highlightStyle={styles.hover}
      >
        <View style={styles.text}>
          <View style={styles.top}>
            <AppText variant="bodyStrong" style={styles.grow}>
              {dayHeading(o.deliveryDate, today)}
            </AppText>
            <OrderStatusBadge status={o.status} testID={`history-order-${o.id}-status`} />
          </View>
          <AppText variant="small" color="ink">{`${productsLabel(o.lines.length)} · ${money(o.totalCents)}${o.poNumber ? ` · PO ${o.poNumber}` : ""}`}</AppText>
          <AppText variant="small" color="muted" numberOfLines={2}>
            {what}
          </AppText>
          {o.source === "standing" ? (
            <View style={styles.badges}>
              <Badge label="Standing order" tone="crust" />
              {o.editedByHand ? <Badge label="Changed by hand" tone="amber" /> : null}
            </View>
          ) : null}
        </View>
        <Feather name="chevron-right" size={20} color={colors.muted} />
      </LinkPressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: {
    minHeight: layout.minTouch + 20,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    padding: space.lg,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
  },
  quiet: { backgroundColor: colors.page },
  hover: { backgroundColor: colors.rowHover },
  text: { flex: 1, gap: space.xxs },
  top: { flexDirection: "row", alignItems: "center", gap: space.sm, flexWrap: "wrap" },
  grow: { flexGrow: 1, flexShrink: 1 },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs, marginTop: space.xxs },
});
