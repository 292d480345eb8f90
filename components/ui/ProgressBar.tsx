import React from "react";
import { StyleSheet, View } from "react-native";
import { colors, radii } from "../theme";

/** A determinate progress bar, 0..1. */
export function ProgressBar({ value, label, testID }: { value: number; label: string; testID?: string }) {
  const pct = Math.round(Math.max(0, Math.min(1, value)) * 100);
  return (
    <View
      style={styles.track}
      accessibilityRole="progressbar"
      accessibilityLabel={label}
      accessibilityValue={{ min: 0, max: 100, now: pct }}
      aria-valuenow={pct}
      aria-valuemin={0}
      aria-valuemax={100}
      testID={testID}
    >
      <View style={[styles.fill, { width: `${pct}%` }]} />
    </View>
  );
}

const styles = StyleSheet.create({
  track: { height: 10, borderRadius: radii.pill, backgroundColor: colors.sunken, overflow: "hidden", borderWidth: 1, borderColor: colors.inputBorder },
  fill: { height: "100%", backgroundColor: colors.sage },
});
