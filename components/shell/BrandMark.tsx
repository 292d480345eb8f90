import React from "react";
import { StyleSheet, View } from "react-native";
import { colors, space } from "../theme";
import { AppText } from "../ui/Text";

/** Panwise's mark: a scored milk-bread roll, drawn with views (no image to load). */
export function BrandMark({ onDark = false, size = 30 }: { onDark?: boolean; size?: number }) {
  const w = size;
  const h = Math.round(size * 0.74);
  return (
    <View style={styles.row} accessible accessibilityRole="image" accessibilityLabel="Panwise">
      <View style={[styles.roll, { width: w, height: h, borderRadius: h / 2, backgroundColor: onDark ? colors.crustSoft : colors.primary }]}>
        {[0, 1, 2].map((i) => (
          <View
            key={i}
            style={[styles.score, { height: h * 0.55, backgroundColor: onDark ? colors.primary : colors.amberSoft, left: w * (0.28 + i * 0.2) }]}
          />
        ))}
      </View>
      <AppText variant="heading" color={onDark ? "navInk" : "ink"} style={styles.word}>
        Panwise
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: "row", alignItems: "center", gap: space.sm },
  roll: { overflow: "hidden", justifyContent: "center" },
  score: { position: "absolute", width: 3, borderRadius: 2, transform: [{ rotate: "24deg" }] },
  word: { fontFamily: "Nunito_800ExtraBold", letterSpacing: 0.2 },
});
