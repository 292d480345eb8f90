import React from "react";
import { StyleSheet, View } from "react-native";
import { Link } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { Notice } from "../../ui/FormError";
import { Badge } from "../../ui/Badge";
import { LinkButton } from "../../ui/LinkButton";
import { LinkPressable } from "../../ui/LinkPressable";
import { AppText, Heading } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryQuery } from "../../api/bakery";
import { useCalendarQuery } from "../../api/calendar";
import { BakeryContactCard } from "../common/BakeryContactCard";
import { CutoffCountdown, dayStatus, useMoney } from "../ordering/parts";
import { useServerNow } from "../../ordering/useServerNow";
import { msUntil } from "../../ordering/countdown";
import { addDays, dayHeading, formatDayLong, relativeDay } from "../../ordering/dates";
import { firstName, formatBakeDay } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import type { AccountDto } from "../../../shared/schemas/accounts";
import type { CalendarDayDto } from "../../../shared/schemas/calendar";
import { productsLabel } from "../../ordering/quantities";
import { colors, layout, radii, space } from "../../theme";

/** How many days ahead the home screen looks. */
export const HOME_DAYS = 14;

export function accountStatusNote(account: AccountDto): string | null {
  if (account.status === "on_hold" && account.creditHold) return "This account is on credit hold: new orders wait until the overdue invoices are paid. Pay them under Invoices and ordering opens again straight away.";
  if (account.status === "on_hold") return "The bakery has paused this account. Please contact the bakery before planning new orders.";
  if (account.status === "closed") return "This account is closed. Contact the bakery if you'd like to order again.";
  return null;
}

/** Delivery days worth showing: any with an order, and the account's delivery days (orderable or not). */
export function homeDays(days: CalendarDayDto[]): CalendarDayDto[] {
  return days.filter((d) => d.order || d.reason !== "not_delivery_day");
}

/** A café buyer's home: the coming delivery dates, each with its order and a live countdown to its cut-off. */
export function BuyerHome() {
  const user = useSignedInUser();
  const wide = useIsWide();
  const account = useAccountQuery(user.accountId);
  const bakery = useBakeryQuery();

  if (!user.accountId) {
    return (
      <Screen testID="buyer-home">
        <PageHeader overline="Wholesale ordering" title={`Hello, ${firstName(user.name)}`} testID="buyer-home-title" />
        <EmptyState
          icon="link"
          title="Your sign-in isn't linked to a customer account"
          message="Ask the bakery to link you to your business's account."
          testID="buyer-no-account"
        />
        <BakeryContactCard />
      </Screen>
    );
  }

  if (account.isPending) {
    return (
      <Screen testID="buyer-home">
        <LoadingState label="Loading your account…" />
      </Screen>
    );
  }
  if (account.isError) {
    return (
      <Screen testID="buyer-home">
        <PageHeader overline="Wholesale ordering" title={`Hello, ${firstName(user.name)}`} />
        <ErrorState error={account.error} title="Your account didn't load" onRetry={() => account.refetch()} retrying={account.isFetching} />
      </Screen>
    );
  }

  const a = account.data;
  const note = accountStatusNote(a);
  const subtitle = bakery.data ? `Ordering from ${bakery.data.name} · ${formatBakeDay(bakery.data.today, bakery.data.now, bakery.data.timeZone)}` : `Welcome back, ${firstName(user.name)}`;

  return (
    <Screen testID="buyer-home">
      <PageHeader overline="Wholesale ordering" title={a.businessName} subtitle={subtitle} testID="buyer-home-title" />
      {note ? <Notice tone="info" message={note} testID="buyer-status-note" /> : null}
      <View style={[styles.grid, wide && styles.gridWide]}>
        <View style={[styles.main, wide && styles.mainWide]}>
          <Deliveries />
        </View>
        <View style={[styles.side, wide && styles.sideWide]}>
          <Card title="Same order every week?">
            <AppText color="muted">A standing order places your usual quantities for each delivery day by itself. You can still change any single date.</AppText>
            <LinkButton href="/buyer/standing" label="Standing order" icon="repeat" variant="secondary" testID="home-standing-link" />
          </Card>
          <BakeryContactCard />
        </View>
      </View>
    </Screen>
  );
}

