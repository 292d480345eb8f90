import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { AppText } from "../../../ui/Text";
import type { PlanView } from "../../../api/production";
import type { Units } from "../../../production/units";
import { colors, fonts, space } from "../../../theme";

/** Everything the day's doughs use, bakery-wide, largest first. */
export function TotalsCard({ plan, units }: { plan: PlanView; units: Units }) {
  const dough = plan.doughs.reduce((s, d) => s + d.doughGrams, 0);
  return (
    <Card title="Ingredients for the day" testID="totals">
      <AppText variant="small" color="muted">{`All doughs together: ${units.mass(dough)} of dough.`}</AppText>
      <View>
        {plan.ingredients.map((i, n) => (
          <View key={i.ingredientId} style={[styles.totalRow, n > 0 && styles.divider]} testID={`total-${i.ingredientId}`}>
            <AppText variant="bodyStrong" style={styles.flex}>
              {i.name}
            </AppText>
            <AppText style={styles.totalAmount}>{units.mass(i.grams)}</AppText>
          </View>
        ))}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  totalRow: { flexDirection: "row", alignItems: "center", gap: space.md, minHeight: 44, paddingVertical: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  totalAmount: { fontFamily: fonts.extrabold, fontSize: 20, lineHeight: 26, color: colors.ink, textAlign: "right", fontVariant: ["tabular-nums"] },
});
