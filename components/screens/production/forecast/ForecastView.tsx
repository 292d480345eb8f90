import React from "react";
import { Platform, StyleSheet, View } from "react-native";
import { AppText } from "../../../ui/Text";
import { downloadForecastCsv, type ForecastDto } from "../../../api/production";
import { Button } from "../../../ui/Button";
import { FormError, Notice } from "../../../ui/FormError";
import { useDownload } from "../../../forms/useDownload";
import { useIsWide } from "../../../shell/useIsWide";
import { useMoney } from "../../ordering/parts";
import type { Units } from "../../../production/units";
import { DaysStrip } from "./DaysStrip";
import { ForecastTable } from "./ForecastTable";
import { ForecastCards } from "./ForecastCards";
import { colors, fonts, radii, space } from "../../../theme";

/** The week's cost and count, the days, and what to buy (a table from 1024 px, cards below). */
export function ForecastView({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const wide = useIsWide();
  const money = useMoney();
  const packsToBuy = forecast.items.filter((i) => i.packs > 0).length;
  return (
    <>
      <View style={styles.summary}>
        <View style={styles.tile} testID="forecast-total">
          <AppText style={styles.tileValue}>{money(forecast.totalCostCents)}</AppText>
          <AppText variant="caption" color="muted">
            Cost of the packs
          </AppText>
        </View>
        <View style={styles.tile} testID="forecast-lines">
          <AppText style={styles.tileValue}>{String(packsToBuy)}</AppText>
          <AppText variant="caption" color="muted">
            {packsToBuy === 1 ? "Ingredient to buy" : "Ingredients to buy"}
          </AppText>
        </View>
      </View>
      <DaysStrip forecast={forecast} units={units} />
      {wide ? <ForecastTable forecast={forecast} units={units} /> : <ForecastCards forecast={forecast} units={units} />}
      <AppText variant="small" color="muted">
        {"Packs are rounded up for the week's total; what is already in the store room is not taken off."}
      </AppText>
      <ForecastActions forecast={forecast} />
    </>
  );
}

/** Take the list to the supplier: a CSV for a spreadsheet or an order form, or the page printed (web). */
function ForecastActions({ forecast }: { forecast: ForecastDto }) {
  const download = useDownload();
  return (
    <View style={styles.actions} testID="forecast-actions">
      <Button label="Download CSV" icon="download" variant="secondary" busy={download.pending !== null} onPress={() => download.run(() => downloadForecastCsv(forecast))} testID="forecast-csv" />
      {Platform.OS === "web" ? <Button label="Print this list" icon="printer" variant="ghost" onPress={() => window.print()} testID="forecast-print" /> : null}
      <FormError message={download.error} testID="forecast-csv-error" />
      {download.done ? <Notice message={`purchasing-${forecast.from}-to-${forecast.to}.csv downloaded.`} testID="forecast-csv-done" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  summary: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  tile: { flexGrow: 1, flexBasis: 150, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  tileValue: { fontFamily: fonts.extrabold, fontSize: 30, lineHeight: 36, color: colors.ink },
});
