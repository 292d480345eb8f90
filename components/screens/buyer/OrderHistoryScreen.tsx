import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { Badge } from "../../ui/Badge";
import { useBakeryQuery } from "../../api/bakery";
import { useOrdersQuery } from "../../api/orders";
import { addDays, dayHeading } from "../../ordering/dates";
import { OrderStatusBadge, buyerStatusLabel } from "../ordering/OrderStatusBadge";
import { useMoney } from "../../ordering/useMoney";
import { combinedQuery } from "../ordering/combinedQuery";
import { ListCard, ListCardText, ListCardTitle, ListCardTop } from "../../ui/ListCard";
import { productsLabel } from "../../ordering/quantities";
import { quantityText } from "../../../shared/quantity";
import type { OrderDto } from "../../../shared/schemas/orders";
import { space } from "../../theme";

type Show = "upcoming" | "past";

/** How far back the history reaches. */
export const HISTORY_DAYS = 90;

/** The buyer's orders: coming ones soonest first, past ones newest first, each with its status. */
export function OrderHistoryScreen() {
  const bakery = useBakeryQuery();
  const today = bakery.data?.today;
  const [show, setShow] = useState<Show>("upcoming");
  const orders = useOrdersQuery(today ? { from: addDays(today, -HISTORY_DAYS), to: addDays(today, 180) } : {}, { enabled: !!today });

  const loaded = combinedQuery([bakery, orders], today && orders.data ? { today, orders: orders.data } : undefined);
  const shown = (d: { today: string; orders: OrderDto[] }) =>
    show === "upcoming" ? d.orders.filter((o) => o.deliveryDate >= d.today) : d.orders.filter((o) => o.deliveryDate < d.today).reverse();

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
      <QueryStates
        query={loaded}
        loadingLabel="Loading your orders…"
        errorTitle="Your orders didn't load"
        testID="history"
        isEmpty={(d) => shown(d).length === 0}
        empty={{
          icon: "list",
          title: show === "upcoming" ? "No orders coming up" : "No past orders yet",
          message: show === "upcoming" ? "Open a delivery date from Home to place one." : `Orders from the last ${HISTORY_DAYS} days show here.`,
        }}
      >
        {(d) => (
          <View style={styles.list} testID="history-list">
            {shown(d).map((o) => (
              <OrderRow key={o.id} order={o} today={d.today} />
            ))}
          </View>
        )}
      </QueryStates>
    </Screen>
  );
}

function OrderRow({ order: o, today }: { order: OrderDto; today: string }) {
  const money = useMoney();
  const what = o.lines.map((l) => `${l.productName} (${quantityText(l.quantity, l)})`).join(", ");
  return (
    <ListCard
      href={`/buyer/order/${o.deliveryDate}?from=history`}
      accessibilityLabel={`${dayHeading(o.deliveryDate, today)}, ${buyerStatusLabel(o.status)}, ${money(o.totalCents)}`}
      testID={`history-order-${o.id}`}
      quiet={o.status === "cancelled"}
    >
      <ListCardText>
        <ListCardTop>
          <ListCardTitle>{dayHeading(o.deliveryDate, today)}</ListCardTitle>
          <OrderStatusBadge status={o.status} testID={`history-order-${o.id}-status`} />
        </ListCardTop>
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
      </ListCardText>
    </ListCard>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs, marginTop: space.xxs },
});
