import React from "react";
import { StyleSheet, View } from "react-native";
import { DataTable, type Column } from "./DataTable";
import { ListCard, ListCards } from "./ListCard";
import type { Href } from "expo-router";
import { useIsWide } from "../shell/useIsWide";

export interface TableOrCardsProps<T> {
  rows: T[];
  rowKey: (row: T) => string | number;
  onOpen: (row: T) => void;
  /** What a screen reader says for the row (the table's and the card's). */
  rowLabel: (row: T) => string;
  rowTestID: (row: T) => string;
  /** The table from 1024 px… */
  columns: Column<T>[];
  tableTestID: string;
  /** …and a card per row below it (its content: a chevron follows). */
  card: (row: T) => React.ReactNode;
  cardsTestID: string;
  /** Tighter cards, for rows that lead with a photo. */
  compact?: boolean;
  /** Cards open the row as a link (web: a new tab works too) instead of by press. */
  cardHref?: (row: T) => Href;
  /** What a screen reader says for a card, when it says less than the table row (rowLabel otherwise). */
  cardLabel?: (row: T) => string;
}

/** A list of things that open: a DataTable on wide screens, ListCards on a phone, the same rows and labels. */
export function TableOrCards<T>({ rows, rowKey, onOpen, rowLabel, rowTestID, columns, tableTestID, card, cardsTestID, compact, cardHref, cardLabel = rowLabel }: TableOrCardsProps<T>) {
  const wide = useIsWide();
  if (wide) return <DataTable testID={tableTestID} rows={rows} rowKey={rowKey} onRowPress={onOpen} rowLabel={rowLabel} rowTestID={rowTestID} columns={columns} />;
  return (
    <ListCards testID={cardsTestID}>
      {rows.map((row) => (
        <ListCard
          key={rowKey(row)}
          href={cardHref?.(row)}
          onPress={cardHref ? undefined : () => onOpen(row)}
          accessibilityLabel={cardLabel(row)}
          testID={rowTestID(row)}
          compact={compact}
        >
          {card(row)}
        </ListCard>
      ))}
    </ListCards>
  );
}

/** The text beside a card's chevron: it takes the width and may shrink. */
export function CardBody({ children }: { children: React.ReactNode }) {
  return <View style={styles.body}>{children}</View>;
}

const styles = StyleSheet.create({
  body: { flex: 1, minWidth: 0 },
});
