import React from "react";
import { ScrollView, StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { AppText, Heading } from "../../ui/Text";
import { useBakeryQuery } from "../../api/bakery";
import { useForecastQuery, useNextBakeDayQuery, type ForecastDto } from "../../api/production";
import { useMoney } from "../ordering/parts";
import { useIsWide } from "../../shell/useIsWide";
import { addDays, cleanDate, formatDay } from "../../ordering/dates";
import { kitchenPaths, type KitchenArea } from "../../production/paths";
import { useUnits, type Units } from "../../production/units";
import { RoundIconButton } from "./RoundIconButton";
import { UnitsSwitch } from "./bakeday/UnitsSwitch";
import { BackToProduction } from "./BackToProduction";
import { colors, fonts, layout, radii, space } from "../../theme";

type Item = ForecastDto["items"][number];

/** "2 × 25 kg sack", or why nothing is bought. */
export function packsText(i: Pick<Item, "packs" | "packName" | "packGrams">): string {
  if (i.packGrams <= 0) return "Not bought";
  return `${i.packs} × ${i.packName}`;
}

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

function DaysStrip({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const wide = useIsWide();
  const tiles = forecast.days.map((d) => (
        <View key={d.date} style={[styles.day, wide && styles.dayWide, d.doughGrams === 0 && styles.dayQuiet]} testID={`forecast-day-${d.date}`} accessible accessibilityLabel={`${formatDay(d.date)}: ${units.mass(d.doughGrams)} of dough, ${d.orderedUnits} units ordered`}>
          <AppText variant="label">{formatDay(d.date)}</AppText>
          <AppText style={styles.dayDough}>{d.doughGrams > 0 ? units.mass(d.doughGrams) : "–"}</AppText>
          <AppText variant="caption" color="muted">
            {d.doughGrams > 0 ? `dough · ${d.orderedUnits} units` : "no dough"}
          </AppText>
        </View>
  ));
  if (wide) {
    return (
      <View style={styles.daysWide} testID="forecast-days">
        {tiles}
      </View>
    );
  }
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.days} testID="forecast-days">
      {tiles}
    </ScrollView>
  );
}

function ForecastView({ forecast, units }: { forecast: ForecastDto; units: Units }) {
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
    </>
  );
}

const NAME_W = 200;
const DAY_W = 96;
const TOTAL_W = 120;
const BUY_W = 240;
const COST_W = 110;

/** From 1024 px: what to buy (packs and cost) first, then the grams day by day. */
function ForecastTable({ forecast, units }: { forecast: ForecastDto; units: Units }) {
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

function ForecastCards({ forecast, units }: { forecast: ForecastDto; units: Units }) {
  const money = useMoney();
  return (
    <View style={styles.cards} testID="forecast-list">
      {forecast.items.map((i) => (
        <Card key={i.ingredientId} testID={`forecast-item-${i.ingredientId}`}>
          <View style={styles.itemTop}>
            <AppText variant="heading" style={styles.flex}>
              {i.name}
            </AppText>
            <AppText style={styles.itemTotal}>{units.mass(i.grams)}</AppText>
          </View>
          <View style={styles.buy}>
            <AppText variant="bodyStrong" style={styles.flex} testID={`forecast-item-${i.ingredientId}-packs`}>
              {i.packGrams > 0 ? `Buy ${packsText(i)}` : "Not bought (e.g. tap water)"}
            </AppText>
            {i.packGrams > 0 ? <AppText variant="bodyStrong">{money(i.costCents)}</AppText> : null}
          </View>
          <View style={styles.byDay}>
            {forecast.days
              .filter((d) => i.byDay[d.date])
              .map((d) => (
                <View key={d.date} style={styles.dayChip}>
                  <AppText variant="caption" color="muted">
                    {formatDay(d.date)}
                  </AppText>
                  <AppText variant="label">{units.mass(i.byDay[d.date])}</AppText>
                </View>
              ))}
          </View>
        </Card>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  controls: { flexDirection: "row", flexWrap: "wrap", gap: space.lg, alignItems: "flex-end", justifyContent: "space-between" },
  range: { flexDirection: "row", alignItems: "center", gap: space.sm, flexGrow: 1, maxWidth: 480 },
  rangeText: { flex: 1 },
  unitsCell: { flexBasis: 300 },
  summary: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  tile: { flexGrow: 1, flexBasis: 150, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  tileValue: { fontFamily: fonts.extrabold, fontSize: 30, lineHeight: 36, color: colors.ink },
  days: { gap: space.sm, paddingVertical: space.xxs },
  daysWide: { flexDirection: "row", gap: space.sm },
  dayWide: { flex: 1, width: undefined, minWidth: 0 },
  day: { width: 124, backgroundColor: colors.surface, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border, padding: space.md, gap: space.xxs },
  dayQuiet: { backgroundColor: colors.page },
  dayDough: { fontFamily: fonts.extrabold, fontSize: 18, lineHeight: 24, color: colors.ink, fontVariant: ["tabular-nums"] },
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
  cards: { gap: space.md },
  itemTop: { flexDirection: "row", alignItems: "baseline", gap: space.md },
  itemTotal: { fontFamily: fonts.extrabold, fontSize: 22, lineHeight: 28, color: colors.ink, fontVariant: ["tabular-nums"] },
  buy: { flexDirection: "row", alignItems: "center", gap: space.md, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md },
  byDay: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  dayChip: { borderWidth: 1, borderColor: colors.border, borderRadius: radii.sm, paddingHorizontal: space.sm, paddingVertical: space.xxs },
});
