import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { DetailList } from "../../../ui/DetailList";
import { AppText } from "../../../ui/Text";
import { formatPercent } from "../../../production/units";
import { KIND_LABEL } from "../../../production/ingredientKinds";
import { STEP_LABELS } from "../../../../shared/production";
import type { FormulaDto } from "../../../../shared/schemas/production";
import { FiguresPanel } from "./FiguresPanel";
import { withF } from "./formulaText";
import { colors, space } from "../../../theme";

/** An earlier version, as it was: lines, paste, steps, figures. */
export function FormulaReadOnly({ formula: f }: { formula: FormulaDto }) {
  const lineName = (ingredientId: number) => f.lines.find((l) => l.ingredientId === ingredientId)?.name ?? "?";
  return (
    <View style={styles.stack} testID="formula-readonly">
      <Card title="Dough">
        <DetailList
          items={[
            { label: "Loss allowance", value: formatPercent(f.lossPercent) },
            { label: "Desired dough temperature", value: withF(f.ddtC) },
            { label: "Friction factor", value: `${f.frictionC} °C` },
            { label: "Target internal temperature", value: f.targetInternalC === null ? "Not given" : withF(f.targetInternalC) },
          ]}
        />
      </Card>
      <Card title="Ingredients" testID="formula-readonly-lines">
        {f.lines.map((l, i) => (
          <View key={`${l.ingredientId}-${i}`} style={[styles.roLine, i > 0 && styles.divider]}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong">{l.name}</AppText>
              <AppText variant="caption" color="muted">
                {KIND_LABEL[l.kind] ?? "Other"}
              </AppText>
            </View>
            <AppText variant="heading">{formatPercent(l.percent, 2)}</AppText>
          </View>
        ))}
      </Card>
      {f.paste ? (
        <Card title="Cooked paste">
          <DetailList
            items={[
              { label: "Flour", value: lineName(f.paste.flourIngredientId) },
              { label: "Liquid", value: lineName(f.paste.liquidIngredientId) },
              { label: "Share of flour cooked", value: formatPercent(f.paste.flourPercent) },
              { label: "Liquid-to-flour ratio", value: `${f.paste.liquidRatio} : 1` },
              { label: "Cook-to temperature", value: withF(f.paste.cookToC) },
            ]}
          />
        </Card>
      ) : null}
      <Card title="Steps">
        {f.steps.length === 0 ? <AppText color="muted">No steps.</AppText> : null}
        {f.steps.map((s, i) => (
          <View key={`${s.kind}-${i}`} style={[styles.roLine, i > 0 && styles.divider]}>
            <AppText variant="bodyStrong" style={styles.flex}>{`${i + 1}. ${STEP_LABELS[s.kind]}`}</AppText>
            <AppText>{`${s.minutes} min${s.temperatureC ? ` · ${withF(s.temperatureC)}` : ""}`}</AppText>
          </View>
        ))}
      </Card>
      <FiguresPanel figures={f.figures} hasPaste={!!f.paste} testID="formula-readonly-figures" />
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  stack: { gap: space.lg },
  roLine: { flexDirection: "row", alignItems: "center", gap: space.md, minHeight: 44, paddingVertical: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});
