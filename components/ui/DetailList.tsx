import React from "react";
import { StyleSheet, View } from "react-native";
import { colors, space } from "../theme";
import { AppText } from "./Text";

export interface DetailItem {
  label: string;
  value: React.ReactNode;
  testID?: string;
}

/** Label / value pairs, one per line, for details on a card. Empty values read "Not given". */
export function DetailList({ items }: { items: DetailItem[] }) {
  return (
    <View style={styles.list}>
      {items.map((item, i) => (
        <View key={item.label} style={[styles.row, i > 0 && styles.divider]}>
          <AppText variant="caption" color="muted" style={styles.label}>
            {item.label}
          </AppText>
          <View style={styles.value}>
            {typeof item.value === "string" || item.value == null ? (
              <AppText color={item.value ? "ink" : "muted"} testID={item.testID} selectable>
                {item.value || "Not given"}
              </AppText>
            ) : (
              item.value
            )}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: {},
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.xs, paddingVertical: space.sm },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  label: { width: 150, paddingTop: 3 },
  value: { flexGrow: 1, flexShrink: 1, flexBasis: 200 },
});
