import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkCard } from "../../ui/ListCard";
import { EmptyState } from "../../ui/States";
import { useSignedInUser } from "../../auth/useAuth";
import { tabsFor } from "../../shell/navItems";
import { space } from "../../theme";
import type { HomeArea } from "../../../shared/roles";

const HINTS: Record<string, string> = {
  production: "Bake day, formulas, ingredients, purchasing and production settings.",
  ingredients: "The ingredient library: kinds, water content, allergens and purchase packs.",
  forecast: "What to buy for the next 7 days, in whole packs.",
  people: "Sign-ins for staff and wholesale buyers, and invitations.",
  "price-lists": "Own prices or a percentage off for some accounts.",
  calendar: "Delivery weekdays, the cut-off, and closed dates.",
  products: "What the bakery sells: prices, pans, allergens and photos.",
  money: "Payouts, aging, CSV exports and billing settings.",
  outbox: "Every e-mail sent: orders, invoices, receipts, invitations and password resets.",
  me: "Your profile: name, e-mail and password.",
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
          <LinkCard key={item.key} href={item.href} icon={item.icon} title={item.label} hint={HINTS[item.key]} testID={`more-${item.key}`} />
        ))}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
});