function Deliveries() {
  const bakery = useBakeryQuery();
  const today = bakery.data?.today;
  const calendar = useCalendarQuery(today ? { from: today, to: addDays(today, HOME_DAYS - 1) } : null);
  const now = useServerNow();

  if (bakery.isError) {
    return <ErrorState error={bakery.error} title="The delivery dates didn't load" onRetry={() => bakery.refetch()} retrying={bakery.isFetching} testID="deliveries-error" />;
  }
  if (!today || calendar.isPending) return <LoadingState label="Loading your delivery dates…" testID="deliveries-loading" />;
  if (calendar.isError) {
    return <ErrorState error={calendar.error} title="The delivery dates didn't load" onRetry={() => calendar.refetch()} retrying={calendar.isFetching} testID="deliveries-error" />;
  }
  const days = homeDays(calendar.data);
  if (days.length === 0) {
    return (
      <EmptyState
        icon="calendar"
        title="No deliveries in the next two weeks"
        message="The bakery has no delivery days for you in this time. Call them if that looks wrong."
        testID="deliveries-empty"
      />
    );
  }
  const next = days.find((d) => msUntil(d.cutoffAt, now) > 0 && (d.orderable || d.order?.status === "open"));
  const tz = bakery.data?.timeZone;

  return (
    <View style={styles.deliveries}>
      {next ? <NextCutoff day={next} now={now} today={today} timeZone={tz} /> : null}
      <Heading level={2}>Coming deliveries</Heading>
      <View style={styles.list} testID="deliveries-list">
        {days.map((d) => (
          <DayRow key={d.date} day={d} now={now} today={today} timeZone={tz} />
        ))}
      </View>
    </View>
  );
}

/** The soonest date still open for orders, large: what a buyer needs at a glance. */
function NextCutoff({ day, now, today, timeZone }: { day: CalendarDayDto; now: number; today: string; timeZone?: string }) {
  const money = useMoney();
  const rel = relativeDay(day.date, today);
  return (
    <View style={styles.hero} testID="next-cutoff">
      <AppText variant="overline" color="crust">
        Next to close
      </AppText>
      <AppText variant="title" color="ink">
        {rel ? `${rel}, ${formatDayLong(day.date)}` : formatDayLong(day.date)}
      </AppText>
      <CutoffCountdown cutoffAt={day.cutoffAt} now={now} timeZone={timeZone} testID="next-cutoff-countdown" />
      <AppText color="ink">
        {day.order ? `Ordered: ${productsLabel(day.order.productCount)}, ${money(day.order.totalCents)}${day.order.source === "standing" ? " (from your standing order)" : ""}.` : "Nothing ordered for this delivery yet."}
      </AppText>
      <LinkButton
        href={`/buyer/order/${day.date}`}
        label={day.order ? "Check or change this order" : "Place an order"}
        icon={day.order ? "edit-2" : "shopping-bag"}
        testID="next-cutoff-open"
        block
      />
    </View>
  );
}

function DayRow({ day, now, today, timeZone }: { day: CalendarDayDto; now: number; today: string; timeZone?: string }) {
  const money = useMoney();
  const status = dayStatus(day, now);
  const open = msUntil(day.cutoffAt, now) > 0 && (day.orderable || day.order?.status === "open");
  const summary = day.order ? `${productsLabel(day.order.productCount)} · ${money(day.order.totalCents)}${day.order.source === "standing" ? " · standing order" : ""}` : null;
  const a11y = [dayHeading(day.date, today), status.label, summary].filter(Boolean).join(", ");
  return (
    <Link href={`/buyer/order/${day.date}`} asChild>
      <LinkPressable accessibilityRole="link" accessibilityLabel={a11y} testID={`day-${day.date}`} style={StyleSheet.flatten([styles.row, !open && !day.order && styles.rowQuiet])} highlightStyle={styles.rowHover}>
        <View style={styles.rowText}>
          <View style={styles.rowTop}>
            <AppText variant="bodyStrong" style={styles.flex}>
              {dayHeading(day.date, today)}
            </AppText>
            <Badge label={status.label} tone={status.tone} testID={`day-${day.date}-status`} />
          </View>
          {summary ? (
            <AppText variant="small" color="ink" testID={`day-${day.date}-summary`}>
              {summary}
            </AppText>
          ) : null}
          {open ? (
            <CutoffCountdown cutoffAt={day.cutoffAt} now={now} timeZone={timeZone} testID={`day-${day.date}-countdown`} />
          ) : !day.order && day.reason === "past_cutoff" ? (
            <AppText variant="small" color="muted">
              No order was placed before the cut-off.
            </AppText>
          ) : null}
        </View>
        <Feather name="chevron-right" size={20} color={colors.muted} />
      </LinkPressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "flex-start" },
  main: { gap: space.lg },
  mainWide: { flex: 3 },
  side: { gap: space.lg },
  sideWide: { flex: 2 },
  deliveries: { gap: space.md },
  hero: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    padding: space.lg,
    gap: space.sm,
    borderWidth: 2,
    borderColor: colors.crust,
  },
  list: { gap: space.sm },
  row: {
    minHeight: layout.minTouch + 20,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    paddingVertical: space.md,
    paddingHorizontal: space.lg,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
  },
  rowQuiet: { backgroundColor: colors.page },
  rowHover: { backgroundColor: colors.rowHover },
  rowText: { flex: 1, gap: space.xs },
  rowTop: { flexDirection: "row", alignItems: "center", gap: space.sm, flexWrap: "wrap" },
  flex: { flexGrow: 1, flexShrink: 1 },
});
