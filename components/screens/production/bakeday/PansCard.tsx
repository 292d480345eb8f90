import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Badge } from "../../../ui/Badge";
import { Stepper } from "../../../ui/Stepper";
import { FieldFrame } from "../../../ui/Field";
import { FormError } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import { TextLink } from "../../../ui/TextLink";
import type { PlanView } from "../../../api/production";
import { parseQuantity } from "../../../ordering/quantities";
import type { Units } from "../../../production/units";
import type { KitchenPaths } from "../../../production/paths";
import { formatCount, unitsFor } from "../../../../shared/units";
import { colors, fonts, radii, space } from "../../../theme";

const METRIC = unitsFor("metric");

export interface PansCardProps {
  plan: PlanView;
  extras: Record<string, string>;
  onExtra: (productId: number, text: string) => void;
  wide: boolean;
  saving: boolean;
  error: string | null;
  formulasHref: KitchenPaths["formulas"];
  /** Piece weights in these units (grams when absent). */
  units?: Units;
}

/** Pans per product, big: what goes in the ovens. Extra pans (for the shop, or spares) are the baker's to add. */
export function PansCard({ plan, extras, onExtra, wide, saving, error, formulasHref, units }: PansCardProps) {
  const totalPans = plan.products.reduce((s, p) => s + p.pans, 0);
  return (
    <Card
      title="Pans to bake"
      testID="pans"
      action={
        <AppText variant="bodyStrong" color="muted" testID="pans-total">
          {`${totalPans} ${totalPans === 1 ? "pan" : "pans"} in all`}
        </AppText>
      }
    >
      {plan.frozen ? (
        <AppText variant="small" color="muted">
          Changing extra pans recalculates the plan set at the cut-off.
        </AppText>
      ) : null}
      <View style={[styles.pans, wide && styles.pansWide]}>
        {plan.products.map((p) => {
          const text = extras[String(p.productId)] ?? String(p.extraPans);
          const q = parseQuantity(text);
          const invalid = Number.isNaN(q) || q > 100;
          return (
            <View key={p.productId} style={[styles.pan, wide && styles.panWide]} testID={`pans-${p.productId}`}>
              <View style={styles.panTop}>
                <View style={styles.panCount} accessible accessibilityLabel={`${p.pans} ${p.pans === 1 ? "pan" : "pans"} of ${p.name}`}>
                  <AppText style={styles.panNumber} testID={`pans-${p.productId}-count`}>
                    {String(p.pans)}
                  </AppText>
                  <AppText variant="overline" color="muted">
                    {p.pans === 1 ? "pan" : "pans"}
                  </AppText>
                </View>
                <View style={styles.flex}>
                  <AppText style={styles.panName} testID={`pans-${p.productId}-name`}>
                    {p.name}
                  </AppText>
                  <AppText variant="bodyStrong" color="crust" testID={`pans-${p.productId}-pan`}>
                    {p.panName}
                  </AppText>
                  <AppText variant="small" color="muted" testID={`pans-${p.productId}-units`}>
                    {`${p.units} ordered${p.extraPans ? ` + ${formatCount(p.extraPans, "extra pan", "extra pans")}` : ""} · ${formatCount(p.pieces, "piece", "pieces")} of ${(units ?? METRIC).piece(p.pieceGrams)} dough`}
                  </AppText>
                  <View style={styles.badges}>
                    {p.openUnits > 0 ? <Badge label={`${p.openUnits} still open`} tone="amber" /> : null}
                    {p.formulaId === null ? <Badge label="No formula" tone="danger" /> : null}
                  </View>
                </View>
              </View>
              <FieldFrame label="Extra pans" error={invalid ? "Enter a whole number of pans, 0 to 100." : null} testID={`extra-${p.productId}`}>
                <Stepper value={text} onChange={(t) => onExtra(p.productId, t)} min={0} max={100} label={`extra pans of ${p.name}`} invalid={invalid} testID={`extra-${p.productId}`} />
              </FieldFrame>
            </View>
          );
        })}
      </View>
      {plan.products.some((p) => p.formulaId === null) ? <TextLink href={formulasHref} label="Give products a formula" /> : null}
      {saving ? (
        <AppText variant="small" color="muted" testID="bake-day-saving">
          Saving…
        </AppText>
      ) : null}
      <FormError message={error} testID="pans-error" />
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  pans: { gap: space.md },
  pansWide: { flexDirection: "row", flexWrap: "wrap" },
  pan: { backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.md },
  panWide: { flexGrow: 1, flexBasis: 300, maxWidth: "100%" },
  panTop: { flexDirection: "row", gap: space.md, alignItems: "flex-start" },
  panCount: { minWidth: 84, alignItems: "center", backgroundColor: colors.surface, borderRadius: radii.md, paddingVertical: space.xs, paddingHorizontal: space.sm, borderWidth: 1, borderColor: colors.border },
  panNumber: { fontFamily: fonts.extrabold, fontSize: 60, lineHeight: 66, color: colors.ink, fontVariant: ["tabular-nums"] },
  panName: { fontFamily: fonts.extrabold, fontSize: 21, lineHeight: 27, color: colors.ink },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs, marginTop: space.xxs },
});
