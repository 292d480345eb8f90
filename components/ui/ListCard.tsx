import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, layout, radii, space } from "../theme";

export interface ListCardsProps {
  testID?: string;
  children: React.ReactNode;
}

/** The stack that holds `ListCard` rows (the narrow-screen stand-in for a DataTable). */
export function ListCards({ testID, children }: ListCardsProps) {
  return (
    <View style={styles.cards} testID={testID}>
      {children}
    </View>
  );
}

export interface ListCardProps {
  onPress: () => void;
  /** What a screen reader says for the whole row. */
  accessibilityLabel: string;
  testID?: string;
  /** Tighter padding, for rows that lead with a photo. */
  compact?: boolean;
  /** The row's content; a chevron is added after it. */
  children: React.ReactNode;
}

/** A pressable list row in a card, ending in a chevron: opens the thing it shows. */
export function ListCard({ onPress, accessibilityLabel, testID, compact, children }: ListCardProps) {
  return (
    <Pressable
      onPress={onPress}
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel}
      testID={testID}
      style={({ pressed }) => [styles.card, compact && styles.compact, pressed && styles.pressed]}
    >
      {children}
      <Feather name="chevron-right" size={20} color={colors.muted} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  cards: { gap: space.sm },
  card: {
    minHeight: layout.minTouch,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    padding: space.lg,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
  },
  compact: { padding: space.md },
  pressed: { backgroundColor: colors.rowHover },
});
