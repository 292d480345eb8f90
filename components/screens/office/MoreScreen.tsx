import React from "react";
import { StyleSheet, View } from "react-native";
import { Link } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkPressable } from "../../ui/LinkPressable";
import { AppText } from "../../ui/Text";
import { EmptyState } from "../../ui/States";
import { useSignedInUser } from "../../auth/useAuth";
import { tabsFor } from "../../shell/navItems";
import { colors, layout, radii, space } from "../../theme";
import type { HomeArea } from "../../../shared/roles";

const HINTS: Record<string, string> = {
  production: "Bake day, formulas, ingredients, purchasing forecast and production settings.",
  ingredients: "The ingredient library: kinds, water content, allergens and purchase packs.",
  forecast: "What to buy for the next 7 days, in whole packs.",
  people: "Sign-ins for staff and café buyers, and invitations.",
  "price-lists": "Own prices or a percentage off for some accounts.",
  calendar: "Delivery weekdays, the cut-off, and closed dates.",
  products: "What the bakery sells: prices, pans, allergens and photos.",
  money: "Payouts, aging, CSV exports, outgoing e-mail and billing settings.",
  me: "Your sign-in and password.",
};

/** On a phone, the screens of an area (the office, the baker's) that don't fit in the tab bar. */
export function MoreScreen({ area = "office" }: { area?: HomeArea }) {
  const user = useSignedInUser();
  const { more } = tabsFor(area, user.role);
  return (
    <Screen narrow testID="more-screen">
      <PageHeader title="More" testID="more-title" />
      {more.length === 0 ? <EmptyState icon="grid" title="Everything is in the tab bar" message="There are no more screens for your role." testID="more-empty" /> : null}
      <View style={styles.list}>
        {more.map((item) => (
          <Link key={item.key} href={item.href as never} asChild>
            <LinkPressable accessibilityRole="link" testID={`more-${item.key}`} style={styles.row} highlightStyle={styles.hover}>
              <Feather name={item.icon} size={22} color={colors.crust} />
              <View style={styles.text}>
                <AppText variant="bodyStrong">{item.label}</AppText>
                {HINTS[item.key] ? (
                  <AppText variant="small" color="muted">
                    {HINTS[item.key]}
                  </AppText>
                ) : null}
              </View>
              <Feather name="chevron-right" size={20} color={colors.muted} />
            </LinkPressable>
          </Link>
        ))}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: {
    minHeight: layout.minTouch + 16,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    padding: space.lg,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
  },
  hover: { backgroundColor: colors.rowHover },
  text: { flex: 1, gap: space.xxs },
});
