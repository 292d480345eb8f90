import React from "react";
import { Pressable, StyleSheet, View, type ViewStyle } from "react-native";
import { Link, type Href } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "./Text";
import { LinkPressable } from "./LinkPressable";
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

export interface LinkCardProps {
  href: Href;
  icon: React.ComponentProps<typeof Feather>["name"];
  title: string;
  hint?: string;
  testID?: string;
  /** The icon in a round badge (a hub tile) instead of bare. */
  iconBadge?: boolean;
  /** Extra layout for the card, e.g. a flex basis in a wrapping grid. */
  style?: ViewStyle;
}

/** A card that links to another screen: icon, title, a line about it, and a chevron (hubs and "More"). */
export function LinkCard({ href, icon, title, hint, testID, iconBadge, style }: LinkCardProps) {
  const glyph = <Feather name={icon} size={22} color={colors.crust} />;
  return (
    <Link href={href} asChild>
      <LinkPressable accessibilityRole="link" testID={testID} style={StyleSheet.flatten([styles.card, styles.linkCard, style])} highlightStyle={styles.pressed}>
        {iconBadge ? <View style={styles.badge}>{glyph}</View> : glyph}
        <View style={styles.text}>
          <AppText variant="bodyStrong">{title}</AppText>
          {hint ? (
            <AppText variant="small" color="muted">
              {hint}
            </AppText>
          ) : null}
        </View>
        <Feather name="chevron-right" size={20} color={colors.muted} />
      </LinkPressable>
    </Link>
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
  linkCard: { minHeight: layout.minTouch + 16 },
  badge: { width: 44, height: 44, borderRadius: 22, backgroundColor: colors.crustSoft, alignItems: "center", justifyContent: "center" },
  text: { flex: 1, gap: space.xxs },
  pressed: { backgroundColor: colors.rowHover },
});
