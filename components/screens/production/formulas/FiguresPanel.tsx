import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { AppText } from "../../../ui/Text";
import { formatPercent } from "../../../production/units";
import { formatNum } from "../../../format";
import type { FormulaFigures } from "../../../../shared/production";
import { colors, fonts, radii, space } from "../../../theme";

/** The figures the formula works out to, from the shared formulaFigures. */
export function FiguresPanel({ figures, hasPaste, testID = "formula-figures" }: { figures: FormulaFigures; hasPaste: boolean; testID?: string }) {
  const rows: { label: string; value: string; id: string; hint?: string }[] = [
    { label: "Total", value: formatPercent(figures.totalPercent), id: "total", hint: "All lines" },
    { label: "Flour", value: formatPercent(figures.flourPercent), id: "flour", hint: "Must be 100 %" },
    { label: "Hydration", value: formatPercent(figures.hydrationPercent), id: "hydration", hint: "Liquid lines" },
    { label: "Effective hydration", value: formatPercent(figures.effectiveHydrationPercent), id: "effective", hint: "Water in liquids, egg, butter, honey" },
    { label: "Flour's own moisture", value: formatPercent(figures.flourMoisturePercent ?? 0), id: "flour-moisture", hint: "Apart: not in the hydration" },
    { label: "Paste share", value: hasPaste ? formatPercent(figures.pasteSharePercent) : "No paste", id: "paste-share", hint: "Flour cooked" },
    { label: "Paste weight", value: hasPaste ? formatPercent(figures.pastePercent) : "–", id: "paste", hint: "Of the flour" },
    { label: "Dough per kg flour", value: `${formatNum(Math.round(figures.doughYieldPerKgFlour))} g`, id: "yield" },
  ];
  const flourOff = Math.abs(figures.flourPercent - 100) > 0.01;
  return (
    <Card title="Figures" testID={testID}>
      <AppText variant="small" color="muted">
        Worked out as you type.
      </AppText>
      <View style={styles.figures}>
        {rows.map((r) => (
          <View key={r.id} style={styles.figure} testID={`figure-${r.id}-box`} accessible accessibilityLabel={`${r.label}: ${r.value}`}>
            <AppText style={styles.figureValue} color={r.id === "flour" && flourOff ? "dangerInk" : "ink"} testID={`figure-${r.id}`}>
              {r.value}
            </AppText>
            <AppText variant="caption" color="muted">
              {r.label}
            </AppText>
            {r.hint ? (
              <AppText variant="caption" color="muted">
                {r.hint}
              </AppText>
            ) : null}
          </View>
        ))}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  figures: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  figure: { flexGrow: 1, flexBasis: 130, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: 1 },
  figureValue: { fontFamily: fonts.extrabold, fontSize: 24, lineHeight: 30, fontVariant: ["tabular-nums"] },
});
