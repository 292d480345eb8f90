import React from "react";
import { ScrollView, StyleSheet, View } from "react-native";
import { AppText, Heading } from "../../../ui/Text";
import type { ForecastDto } from "../../../api/production";
import { useMoney } from "../../ordering/parts";
import { formatDay } from "../../../ordering/dates";
import type { Units } from "../../../production/units";
import { packsText } from "./packsText";
import { colors, layout, radii, space } from "../../../theme";

const NAME_W = 200;
const DAY_W = 96;
const TOTAL_W = 120;
const BUY_W = 240;
const COST_W = 110;

/** From 1024 px: what to buy (packs and cost) first, then the grams day by day. */
export function ForecastTable({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const money = useMoney();
  return (
    <>
      <View style={styles.section} testID="forecast-buy">
        <Heading level={2}>To buy</Heading>
        <View style={styles.table} testID="forecast-table" role="table">
          <View style={[styles.tr, styles.th]} role="row">
            <Cell w={NAME_W} header grow>
              Ingredient
            </Cell>
            <Cell w={TOTAL_W} header right>
              Needed
            </Cell>
            <Cell w={BUY_W} header right>
              Packs (rounded up)
            </Cell>
            <Cell w={COST_W} header right>
              Cost
            </Cell>
          </View>
          {forecast.items.map((i) => (
            <View key={i.ingredientId} style={[styles.tr, styles.divider]} role="row" testID={`forecast-item-${i.ingredientId}`}>
              <Cell w={NAME_W} strong grow>
                {i.name}
              </Cell>
              <Cell w={TOTAL_W} right>
                {units.mass(i.grams)}
              </Cell>
              <Cell w={BUY_W} right strong testID={`forecast-item-${i.ingredientId}-packs`}>
                {packsText(i)}
              </Cell>
              <Cell w={COST_W} right>
                {i.packGrams > 0 ? money(i.costCents) : "–"}
              </Cell>
            </View>
          ))}
          <View style={[styles.tr, styles.totalRow]} role="row">
            <Cell w={NAME_W} strong grow>
              Total
            </Cell>
            <Cell w={TOTAL_W} right>
              {" "}
            </Cell>
            <Cell w={BUY_W} right>
              {" "}
            </Cell>
            <Cell w={COST_W} right strong>
              {money(forecast.totalCostCents)}
            </Cell>
          </View>
        </View>
      </View>
      <View style={styles.section} testID="forecast-by-day">
        <Heading level={2}>By day</Heading>
        <ScrollView horizontal style={styles.tableScroll} contentContainerStyle={styles.tableContent}>
          <View style={styles.table} role="table">
            <View style={[styles.tr, styles.th]} role="row">
              <Cell w={NAME_W} header grow>
                Ingredient
              </Cell>
              {forecast.days.map((d) => (
                <Cell key={d.date} w={DAY_W} header right>
                  {formatDay(d.date)}
                </Cell>
              ))}
            </View>
            {forecast.items.map((i) => (
              <View key={i.ingredientId} style={[styles.tr, styles.divider]} role="row" testID={`forecast-day-row-${i.ingredientId}`}>
                <Cell w={NAME_W} strong grow>
                  {i.name}
                </Cell>
                {forecast.days.map((d) => (
                  <Cell key={d.date} w={DAY_W} right muted={!i.byDay[d.date]}>
                    {i.byDay[d.date] ? units.mass(i.byDay[d.date]) : "–"}
                  </Cell>
                ))}
              </View>
            ))}
            <View style={[styles.tr, styles.totalRow]} role="row">
              <Cell w={NAME_W} strong grow>
                Dough
              </Cell>
              {forecast.days.map((d) => (
                <Cell key={d.date} w={DAY_W} right strong>
                  {d.doughGrams ? units.mass(d.doughGrams) : "–"}
                </Cell>
              ))}
            </View>
          </View>
        </ScrollView>
      </View>
    </>
  );
}

function Cell({ w, children, header, right, strong, muted, grow, testID }: { w: number; children: React.ReactNode; header?: boolean; right?: boolean; strong?: boolean; muted?: boolean; grow?: boolean; testID?: string }) {
  return (
    <View style={[styles.td, grow ? { minWidth: w, flexGrow: 1, flexBasis: w } : { width: w }, right && styles.right]} role={header ? "columnheader" : "cell"}>
      <AppText variant={header ? "caption" : strong ? "bodyStrong" : "body"} color={header || muted ? "muted" : "ink"} align={right ? "right" : undefined} testID={testID}>
        {children}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  tableScroll: { flexGrow: 0 },
  tableContent: { flexGrow: 1 },
  section: { gap: space.sm },
  table: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, overflow: "hidden", flexGrow: 1 },
  tr: { flexDirection: "row", alignItems: "center", minHeight: layout.minTouch + 4, paddingHorizontal: space.sm },
  th: { backgroundColor: colors.sunken, minHeight: layout.minTouch },
  td: { paddingHorizontal: space.xs, paddingVertical: space.sm, justifyContent: "center" },
  right: { alignItems: "flex-end" },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  totalRow: { borderTopWidth: 2, borderTopColor: colors.inputBorder, backgroundColor: colors.sunken },
});
