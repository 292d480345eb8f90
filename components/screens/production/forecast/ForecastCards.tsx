import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { AppText } from "../../../ui/Text";
import type { ForecastDto } from "../../../api/production";
import { useMoney } from "../../ordering/parts";
import { formatDay } from "../../../ordering/dates";
import type { Units } from "../../../production/units";
import { packsText } from "./packsText";
import { colors, fonts, radii, space } from "../../../theme";

/** Below 1024 px: a card per ingredient, what to buy first. */
export function ForecastCards({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const money = useMoney();
  return (
    <View style={styles.cards} testID="forecast-list">
      {forecast.items.map((i) => (
        <Card key={i.ingredientId} testID={`forecast-item-${i.ingredientId}`}>
          <View style={styles.itemTop}>
            <AppText variant="heading" style={styles.flex}>
              {i.name}
            </AppText>
            <AppText style={styles.itemTotal}>{units.mass(i.grams)}</AppText>
          </View>
          <View style={styles.buy}>
            <AppText variant="bodyStrong" style={styles.flex} testID={`forecast-item-${i.ingredientId}-packs`}>
              {i.packGrams > 0 ? `Buy ${packsText(i)}` : "Not bought (e.g. tap water)"}
            </AppText>
            {i.packGrams > 0 ? <AppText variant="bodyStrong">{money(i.costCents)}</AppText> : null}
          </View>
          <View style={styles.byDay}>
            {forecast.days
              .filter((d) => i.byDay[d.date])
              .map((d) => (
                <View key={d.date} style={styles.dayChip}>
                  <AppText variant="caption" color="muted">
                    {formatDay(d.date)}
                  </AppText>
                  <AppText variant="label">{units.mass(i.byDay[d.date])}</AppText>
                </View>
              ))}
          </View>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  cards: { gap: space.md },
  itemTop: { flexDirection: "row", alignItems: "baseline", gap: space.md },
  itemTotal: { fontFamily: fonts.extrabold, fontSize: 22, lineHeight: 28, color: colors.ink, fontVariant: ["tabular-nums"] },
  buy: { flexDirection: "row", alignItems: "center", gap: space.md, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md },
  byDay: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  dayChip: { borderWidth: 1, borderColor: colors.border, borderRadius: radii.sm, paddingHorizontal: space.sm, paddingVertical: space.xxs },
});
