import React from "react";
import { StyleSheet, View } from "react-native";
import { colors, radii, space } from "../theme";
import { AppText } from "./Text";

export function StatTile({ label, value, testID }: { label: string; value: number | string; testID?: string }) {
  return (
    <View style={styles.tile} testID={testID} accessible accessibilityLabel={`${label}: ${value}`}>
      <AppText variant="display" color="ink">
        {String(value)}
      </AppText>
      <AppText variant="caption" color="muted">
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  tile: { flexGrow: 1, flexBasis: 90, minWidth: 0, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
});
