import type { RoutePath } from "../../routing";
import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkCard } from "../../ui/ListCard";
import { useNextBakeDayQuery } from "../../api/production";
import { formatDay } from "../../ordering/dates";
import { kitchenPaths } from "../../production/paths";
import { space } from "../../theme";

const HUB_ITEMS: { key: string; label: string; hint: string; icon: React.ComponentProps<typeof Feather>["name"]; href: () => RoutePath }[] = [
  { key: "day", label: "Bake day", hint: "Pans, weigh-out cards, the timeline and the production sheet.", icon: "sun", href: () => kitchenPaths("office").day() },
  { key: "formulas", label: "Formulas", hint: "Doughs in baker's percentages, with their history.", icon: "book-open", href: () => kitchenPaths("office").formulas },
  { key: "ingredients", label: "Ingredients", hint: "Kinds, water content, allergens and purchase packs.", icon: "package", href: () => kitchenPaths("office").ingredients },
  { key: "forecast", label: "Purchasing", hint: "What the next 7 days need, in whole packs, with the cost.", icon: "shopping-cart", href: () => kitchenPaths("office").forecast() },
  { key: "settings", label: "Production settings", hint: "Mixers, ovens, the crew, packing, the shift and overnight retard.", icon: "sliders", href: () => "/office/production/settings" },
];

/** The owner's way into production from the office. */
export function ProductionHubScreen() {
  const next = useNextBakeDayQuery();
  return (
    <Screen narrow testID="production-hub">
      <PageHeader title="Production" subtitle={next.data ? `Next bake day: ${formatDay(next.data)}.` : "What the bakery makes, and what it needs."} testID="production-hub-title" />
      <View style={styles.list}>
        {HUB_ITEMS.map((item) => (
          <LinkCard key={item.key} href={item.href()} icon={item.icon} title={item.label} hint={item.hint} testID={`production-${item.key}`} />
        ))}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
});
