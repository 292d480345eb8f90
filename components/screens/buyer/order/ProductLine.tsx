import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText } from "../../../ui/Text";
import { Stepper } from "../../../ui/Stepper";
import { AllergenChips } from "../../ordering/Allergens";
import { ProductPhoto } from "../../ordering/ProductPhoto";
import type { ProductDto } from "../../../../shared/schemas/catalog";
import { colors, radii, shadow, space } from "../../../theme";

export interface ProductLineProps {
  product: ProductDto;
  text: string;
  onChange: (text: string) => void;
  disabled: boolean;
  problem: string | null;
  lateNote: string | null;
  lineTotal: string | null;
  money: (c: number) => string;
}

/** One product on offer: photo, price (and the list price when the account pays less), allergens, its stepper. */
export function ProductLine({ product: p, text, onChange, disabled, problem, lateNote, lineTotal, money }: ProductLineProps) {
  const discounted = p.priceCents < p.listPriceCents;
  return (
    <View style={[styles.product, lineTotal && styles.productOn, problem && styles.productBad]} testID={`product-${p.id}`}>
      <View style={styles.productTop}>
        <ProductPhoto url={p.photoUrl} thumbUrl={p.photoThumbUrl} name={p.name} size={64} />
        <View style={styles.productText}>
          <AppText variant="bodyStrong">{p.name}</AppText>
          <AppText variant="small" color="muted">
            {p.saleUnit}
          </AppText>
          <View style={styles.priceLine}>
            <AppText variant="label" testID={`product-${p.id}-price`}>
              {money(p.priceCents)}
            </AppText>
            {discounted ? (
              <>
                <AppText variant="small" color="muted" style={styles.struck} accessibilityLabel={`List price ${money(p.listPriceCents)}`}>
                  {money(p.listPriceCents)}
                </AppText>
                <AppText variant="small" color="sageInk">
                  your price
                </AppText>
              </>
            ) : null}
          </View>
        </View>
      </View>
      <AllergenChips allergens={p.allergens} mayContain={p.mayContain} testID={`product-${p.id}-allergens`} />
      {lateNote ? (
        <AppText variant="small" color="muted">
          {lateNote}
        </AppText>
      ) : null}
      <View style={styles.stepRow}>
        <Stepper
          value={text}
          onChange={onChange}
          min={p.minQuantity}
          max={p.maxQuantity}
          label={p.name}
          disabled={disabled}
          invalid={!!problem}
          testID={`qty-${p.id}`}
        />
        <View style={styles.lineRight}>
          {lineTotal ? (
            <AppText variant="bodyStrong" testID={`line-${p.id}-total`}>
              {lineTotal}
            </AppText>
          ) : null}
          <AppText variant="caption" color="muted">
            {p.minQuantity > 1 ? `${p.minQuantity} to ${p.maxQuantity}` : `Up to ${p.maxQuantity}`}
          </AppText>
        </View>
      </View>
      {problem ? (
        <AppText variant="small" color="dangerInk" style={styles.strong} testID={`line-${p.id}-error`} accessibilityLiveRegion="polite">
          {problem}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  strong: { fontFamily: "Nunito_700Bold" },
  product: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
    padding: space.md,
    gap: space.sm,
    ...shadow.card,
  },
  productOn: { borderColor: colors.crust, borderWidth: 2 },
  productBad: { borderColor: colors.danger, borderWidth: 2 },
  productTop: { flexDirection: "row", gap: space.md },
  productText: { flex: 1, gap: space.xxs },
  priceLine: { flexDirection: "row", flexWrap: "wrap", alignItems: "baseline", gap: space.sm },
  struck: { textDecorationLine: "line-through" },
  stepRow: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md, flexWrap: "wrap" },
  lineRight: { alignItems: "flex-end", gap: space.xxs },
});
