import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText } from "../../../ui/Text";
import { Badge } from "../../../ui/Badge";
import { Stepper } from "../../../ui/Stepper";
import { ProductPhoto } from "../../ordering/ProductPhoto";
import { useMoney } from "../../../ordering/useMoney";
import { cellKey, perWeek, periodText, type Cells } from "../../../ordering/standing";
import { WEEKDAY_LONG, WEEKDAY_SHORT, type Weekday } from "../../../../shared/calendar";
import type { ProductDto } from "../../../../shared/schemas/catalog";
import { colors, radii, space } from "../../../theme";

export interface ProductRowProps {
  product: ProductDto;
  weekdays: Weekday[];
  /** Every week (1) or every other week (2): what the count badge says it is per. */
  intervalWeeks: 1 | 2;
  cells: Cells;
  /** The product's limits broken, by cell key. */
  problems: Record<string, string>;
  /** The server's messages, by cell key. */
  cellErrors: Record<string, string>;
  onChange: (key: string, text: string) => void;
  disabled: boolean;
  wide: boolean;
}

/** One product: its name and a compact row of steppers, one per delivery weekday. */
export function ProductRow({ product: p, weekdays, intervalWeeks, cells, problems, cellErrors, onChange, disabled, wide }: ProductRowProps) {
  const money = useMoney();
  const messages = weekdays
    .map((d) => {
      const k = cellKey(p.id, d);
      const m = cellErrors[k] ?? problems[k];
      return m ? `${WEEKDAY_LONG[d]}: ${m}` : null;
    })
    .filter((m): m is string => !!m);
  const count = perWeek(p.id, weekdays, cells);
  return (
    <View style={[styles.productCard, wide && styles.productCardWide, messages.length > 0 && styles.productBad]} testID={`standing-product-${p.id}`}>
      <View style={styles.productTop}>
        <ProductPhoto url={p.photoUrl} thumbUrl={p.photoThumbUrl} name={p.name} size={44} />
        <View style={styles.flex}>
          <AppText variant="bodyStrong">{p.name}</AppText>
          <AppText variant="small" color="muted">{`${p.saleUnit} · ${money(p.priceCents)}`}</AppText>
        </View>
        {count > 0 ? <Badge label={`${count} ${periodText(intervalWeeks)}`} tone="crust" /> : null}
      </View>
      <View style={styles.days}>
        {weekdays.map((d) => {
          const k = cellKey(p.id, d);
          return (
            <View key={d} style={styles.day}>
              <AppText variant="caption" color="muted" align="center">
                {WEEKDAY_SHORT[d]}
              </AppText>
              <Stepper
                direction="column"
                value={cells[k] ?? ""}
                onChange={(t) => onChange(k, t)}
                min={p.minQuantity}
                max={p.maxQuantity}
                label={`${p.name} on ${WEEKDAY_LONG[d]}s`}
                invalid={!!(cellErrors[k] ?? problems[k])}
                disabled={disabled}
                highlight
                testID={`standing-cell-${p.id}-${d}`}
              />
            </View>
          );
        })}
      </View>
      {messages.map((m) => (
        <AppText key={m} variant="small" color="dangerInk" testID={`standing-product-${p.id}-error`} style={styles.strong}>
          {m}
        </AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  strong: { fontFamily: "Nunito_700Bold" },
  productCardWide: { width: "32%", minWidth: 290 },
  productCard: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, padding: space.md, gap: space.sm },
  productBad: { borderColor: colors.danger, borderWidth: 2 },
  productTop: { flexDirection: "row", alignItems: "center", gap: space.md },
  days: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  day: { width: 52, alignItems: "center", gap: space.xxs },
});
