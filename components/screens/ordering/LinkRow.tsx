import React from "react";
import { StyleSheet, View } from "react-native";
import { Link, type Href } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { LinkPressable } from "../../ui/LinkPressable";
import { colors, layout, radii, space } from "../../theme";

export interface LinkRowProps {
  href: Href;
  /** What a screen reader says for the whole row. */
  accessibilityLabel: string;
  testID?: string;
  /** A row with nothing to act on (a past date, a canceled order): on the page's colour. */
  quiet?: boolean;
  children: React.ReactNode;
}

/**
 * A list row in a card that opens another screen, ending in a chevron — ListCard's look, as a real link
 * (the address can be opened in a new tab). The buyer's delivery dates and orders are lists of these.
 */
export function LinkRow({ href, accessibilityLabel, testID, quiet, children }: LinkRowProps) {
  return (
    <Link href={href} asChild>
      <LinkPressable
        accessibilityRole="link"
        accessibilityLabel={accessibilityLabel}
        testID={testID}
        style={StyleSheet.flatten([styles.row, quiet && styles.quiet])}
        highlightStyle={styles.hover}
      >
        <View style={styles.text}>{children}</View>
        <Feather name="chevron-right" size={20} color={colors.muted} />
      </LinkPressable>
    </Link>
  );
}

/** The top line of a row: its title, growing, and a badge after it. */
export function LinkRowTop({ children }: { children: React.ReactNode }) {
  return <View style={styles.top}>{children}</View>;
}

export const linkRowStyles = StyleSheet.create({
  /** The row's title in LinkRowTop: takes the room the badge leaves. */
  title: { flexGrow: 1, flexShrink: 1 },
});

const styles = StyleSheet.create({
  row: {
    minHeight: layout.minTouch + 20,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    paddingVertical: space.md,
    paddingHorizontal: space.lg,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
  },
  quiet: { backgroundColor: colors.page },
  hover: { backgroundColor: colors.rowHover },
  text: { flex: 1, gap: space.xs },
  top: { flexDirection: "row", alignItems: "center", gap: space.sm, flexWrap: "wrap" },
});
