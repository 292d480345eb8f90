import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { colors, layout, radii, space } from "../theme";
import { AppText } from "./Text";

export interface Column<T> {
  key: string;
  label: string;
  /** Share of the row's width (default 1). */
  flex?: number;
  /** Money and counts line up on the right. */
  align?: "left" | "right";
  /** A cell: a string or number is written as body text (aligned as the column), anything else as it is. */
  render: (row: T) => React.ReactNode;
  /** What the totals row shows in this column (with `footer` on the table). */
  footer?: React.ReactNode;
}

export interface DataTableProps<T> {
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string | number;
  onRowPress?: (row: T) => void;
  rowLabel?: (row: T) => string;
  rowTestID?: (row: T) => string;
  /** A row that needs attention gets a red tint. */
  rowAlert?: (row: T) => boolean;
  /** Show a totals row from the columns' `footer`. */
  footer?: boolean;
  footerTestID?: string;
  testID?: string;
}

function Cell({ content, align, strong }: { content: React.ReactNode; align: Column<unknown>["align"]; strong?: boolean }) {
  if (typeof content === "string" || typeof content === "number") {
    return (
      <AppText variant={strong ? "bodyStrong" : "body"} align={align === "right" ? "right" : undefined} numberOfLines={2}>
        {String(content)}
      </AppText>
    );
  }
  return <>{content}</>;
}

/**
 * A table for wide screens: a header row, one line per item (rows can open the item, and a row that needs
 * attention is tinted red), and an optional totals row.
 */
export function DataTable<T>({ columns, rows, rowKey, onRowPress, rowLabel, rowTestID, rowAlert, footer, footerTestID, testID }: DataTableProps<T>) {
  const cellStyle = (c: Column<T>) => [styles.cell, { flex: c.flex ?? 1 }, c.align === "right" && styles.right];
  return (
    <View style={styles.table} testID={testID} role="table">
      <View style={[styles.row, styles.header]} role="row">
        {columns.map((c) => (
          <View key={c.key} style={cellStyle(c)} role="columnheader">
            <AppText variant="overline" color="muted" align={c.align === "right" ? "right" : undefined}>
              {c.label}
            </AppText>
          </View>
        ))}
      </View>
      {rows.map((row, i) => {
        const cells = columns.map((c) => (
          <View key={c.key} style={cellStyle(c)} role="cell">
            <Cell content={c.render(row)} align={c.align} />
          </View>
        ));
        const divided = i < rows.length - 1;
        const alert = rowAlert?.(row);
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
                divided && styles.divider,
                alert && styles.alert,
                (pressed || hovered) && styles.hover,
              ]}
            >
              {cells}
            </Pressable>
          );
        }
        return (
          <View key={rowKey(row)} style={[styles.row, divided && styles.divider, alert && styles.alert]} testID={rowTestID?.(row)} role="row">
            {cells}
          </View>
        );
      })}
      {footer ? (
        <View style={[styles.row, styles.footer]} role="row" testID={footerTestID}>
          {columns.map((c) => (
            <View key={c.key} style={cellStyle(c)} role="cell">
              <Cell content={c.footer ?? ""} align={c.align} strong />
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, overflow: "hidden" },
  row: { flexDirection: "row", alignItems: "center", minHeight: layout.minTouch + 12, paddingHorizontal: space.md },
  header: { backgroundColor: colors.sunken, minHeight: layout.minTouch },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.border },
  hover: { backgroundColor: colors.rowHover },
  alert: { backgroundColor: colors.dangerSoft },
  footer: { borderTopWidth: 2, borderTopColor: colors.inputBorder, backgroundColor: colors.sunken },
  cell: { paddingHorizontal: space.sm, paddingVertical: space.sm, justifyContent: "center", minWidth: 0 },
  right: { alignItems: "flex-end" },
});
