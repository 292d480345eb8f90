import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useBakeryQuery } from "../../api/bakery";
import { firstName, formatBakeDay, formatClock, greetingAt } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import { colors, radii, space } from "../../theme";
import { LinkButton } from "../../ui/LinkButton";
import { addDays } from "../../ordering/dates";

/** The baker's home: which day the bakery is on, by the bakery's own clock. */
export function BakerHome() {
  const user = useSignedInUser();
  const wide = useIsWide();
  const bakery = useBakeryQuery();

  if (bakery.isPending) {
    return (
      <Screen testID="baker-home">
        <LoadingState label="Loading the bake day…" />
      </Screen>
    );
  }
  if (bakery.isError) {
    return (
      <Screen testID="baker-home">
        <PageHeader title="Bake day" testID="baker-home-title" />
        <ErrorState error={bakery.error} onRetry={() => bakery.refetch()} retrying={bakery.isFetching} />
      </Screen>
    );
  }

  const b = bakery.data;
  const day = formatBakeDay(b.today, b.now, b.timeZone);
  const clock = formatClock(b.now, b.timeZone);

  return (
    <Screen testID="baker-home">
      <PageHeader overline={b.name} title="Bake day" subtitle={`${greetingAt(b.now, b.timeZone)}, ${firstName(user.name)}.`} testID="baker-home-title" />
      <View style={[styles.grid, wide && styles.gridWide]}>
        <View style={[styles.today, styles.cell]} testID="bake-day-card">
          <AppText variant="overline" color="onPrimary">
            Today at the bakery
          </AppText>
          <AppText variant="display" color="onPrimary" testID="bake-day-date">
            {day}
          </AppText>
          {clock ? (
            <AppText color="onPrimary" testID="bake-day-clock">
              {`${clock} local time · ${b.timeZone.replace(/_/g, " ")}`}
            </AppText>
          ) : null}
        </View>
        <Card title="Orders to bake" style={styles.cell} testID="baker-orders-card">
          <AppText color="muted">Product totals and who gets what, for any delivery date.</AppText>
          <View style={styles.buttons}>
            <LinkButton href="/bake/orders" label="Today's orders" icon="clipboard" testID="baker-open-orders" />
            <LinkButton href={`/bake/orders?date=${addDays(b.today, 1)}`} label="Tomorrow's" icon="arrow-right" variant="secondary" testID="baker-open-tomorrow" />
          </View>
        </Card>
        <Card title="The bakery" style={styles.cell}>
          <DetailList
            items={[
              { label: "Name", value: b.name },
              { label: "Address", value: b.address },
              { label: "Phone", value: b.phone },
              { label: "E-mail", value: b.email },
            ]}
          />
        </Card>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "stretch" },
  cell: { flex: 1 },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  today: { backgroundColor: colors.primary, borderRadius: radii.lg, padding: space.xl, gap: space.sm, justifyContent: "center" },
});
