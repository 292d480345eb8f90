import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { colors, layout, radii, space } from "../theme";
import { AppText } from "./Text";

export interface Column<T> {
  key: string;
  label: string;
  /** Share of the row's width (default 1). */
  flex?: number;
  render: (row: T) => React.ReactNode;
}

export interface DataTableProps<T> {
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string | number;
  onRowPress?: (row: T) => void;
  rowLabel?: (row: T) => string;
  rowTestID?: (row: T) => string;
  testID?: string;
}

/** A table for wide screens: a header row and one line per item; rows can open the item. */
export function DataTable<T>({ columns, rows, rowKey, onRowPress, rowLabel, rowTestID, testID }: DataTableProps<T>) {
  return (
    <View style={styles.table} testID={testID} role="table">
      <View style={[styles.row, styles.header]} role="row">
        {columns.map((c) => (
          <View key={c.key} style={[styles.cell, { flex: c.flex ?? 1 }]} role="columnheader">
            <AppText variant="overline" color="muted">
              {c.label}
            </AppText>
          </View>
        ))}
      </View>
      {rows.map((row, i) => {
        const cells = columns.map((c) => (
          <View key={c.key} style={[styles.cell, { flex: c.flex ?? 1 }]} role="cell">
            {c.render(row)}
          </View>
        ));
        const last = i === rows.length - 1;
        if (onRowPress) {
          return (
            <Pressable
              key={rowKey(row)}
              onPress={() => onRowPress(row)}
              accessibilityRole="button"
              accessibilityLabel={rowLabel?.(row)}
              testID={rowTestID?.(row)}
              style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [
                styles.row,
                !last && styles.divider,
                (pressed || hovered) && styles.hover,
              ]}
            >
              {cells}
            </Pressable>
          );
        }
        return (
          <View key={rowKey(row)} style={[styles.row, !last && styles.divider]} testID={rowTestID?.(row)} role="row">
            {cells}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, overflow: "hidden" },
  row: { flexDirection: "row", alignItems: "center", minHeight: layout.minTouch + 12, paddingHorizontal: space.md },
  header: { backgroundColor: colors.sunken, minHeight: layout.minTouch },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.border },
  hover: { backgroundColor: colors.rowHover },
  cell: { paddingHorizontal: space.sm, paddingVertical: space.sm, justifyContent: "center", minWidth: 0 },
});
