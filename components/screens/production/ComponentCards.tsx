import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText, Heading } from "../../ui/Text";
import type { Units } from "../../production/units";
import { formatNum } from "../../format";
import { COMPONENT_KIND_LABEL, type ComponentCard as ComponentCardData } from "../../../shared/components";
import { colors, radii, space } from "../../theme";

const count = (n: number, per: "piece" | "pan") => `${formatNum(n)} ${per === "piece" ? (n === 1 ? "piece" : "pieces") : n === 1 ? "pan" : "pans"}`;

/** "Toasted sesame seeds · 32 pieces × 2 g = 64 g" — what one line of a component card says. */
export function componentLineText(l: ComponentCardData["lines"][number], units: Pick<Units, "mass">): string {
  return `${l.name} · ${count(l.count, l.per)} × ${units.mass(l.gramsEach)} = ${units.mass(l.grams)}`;
}

/**
 * The day's component weigh-out: one card per topping, wash, filling or garnish per product, each ingredient as
 * pieces (or pans) × grams each = grams to weigh. The grams are in the day's ingredient totals and the forecast.
 */
export function ComponentCard({ card, units }: { card: ComponentCardData; units: Pick<Units, "mass"> }) {
  const id = `component-card-${card.productId}-${card.kind}-${card.name.replace(/[^A-Za-z0-9]+/g, "-")}`;
  return (
    <View style={styles.card} testID={id}>
      <AppText variant="overline" color="crust">{`${COMPONENT_KIND_LABEL[card.kind]} · ${card.productName}`}</AppText>
      <Heading level={3} variant="heading" testID={`${id}-name`}>
        {card.name}
      </Heading>
      {card.lines.map((l) => (
        <View key={l.ingredientId} style={styles.line}>
          <AppText variant="bodyStrong" testID={`${id}-line-${l.ingredientId}`}>
            {componentLineText(l, units)}
          </AppText>
          {l.note ? (
            <AppText variant="small" color="muted">
              {l.note}
            </AppText>
          ) : null}
        </View>
      ))}
      {card.lines.length > 1 ? <AppText color="muted" testID={`${id}-total`}>{`Together ${units.mass(card.totalGrams)}`}</AppText> : null}
    </View>
  );
}

export function ComponentCards({ cards, units, wide }: { cards: readonly ComponentCardData[] | undefined; units: Pick<Units, "mass">; wide?: boolean }) {
  if (!cards?.length) return null;
  return (
    <View style={styles.section} testID="component-cards">
      <Heading level={2} testID="component-cards-title">
        Toppings, washes and fillings
      </Heading>
      <View style={[styles.cards, wide && styles.cardsWide]}>
        {cards.map((c) => (
          <View key={c.key} style={wide ? styles.cardWide : undefined}>
            <ComponentCard card={c} units={units} />
          </View>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  cards: { gap: space.md },
  cardsWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-start" },
  cardWide: { flexGrow: 1, flexBasis: 320, maxWidth: "100%" },
  card: { gap: space.xs, padding: space.lg, borderRadius: radii.lg, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.border },
  line: { gap: space.xxs },
});
