import React, { useState } from "react";
import { Platform, Pressable, ScrollView, StyleSheet, View, type ViewStyle } from "react-native";
import { AppText } from "./Text";
import { colors, layout, radii, space, type ColorName } from "../theme";

export interface Column<T> {
  key: string;
  label: string;
  /** Share of the row's width (default 1). */
  flex?: number;
  /** Money and counts line up on the right. */
  align?: "left" | "right";
  /** The column's text cells in bold (a row's name, the figure that matters). */
  strong?: boolean;
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
  /** For tables with a column per product or day: the table is at least this wide and scrolls sideways on a narrower screen. */
  minWidth?: number;
  /** What the sideways-scrolling region is called (with `minWidth`). */
  scrollLabel?: string;
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

export interface TitleCellProps {
  /** What the row is: bold. */
  title: string;
  /** A smaller line under it (kind, address, version). */
  detail?: string | null;
  detailColor?: ColorName;
  /** Cut both lines to one (long names in a narrow column). */
  oneLine?: boolean;
  /** More lines under them (an error, a note). */
  children?: React.ReactNode;
}

/** The cell that names a row: its title in bold, a smaller line under it. */
export function TitleCell({ title, detail, detailColor = "muted", oneLine, children }: TitleCellProps) {
  const lines = oneLine ? 1 : undefined;
  return (
    <View>
      <AppText variant="bodyStrong" numberOfLines={lines}>
        {title}
      </AppText>
      {detail ? (
        <AppText variant="small" color={detailColor} numberOfLines={lines}>
          {detail}
        </AppText>
      ) : null}
      {children}
    </View>
  );
}

/** A cell with nothing in it (no quantity that day): a muted dash. */
export function NoValue() {
  return <AppText color="muted">–</AppText>;
}

/** The table's frame: a rounded card holding a header row and the rows (for rows a screen builds itself). */
export function TableFrame({ testID, style, children }: { testID?: string; style?: ViewStyle; children: React.ReactNode }) {
  return (
    <View style={[styles.table, style]} testID={testID} role="table">
      {children}
    </View>
  );
}

type ColumnFrame = Pick<Column<unknown>, "key" | "label" | "flex" | "align">;

/** One cell of a column: its share of the width and its alignment. */
export function TableCell({ column, header, children }: { column: Omit<ColumnFrame, "key" | "label">; header?: boolean; children: React.ReactNode }) {
  return (
    <View style={[styles.cell, { flex: column.flex ?? 1 }, column.align === "right" && styles.right]} role={header ? "columnheader" : "cell"}>
      {children}
    </View>
  );
}

/** The header row: each column's label. */
export function TableHeaderRow({ columns }: { columns: readonly ColumnFrame[] }) {
  return (
    <View style={[styles.row, styles.header]} role="row">
      {columns.map((c) => (
        <TableCell key={c.key} column={c} header>
          <AppText variant="overline" color="muted" align={c.align === "right" ? "right" : undefined}>
            {c.label}
          </AppText>
        </TableCell>
      ))}
    </View>
  );
}

/**
 * A table for wide screens: a header row, one line per item (rows can open the item, and a row that needs
 * attention is tinted red), and an optional totals row.
 */
export function DataTable<T>({ minWidth, scrollLabel, ...props }: DataTableProps<T>) {
  // The region's own width, once laid out: the table is exactly that wide when its columns fit, and wider
  // (scrolling sideways, with a line saying so) when they do not. An explicit width, because a table sized by
  // its content inside a sideways scroller grows past the region by its longest header words.
  const [regionWidth, setRegionWidth] = useState(0);
  if (minWidth === undefined) return <Table {...props} />;
  const scrolls = regionWidth > 0 && minWidth > regionWidth;
  return (
    <View style={styles.scrollWrap}>
      {scrolls ? (
        <AppText variant="small" color="muted" testID={props.testID ? `${props.testID}-scroll-hint` : undefined}>
          The table is wider than the window: scroll it sideways to see every column.
        </AppText>
      ) : null}
      {/* Focusable, so a keyboard can scroll it sideways (a region needs a name: the table's own, or this). */}
      <ScrollView
        horizontal
        style={styles.scroll}
        onLayout={(e) => setRegionWidth(Math.floor(e.nativeEvent.layout.width))}
        tabIndex={0}
        role="region"
        aria-label={scrollLabel ?? "Table, scrolls sideways"}
      >
        <Table {...props} style={{ width: Math.max(minWidth, regionWidth) }} />
      </ScrollView>
    </View>
  );
}

function Table<T>({ columns, rows, rowKey, onRowPress, rowLabel, rowTestID, rowAlert, footer, footerTestID, testID, style }: Omit<DataTableProps<T>, "minWidth"> & { style?: ViewStyle }) {
  return (
    <TableFrame testID={testID} style={style}>
      <TableHeaderRow columns={columns} />
      {rows.map((row, i) => {
        const cells = columns.map((c) => (
          <TableCell key={c.key} column={c}>
            <Cell content={c.render(row)} align={c.align} strong={c.strong} />
          </TableCell>
        ));
        const divided = i < rows.length - 1;
        const alert = rowAlert?.(row);
        if (onRowPress) {
          return (
            <Pressable
              key={rowKey(row)}
              onPress={() => onRowPress(row)}
              // On the web a row of cells stays a table row (a button may not hold cells, ARIA 1.2), focusable and opened
              // by Enter or a click; on iOS and Android, which have no tables, it is a button.
              {...(Platform.OS === "web" ? { role: "row" as const, focusable: true } : { accessibilityRole: "button" as const })}
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
            <TableCell key={c.key} column={c}>
              <Cell content={c.footer ?? ""} align={c.align} strong />
            </TableCell>
          ))}
        </View>
      ) : null}
    </TableFrame>
  );
}

const styles = StyleSheet.create({
  scrollWrap: { gap: space.xs },
  scroll: { flexGrow: 0 },
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
