import React from "react";
import { StyleSheet, View } from "react-native";
import { AppText, Heading } from "../../../ui/Text";
import { DataTable, NoValue, type Column } from "../../../ui/DataTable";
import type { ForecastDto } from "../../../api/production";
import { useMoney } from "../../ordering/parts";
import { formatDay } from "../../../ordering/dates";
import type { Units } from "../../../production/units";
import { packsText } from "./packsText";
import { space } from "../../../theme";

type Item = ForecastDto["items"][number];

// The day-by-day table has a column per day: it scrolls sideways below this width per column.
const NAME_W = 200;
const DAY_W = 96;

/** From 1024 px: what to buy (packs and cost) first, then the grams day by day. */
export function ForecastTable({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const money = useMoney();
  const buy: Column<Item>[] = [
    { key: "name", label: "Ingredient", flex: 2, strong: true, render: (i) => i.name, footer: "Total" },
    { key: "needed", label: "Needed", flex: 1.2, align: "right", render: (i) => units.mass(i.grams) },
    {
      key: "packs",
      label: "Packs (rounded up)",
      flex: 2.4,
      align: "right",
      render: (i) => (
        <AppText variant="bodyStrong" align="right" testID={`forecast-item-${i.ingredientId}-packs`}>
          {packsText(i)}
        </AppText>
      ),
    },
    { key: "cost", label: "Cost", flex: 1.1, align: "right", render: (i) => (i.packGrams > 0 ? money(i.costCents) : "–"), footer: money(forecast.totalCostCents) },
  ];
  const byDay: Column<Item>[] = [
    { key: "name", label: "Ingredient", flex: NAME_W / DAY_W, strong: true, render: (i) => i.name, footer: "Dough" },
    ...forecast.days.map(
      (d): Column<Item> => ({
        key: d.date,
        label: formatDay(d.date),
        align: "right",
        render: (i) => (i.byDay[d.date] ? units.mass(i.byDay[d.date]) : <NoValue />),
        footer: d.doughGrams ? units.mass(d.doughGrams) : "–",
      }),
    ),
  ];
  return (
    <>
      <View style={styles.section} testID="forecast-buy">
        <Heading level={2}>To buy</Heading>
        <DataTable columns={buy} rows={forecast.items} rowKey={(i) => i.ingredientId} rowTestID={(i) => `forecast-item-${i.ingredientId}`} footer testID="forecast-table" />
      </View>
      <View style={styles.section} testID="forecast-by-day">
        <Heading level={2}>By day</Heading>
        <DataTable
          columns={byDay}
          rows={forecast.items}
          rowKey={(i) => i.ingredientId}
          rowTestID={(i) => `forecast-day-row-${i.ingredientId}`}
          footer
          minWidth={NAME_W + DAY_W * forecast.days.length}
        />
      </View>
    </>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.sm },
});
