import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { Notice } from "../../ui/FormError";
import { Badge } from "../../ui/Badge";
import { LinkButton } from "../../ui/LinkButton";
import { AppText, Heading } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryQuery } from "../../api/bakery";
import { useCalendarQuery } from "../../api/calendar";
import { BakeryContactCard } from "../common/BakeryContactCard";
import { CutoffCountdown } from "../ordering/CutoffCountdown";
import { dayStatus } from "../../ordering/dayStatus";
import { useMoney } from "../../ordering/useMoney";
import { combinedQuery } from "../ordering/combinedQuery";
import { ListCard, ListCardText, ListCardTitle, ListCardTop } from "../../ui/ListCard";
import { useServerNow } from "../../ordering/useServerNow";
import { msUntil } from "../../ordering/countdown";
import { addDays, dayHeading, formatDayLong, relativeDay } from "../../ordering/dates";
import { firstName, formatBakeDay } from "../../format";
import { useTwoColumns } from "../../shell/useIsWide";
import type { AccountDto } from "../../../shared/schemas/accounts";
import type { CalendarDayDto } from "../../../shared/schemas/calendar";
import { productsLabel } from "../../ordering/quantities";
import { colors, radii, space } from "../../theme";
import { CreditHoldBanner, onCreditHold } from "./CreditHoldBanner";

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
  const account = useAccountQuery(user.accountId);

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

  return (
    <Screen testID="buyer-home">
      {account.isError ? <PageHeader overline="Wholesale ordering" title={`Hello, ${firstName(user.name)}`} /> : null}
      <QueryStates query={account} loadingLabel="Loading your account…" errorTitle="Your account didn't load">
        {(a) => <Home account={a} />}
      </QueryStates>
    </Screen>
  );
}

function Home({ account: a }: { account: AccountDto }) {
  const user = useSignedInUser();
  // Two columns from a tablet (768 px) up: the deliveries, and beside them the standing order and the bakery.
  const wide = useTwoColumns();
  const bakery = useBakeryQuery();
  const note = accountStatusNote(a);
  const subtitle = bakery.data ? `Ordering from ${bakery.data.name} · ${formatBakeDay(bakery.data.today, bakery.data.now, bakery.data.timeZone)}` : `Welcome back, ${firstName(user.name)}`;

  return (
    <>
      <PageHeader overline="Wholesale ordering" title={a.businessName} subtitle={subtitle} testID="buyer-home-title" />
      {onCreditHold(a) ? <CreditHoldBanner account={a} /> : note ? <Notice tone="info" message={note} testID="buyer-status-note" /> : null}
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
    </>
  );
}

function Deliveries() {
  const bakery = useBakeryQuery();
  const today = bakery.data?.today;
  const calendar = useCalendarQuery(today ? { from: today, to: addDays(today, HOME_DAYS - 1) } : null);
  const now = useServerNow();

  const loaded = combinedQuery([bakery, calendar], today && calendar.data ? { today, days: homeDays(calendar.data) } : undefined);
  return (
    <QueryStates
      query={loaded}
      loadingLabel="Loading your delivery dates…"
      errorTitle="The delivery dates didn't load"
      testID="deliveries"
      isEmpty={(d) => d.days.length === 0}
      empty={{ icon: "calendar", title: "No deliveries in the next two weeks", message: "The bakery has no delivery days for you in this time. Call them if that looks wrong." }}
    >
      {(d) => <DeliveryList days={d.days} today={d.today} now={now} timeZone={bakery.data?.timeZone} />}
    </QueryStates>
  );
}

function DeliveryList({ days, today, now, timeZone: tz }: { days: CalendarDayDto[]; today: string; now: number; timeZone?: string }) {
  const next = days.find((d) => msUntil(d.cutoffAt, now) > 0 && (d.orderable || d.order?.status === "open"));
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
    <ListCard href={`/buyer/order/${day.date}`} accessibilityLabel={a11y} testID={`day-${day.date}`} quiet={!open && !day.order}>
      <ListCardText>
        <ListCardTop>
          <ListCardTitle>{dayHeading(day.date, today)}</ListCardTitle>
          <Badge label={status.label} tone={status.tone} testID={`day-${day.date}-status`} />
        </ListCardTop>
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
      </ListCardText>
    </ListCard>
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
});
