import React from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { useBakeryQuery } from "../../api/bakery";
import { useForecastQuery, useNextBakeDayQuery } from "../../api/production";
import { addDays, cleanDate, formatDay } from "../../ordering/dates";
import { kitchenPaths, type KitchenArea } from "../../production/paths";
import { useUnits } from "../../production/units";
import { UnitsSwitch } from "./bakeday/UnitsSwitch";
import { BackToProduction } from "./BackToProduction";
import { RoundIconButton } from "./RoundIconButton";
import { DaysStrip } from "./forecast/DaysStrip";
import { ForecastView } from "./forecast/ForecastView";
import { space } from "../../theme";

/** What the next seven days of orders need, ingredient by ingredient, in whole purchase packs. */
export function ForecastScreen({ area, from: asked }: { area: KitchenArea; from?: string }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const bakery = useBakeryQuery();
  const askedFrom = asked ? cleanDate(asked) : null;
  const next = useNextBakeDayQuery({ enabled: !askedFrom });
  // From the next bake day: today's dough, once dispatched, is no longer to buy for.
  const from = askedFrom || next.data || (next.isError ? bakery.data?.today : undefined) || null;
  const forecast = useForecastQuery(from);
  const units = useUnits();
  const go = (d: string) => router.setParams({ from: d });

  let body: React.ReactNode;
  if (!from) {
    body = next.isError && bakery.isError ? <ErrorState error={bakery.error} onRetry={() => { void bakery.refetch(); void next.refetch(); }} retrying={bakery.isFetching} testID="forecast-error" /> : <LoadingState label="Finding the next bake day…" />;
  } else {
    body = (
      <QueryStates query={forecast} loadingLabel="Adding up the week's doughs…" errorTitle="The forecast didn't load" testID="forecast">
        {(data) =>
          data.items.length === 0 ? (
            <>
              <DaysStrip forecast={data} units={units} />
              <EmptyState icon="shopping-cart" title="Nothing to buy for these days" message="No orders or standing orders need dough in this week yet." testID="forecast-empty" />
            </>
          ) : (
            <ForecastView forecast={data} units={units} />
          )
        }
      </QueryStates>
    );
  }

  return (
    <Screen testID="forecast-screen">
      <BackToProduction paths={paths} />
      <PageHeader title="Purchasing" subtitle="Seven days of orders, with standing orders still to come, in whole purchase packs (rounded up)." testID="forecast-title" />
      {from ? (
        <View style={styles.controls}>
          <View style={styles.range}>
            <RoundIconButton large icon="chevron-left" label={`The 7 days before, from ${formatDay(addDays(from, -7))}`} onPress={() => go(addDays(from, -7))} testID="forecast-prev" />
            <AppText variant="heading" testID="forecast-range" align="center" style={styles.rangeText}>{`${formatDay(from)} – ${formatDay(addDays(from, 6))}`}</AppText>
            <RoundIconButton large icon="chevron-right" label={`The 7 days after, from ${formatDay(addDays(from, 7))}`} onPress={() => go(addDays(from, 7))} testID="forecast-next" />
          </View>
          <View style={styles.unitsCell}>
            <UnitsSwitch system={units.system} onChange={units.setSystem} />
          </View>
        </View>
      ) : null}
      {body}
    </Screen>
  );
}

const styles = StyleSheet.create({
  controls: { flexDirection: "row", flexWrap: "wrap", gap: space.lg, alignItems: "flex-end", justifyContent: "space-between" },
  range: { flexDirection: "row", alignItems: "center", gap: space.sm, flexGrow: 1, maxWidth: 480 },
  rangeText: { flex: 1 },
  unitsCell: { flexBasis: 300 },
});
