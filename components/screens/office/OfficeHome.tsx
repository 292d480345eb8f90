import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { LinkTile, StatTile } from "../../ui/StatTile";
import { useBakeryTimeZone } from "../../api/bakery";
import { useMoney } from "../../ordering/useMoney";
import { formatCutoff, formatDay } from "../../ordering/dates";
import type { OfficeOverviewDto } from "../../../shared/schemas/bakery";
import { QueryStates } from "../../ui/QueryStates";
import { LinkButton } from "../../ui/LinkButton";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useOfficeSummaryQuery } from "../../api/office";
import { useBakeryQuery } from "../../api/bakery";
import { firstName, formatBakeDay } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import { ACCOUNT_STATUS_LABELS, CREDIT_HOLD_LABEL } from "../../../shared/schemas/accounts";
import { space } from "../../theme";

/** The office's home: how many accounts and people there are, and the way to each list. */
export function OfficeHome() {
  const user = useSignedInUser();
  const wide = useIsWide();
  const isOwner = user.role === "owner";
  const summary = useOfficeSummaryQuery();
  const bakery = useBakeryQuery();

  const subtitle = bakery.data
    ? `${bakery.data.name} · ${formatBakeDay(bakery.data.today, bakery.data.now, bakery.data.timeZone)}`
    : undefined;

  return (
    <Screen testID="office-home">
      <PageHeader overline={`Welcome back, ${firstName(user.name)}`} title="Office" subtitle={subtitle} testID="office-home-title" />
      <QueryStates query={summary} loadingLabel="Counting accounts and people…">
        {(counts) => (
          <View style={[styles.grid, wide && styles.gridWide]}>
            {counts.overview ? <TodayCard overview={counts.overview} wide={wide} /> : null}
            <Card title="Customer accounts" style={wide ? styles.cellWide : undefined} testID="office-accounts-card">
              <View style={styles.tiles}>
                <StatTile label="Active" value={counts.accounts.active} testID="count-accounts-active" />
                <StatTile label={ACCOUNT_STATUS_LABELS.on_hold} value={counts.accounts.paused} testID="count-accounts-paused" />
                <StatTile label={CREDIT_HOLD_LABEL} value={counts.accounts.creditHold} testID="count-accounts-credit-hold" />
                <StatTile label="Closed" value={counts.accounts.closed} testID="count-accounts-closed" />
              </View>
              <AppText color="muted">{`${counts.accounts.total} accounts in all.`}</AppText>
              <LinkButton href="/office/accounts" label="Open accounts" icon="arrow-right" testID="office-open-accounts" />
            </Card>
            <Card title="Orders and products" style={wide ? styles.cellWide : undefined} testID="office-orders-card">
              <AppText color="muted">The orders board shows each delivery date by account and product, with totals and a CSV export.</AppText>
              <View style={styles.buttons}>
                <LinkButton href="/office/orders" label="Orders board" icon="clipboard" testID="office-open-orders" />
                <LinkButton href="/office/products" label="Products" icon="shopping-bag" variant="secondary" testID="office-open-products" />
              </View>
            </Card>
            {isOwner ? (
              <Card title="Production" style={wide ? styles.cellWide : undefined} testID="office-production-card">
                <AppText color="muted">The bake day, dough formulas, ingredients and what to buy for the week.</AppText>
                <View style={styles.buttons}>
                  <LinkButton href="/office/production/day" label="Bake day" icon="sun" testID="office-open-bake-day" />
                  <LinkButton href="/office/production" label="Production" icon="layers" variant="secondary" testID="office-open-production" />
                </View>
              </Card>
            ) : null}
            {isOwner ? (
              <Card title="People" style={wide ? styles.cellWide : undefined} testID="office-people-card">
                <View style={styles.tiles}>
                  <StatTile label="Active sign-ins" value={counts.users.active} testID="count-users-active" />
                  <StatTile label="Turned off" value={counts.users.disabled} testID="count-users-disabled" />
                  <StatTile label="Invitations waiting" value={counts.users.pendingInvitations} testID="count-invitations" />
                </View>
                <AppText color="muted">{`${counts.users.total} people in all.`}</AppText>
                <LinkButton href="/office/people" label="Open people" icon="arrow-right" testID="office-open-people" />
              </Card>
            ) : null}
          </View>
        )}
      </QueryStates>
    </Screen>
  );
}

/** The day at a glance, each figure a link to where it comes from. */
function TodayCard({ overview: o, wide }: { overview: OfficeOverviewDto; wide: boolean }) {
  const money = useMoney();
  const tz = useBakeryTimeZone();
  const [today, tomorrow] = o.days;
  const dayTile = (d: OfficeOverviewDto["days"][number] | undefined, name: string) =>
    d ? (
      <LinkTile
        href={`/office/orders?date=${d.date}`}
        label={`${name}'s orders`}
        value={d.orders}
        detail={d.orders ? `${unitsLabel(d.units)} · ${money(d.totalCents)}` : "None yet"}
        testID={`overview-${name.toLowerCase()}`}
      />
    ) : null;
  return (
    <Card title="Today" style={wide ? styles.full : undefined} testID="office-today-card">
      <View style={styles.tiles}>
        {dayTile(today, "Today")}
        {dayTile(tomorrow, "Tomorrow")}
        <LinkTile href="/office/invoices" label="Owed to the bakery" value={money(o.owedCents)} detail="Open invoices" testID="overview-owed" />
        <LinkTile
          href="/office/invoices?show=overdue"
          label="Overdue"
          value={money(o.overdueCents)}
          detail={o.overdueInvoices === 1 ? "1 invoice" : `${o.overdueInvoices} invoices`}
          alert={o.overdueInvoices > 0}
          testID="overview-overdue"
        />
        {o.nextCutoff ? (
          <LinkTile href={`/office/orders?date=${o.nextCutoff.date}`} label="Next cut-off" value={formatCutoff(o.nextCutoff.at, tz)} detail={`For ${formatDay(o.nextCutoff.date)}`} testID="overview-cutoff" />
        ) : null}
        <LinkTile href="/office/outbox" label="E-mail not sent" value={o.failedMail} detail={o.failedMail ? "Send it again from the outbox" : "All sent"} alert={o.failedMail > 0} testID="overview-mail" />
      </View>
    </Card>
  );
}

const unitsLabel = (n: number) => (n === 1 ? "1 unit" : `${n} units`);

const styles = StyleSheet.create({
  full: { flexBasis: "100%" },
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-start" },
  cellWide: { flexGrow: 1, flexBasis: 300, minWidth: 0 },
  tiles: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
