import React from "react";
import { ScrollView, StyleSheet, View } from "react-native";
import { AppText } from "../../../ui/Text";
import type { ForecastDto } from "../../../api/production";
import { useIsWide } from "../../../shell/useIsWide";
import { formatDay } from "../../../ordering/dates";
import type { Units } from "../../../production/units";
import { colors, fonts, radii, space } from "../../../theme";

/** The seven days' dough, a tile a day (a strip to scroll on a phone). */
export function DaysStrip({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const wide = useIsWide();
  const tiles = forecast.days.map((d) => (
        <View key={d.date} style={[styles.day, wide && styles.dayWide, d.doughGrams === 0 && styles.dayQuiet]} testID={`forecast-day-${d.date}`} accessible accessibilityLabel={`${formatDay(d.date)}: ${units.mass(d.doughGrams)} of dough, ${d.orderedUnits} units ordered`}>
          <AppText variant="label">{formatDay(d.date)}</AppText>
          <AppText style={styles.dayDough}>{d.doughGrams > 0 ? units.mass(d.doughGrams) : "–"}</AppText>
          <AppText variant="caption" color="muted">
            {d.doughGrams > 0 ? `dough · ${d.orderedUnits} units` : "no dough"}
          </AppText>
        </View>
  ));
  if (wide) {
    return (
      <View style={styles.daysWide} testID="forecast-days">
        {tiles}
      </View>
    );
  }
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.days} testID="forecast-days" tabIndex={0} role="region" aria-label="Days ahead, scrolls sideways">
      {tiles}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  days: { gap: space.sm, paddingVertical: space.xxs },
  daysWide: { flexDirection: "row", gap: space.sm },
  dayWide: { flex: 1, width: undefined, minWidth: 0 },
  day: { width: 124, backgroundColor: colors.surface, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, padding: space.md, gap: space.xxs },
  dayQuiet: { backgroundColor: colors.page },
  dayDough: { fontFamily: fonts.extrabold, fontSize: 18, lineHeight: 24, color: colors.ink, fontVariant: ["tabular-nums"] },
});
