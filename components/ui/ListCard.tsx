import React from "react";
import { Pressable, StyleSheet, View, type ViewStyle } from "react-native";
import { Link, type Href } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "./Text";
import { LinkPressable } from "./LinkPressable";
import { colors, layout, radii, space } from "../theme";
import { guardLinkPress } from "../shell/leaveGuard";
import { nameFromContent } from "./a11y";

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
  /** Opens the thing the row shows (a button row). */
  onPress?: () => void;
  /** Opens it as a link instead (web: a real link, so it opens in a new tab too). Leave both out for a card that does not open. */
  href?: Href;
  /** What a screen reader says for the whole row on iOS and Android; on the web the row is named by its text (components/ui/a11y.ts). */
  accessibilityLabel?: string;
  testID?: string;
  /** Tighter padding, for rows that lead with a photo. */
  compact?: boolean;
  /** A row that needs attention: a red tint and border. */
  alert?: boolean;
  /** A row with nothing to act on (a past date, a canceled order): on the page's colour. */
  quiet?: boolean;
  /** The row's content; a chevron is added after it when the row opens something. */
  children: React.ReactNode;
}

const chevron = <Feather name="chevron-right" size={20} color={colors.muted} />;

/** A list row in a card: ends in a chevron and opens the thing it shows (by press or as a link), or just shows it. */
export function ListCard({ onPress, href, accessibilityLabel, testID, compact, alert, quiet, children }: ListCardProps) {
  const look = [styles.card, compact && styles.compact, quiet && styles.quiet, alert && styles.alert];
  if (href) {
    return (
      <Link href={href} onPress={guardLinkPress} asChild>
        <LinkPressable accessibilityRole="link" {...nameFromContent(accessibilityLabel)} testID={testID} style={StyleSheet.flatten(look)} highlightStyle={styles.pressed}>
          {children}
          {chevron}
        </LinkPressable>
      </Link>
    );
  }
  if (!onPress) {
    return (
      <View style={look} testID={testID} accessibilityLabel={accessibilityLabel}>
        {children}
      </View>
    );
  }
  return (
    <Pressable
      onPress={onPress}
      accessibilityRole="button"
      {...nameFromContent(accessibilityLabel)}
      testID={testID}
      style={({ pressed }) => [...look, pressed && styles.pressed]}
    >
      {children}
      {chevron}
    </Pressable>
  );
}

/** The text column of a ListCard: a top line (title and badges), then smaller lines. */
export function ListCardText({ children }: { children: React.ReactNode }) {
  return <View style={styles.text}>{children}</View>;
}

/** The first line of a ListCard: its title growing, badges after it. */
export function ListCardTop({ children }: { children: React.ReactNode }) {
  return <View style={styles.top}>{children}</View>;
}

/** The title in a ListCardTop: bold, taking the room the badges leave. */
export function ListCardTitle({ children }: { children: React.ReactNode }) {
  return (
    <AppText variant="bodyStrong" style={styles.title}>
      {children}
    </AppText>
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
    <Link href={href} onPress={guardLinkPress} asChild>
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
  quiet: { backgroundColor: colors.page },
  title: { flexGrow: 1, flexShrink: 1 },
  alert: { borderColor: colors.danger, backgroundColor: colors.dangerSoft },
  top: { flexDirection: "row", alignItems: "center", gap: space.sm, flexWrap: "wrap" },
});
