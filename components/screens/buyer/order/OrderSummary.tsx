import React from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../../ui/Button";
import { Card } from "../../../ui/Card";
import { AppText } from "../../../ui/Text";
import { productsLabel } from "../../../ordering/quantities";
import { colors, shadow, space } from "../../../theme";

export interface OrderSummaryProps {
  /** A card in the side column (wide screens), or a footer fixed under the screen (phones). */
  variant: "card" | "footer";
  existing: boolean;
  chosen: number;
  totalCents: number;
  minimumCents: number;
  shortfallCents: number;
  locked: boolean;
  /** Locked because the account is on hold (not by the clock): the button says so and the minimum is not talked about. */
  held?: boolean;
  /** Why the button is off (null: it isn't, or the minimum says why). */
  blocked: string | null;
  canSubmit: boolean;
  saving: boolean;
  onSubmit: () => void;
  money: (cents: number) => string;
  /** The last save's confirmation, shown beside the button that was pressed (null once anything changes). */
  confirmation?: string | null;
}

/** What the order comes to, the minimum order, and the button that places or saves it. */
export function OrderSummary(p: OrderSummaryProps) {
  const { money, shortfallCents: short } = p;
  const minimumHint =
    p.minimumCents > 0 && !p.held ? (
      <AppText variant="small" color={short > 0 ? "dangerInk" : "muted"} testID="order-minimum" style={short > 0 ? styles.strong : undefined}>
        {short > 0
          ? `Add ${money(short)} more to reach the ${money(p.minimumCents)} minimum.`
          : p.totalCents > 0
            ? `The ${money(p.minimumCents)} minimum order is met.`
            : `Minimum order ${money(p.minimumCents)}.`}
      </AppText>
    ) : null;

  const total = (
    <View>
      <AppText variant="caption" color="muted" testID="order-items">
        {p.chosen > 0 ? productsLabel(p.chosen) : "Nothing chosen yet"}
      </AppText>
      <AppText variant="title" testID="order-total" accessibilityLabel={`Order total ${money(p.totalCents)}`}>
        {money(p.totalCents)}
      </AppText>
    </View>
  );

  const button = (
    <Button
      label={p.held ? "Ordering on hold" : p.locked ? "Ordering closed" : p.existing ? "Save changes" : "Place order"}
      icon={p.held ? "pause-circle" : p.locked ? "lock" : p.existing ? "check" : "shopping-bag"}
      onPress={p.onSubmit}
      disabled={!p.canSubmit}
      busy={p.saving}
      testID="order-submit"
      block={p.variant === "card"}
    />
  );

  const confirmed = p.confirmation ? (
    <AppText variant="small" color="sageInk" testID="order-saved-here" accessibilityLiveRegion="polite" style={styles.strong}>
      {p.confirmation}
    </AppText>
  ) : null;

  const blocked = p.blocked ? (
    <AppText variant="small" color="muted" testID="order-blocked">
      {p.blocked}
    </AppText>
  ) : null;

  if (p.variant === "card") {
    return (
      <Card title={p.existing ? "Your order" : "Your new order"} testID="order-summary">
        {total}
        {minimumHint}
        {button}
        {confirmed}
        {blocked}
      </Card>
    );
  }
  return (
    <View style={styles.footer} testID="order-summary">
      <View style={styles.footerRow}>
        {total}
        {button}
      </View>
      {confirmed ?? (p.blocked && short === 0 ? blocked : minimumHint)}
    </View>
  );
}

const styles = StyleSheet.create({
  strong: { fontFamily: "Nunito_700Bold" },
  footerRow: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md },
  footer: {
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.border,
    paddingHorizontal: space.lg,
    paddingTop: space.sm,
    paddingBottom: space.md,
    gap: space.sm,
    ...shadow.card,
  },
});
