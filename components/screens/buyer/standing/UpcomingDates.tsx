import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { Link } from "expo-router";
import { Card } from "../../../ui/Card";
import { Badge } from "../../../ui/Badge";
import { LinkPressable } from "../../../ui/LinkPressable";
import { AppText } from "../../../ui/Text";
import { OrderStatusBadge } from "../../ordering/OrderStatusBadge";
import { formatDay } from "../../../ordering/dates";
import type { StandingDatePlan, StandingOrderDto } from "../../../../shared/schemas/orders";
import { colors, layout, radii, space } from "../../../theme";
import { guardLinkPress } from "../../../shell/leaveGuard";

export interface UpcomingDatesProps {
  standing: StandingOrderDto;
  skipDates: string[];
  onToggleSkip: (date: string) => void;
}

const PLAN_TONE: Record<StandingDatePlan, "neutral" | "amber" | "danger" | "sage"> = {
  ordered: "sage",
  waiting: "neutral",
  closed: "neutral",
  held: "amber",
  paused: "neutral",
  no_delivery: "neutral",
  missed: "danger",
};

/** The dates the standing order makes orders for, marking the ones changed by hand, closed or on hold. */
export function UpcomingDates({ standing, skipDates, onToggleSkip }: UpcomingDatesProps) {
  const edited = standing.upcoming.filter((u) => u.editedByHand).length;
  return (
    <Card title="Coming dates from your standing order" testID="standing-upcoming">
      {standing.upcoming.length === 0 ? (
        <AppText color="muted" testID="standing-upcoming-empty">
          {standing.active ? "No coming dates yet: they appear here as the bakery opens them for ordering." : "Paused: no dates are being made."}
        </AppText>
      ) : (
        <>
          <AppText color="muted">
            {edited
              ? `${edited === 1 ? "1 date was" : `${edited} dates were`} changed by hand: the standing order leaves those as you set them.`
              : "Tap a date to change that one delivery."}
          </AppText>
          <View>
            {standing.upcoming.map((u, i) => {
              const skipping = skipDates.includes(u.date);
              return (
                <View key={u.date} style={[styles.upcomingRow, i > 0 && styles.divider]} testID={`upcoming-${u.date}`}>
                  <Link href={`/buyer/order/${u.date}?from=standing`} asChild>
                    <LinkPressable accessibilityRole="link" style={styles.upcomingLink} highlightStyle={styles.hover} accessibilityLabel={`Open the order for ${formatDay(u.date)}`}>
                      <AppText variant="bodyStrong">{formatDay(u.date)}</AppText>
                      <View style={styles.badges}>
                        {u.status && u.plan !== "closed" ? <OrderStatusBadge status={u.status} /> : <Badge label={u.planText} tone={PLAN_TONE[u.plan]} testID={`upcoming-${u.date}-plan`} />}
                        {u.editedByHand ? <Badge label="Changed by hand" tone="amber" testID={`upcoming-${u.date}-edited`} /> : null}
                        {skipping ? <Badge label="Skipped when you save" tone="danger" /> : null}
                      </View>
                    </LinkPressable>
                  </Link>
                  {!u.skippable && !skipping ? null : (
                    <Pressable
                      accessibilityRole="button"
                      accessibilityLabel={skipping ? `Don't skip ${formatDay(u.date)}` : `Skip ${formatDay(u.date)}`}
                      onPress={() => onToggleSkip(u.date)}
                      style={({ pressed }) => [styles.skipButton, pressed && styles.hover]}
                      testID={`upcoming-${u.date}-skip`}
                    >
                      <AppText variant="label" color="crust">
                        {skipping ? "Undo" : "Skip"}
                      </AppText>
                    </Pressable>
                  )}
                </View>
              );
            })}
          </View>
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  upcomingRow: { flexDirection: "row", alignItems: "center", gap: space.sm },
  upcomingLink: { flex: 1, minHeight: layout.minTouch + 8, paddingVertical: space.sm, gap: space.xs, justifyContent: "center", borderRadius: radii.sm },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  skipButton: { minHeight: layout.minTouch, minWidth: layout.minTouch + 16, alignItems: "center", justifyContent: "center", borderRadius: radii.pill, paddingHorizontal: space.md },
  hover: { backgroundColor: colors.rowHover },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});
