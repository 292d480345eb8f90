import React, { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { LinkButton } from "../../ui/LinkButton";
import { TextLink } from "../../ui/TextLink";
import { Notice } from "../../ui/FormError";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryQuery } from "../../api/bakery";
import { calendarKeys, useCalendarQuery, useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { useProductsQuery } from "../../api/products";
import { useOrderQuery } from "../../api/orders";
import { useServerNow } from "../../ordering/useServerNow";
import { formatCutoff, formatDayLong, relativeDay } from "../../ordering/dates";
import type { OrderNotice } from "../../ordering/useOrderSubmit";
import { combinedQuery } from "../ordering/combinedQuery";
import { accountStatusNote } from "./BuyerHome";
import { CreditHoldBanner, holdReason, onCreditHold } from "./CreditHoldBanner";
import { CallBakery } from "../common/CallBakery";
import { OrderForm } from "./order/OrderForm";
import { ReadOnlyOrder } from "./order/ReadOnlyOrder";
import { isCalendarDate } from "../../../shared/calendar";

/** One delivery date: place an order, change it, cancel it; read-only once it is locked for baking. */
export function OrderScreen({ date, from = "home" }: { date: string; from?: BackTo }) {
  const user = useSignedInUser();
  const valid = isCalendarDate(date);
  const qc = useQueryClient();
  const bakery = useBakeryQuery();
  const calendar = useCalendarQuery(valid ? { from: date, to: date } : null);
  const products = useProductsQuery();
  const delivery = useAccountDeliveryQuery(user.accountId);
  const settings = useCalendarSettingsQuery();
  const account = useAccountQuery(user.accountId);
  const day = calendar.data?.[0];
  const order = useOrderQuery(day?.order?.id ?? null);
  const [notice, setNotice] = useState<OrderNotice | null>(null);
  const now = useServerNow();

  if (!valid) {
    return (
      <Screen testID="order-screen">
        <BackHome to={from} />
        <EmptyState icon="help-circle" title="That isn't a date" message="Open a delivery date from your home screen." testID="order-bad-date" />
      </Screen>
    );
  }
  const loaded = combinedQuery([calendar, products, order], day && products.data && !(day.order && order.isPending) ? { day, products: products.data } : undefined);
  if (!loaded.data || !day || !products.data) {
    return (
      <Screen testID="order-screen">
        <BackHome to={from} />
        {loaded.isError ? <PageHeader overline="Delivery" title={formatDayLong(date)} testID="order-title" /> : null}
        <QueryStates query={loaded} loadingLabel="Loading the order…" loadingTestID="order-loading" errorTitle="This order didn't load" errorTestID="order-error">
          {() => null /* the loaded screen is drawn below, with its own header */}
        </QueryStates>
      </Screen>
    );
  }

  const existing = order.data && order.data.status !== "cancelled" && day.order ? order.data : null;
  const timeZone = bakery.data?.timeZone ?? settings.data?.timeZone;
  const today = bakery.data?.today;
  const rel = relativeDay(date, today);

  const header = (
    <>
      <BackHome to={from} />
      <PageHeader overline={rel ? `Delivery · ${rel}` : "Delivery"} title={formatDayLong(date)} testID="order-title" />
      {notice ? <Notice message={notice.text} tone={notice.tone} testID="order-notice" /> : null}
      {onCreditHold(account.data) ? (
        <CreditHoldBanner account={account.data!} />
      ) : account.data && accountStatusNote(account.data) ? (
        <Notice tone="info" message={accountStatusNote(account.data) ?? ""} testID="order-account-note" />
      ) : null}
    </>
  );

  if (existing && existing.status !== "open") {
    return (
      <Screen testID="order-screen">
        {header}
        <ReadOnlyOrder order={existing} timeZone={timeZone} />
      </Screen>
    );
  }
  if (!existing && !day.orderable) {
    const closed = day.reason === "past_cutoff";
    return (
      <Screen testID="order-screen">
        {header}
        <EmptyState
          icon={closed ? "lock" : "calendar"}
          title={closed ? "Ordering for this date has closed" : "This date can't be ordered"}
          message={
            closed
              ? `The cut-off was ${formatCutoff(day.cutoffAt, timeZone)}. No order was placed. If something has gone wrong, call the bakery.`
              : `${day.reasonText ?? "The bakery doesn't take orders for this date."}.`
          }
          action={<LinkButton href="/buyer" label="See your delivery dates" icon="calendar" variant="secondary" />}
          testID="order-not-orderable"
        />
        {closed ? <CallBakery /> : null}
      </Screen>
    );
  }

  return (
    <OrderForm
      key={existing ? `order-${existing.id}` : "new"}
      date={date}
      day={day}
      products={products.data}
      existing={existing}
      minimumCents={delivery.data?.minimumOrderCents ?? 0}
      settings={settings.data}
      timeZone={timeZone}
      now={now}
      header={header}
      draftOwner={user.accountId ? { userId: user.id, accountId: user.accountId } : null}
      notice={notice}
      onNotice={setNotice}
      hold={holdReason(account.data)}
      onExists={() => {
        setNotice({ text: "There's already an order for this date (placed on another device or by the bakery). It's shown below: make your changes there.", tone: "info" });
        void qc.invalidateQueries({ queryKey: calendarKeys.all });
      }}
    />
  );
}

type BackTo = "home" | "history" | "standing";
const BACK: Record<BackTo, { href: "/buyer" | "/buyer/orders" | "/buyer/standing"; label: string }> = {
  home: { href: "/buyer", label: "‹ Delivery dates" },
  history: { href: "/buyer/orders", label: "‹ Orders" },
  standing: { href: "/buyer/standing", label: "‹ Standing order" },
};

/** Back where the buyer came from (?from=history or ?from=standing), home otherwise. */
function BackHome({ to }: { to: BackTo }) {
  return <TextLink href={BACK[to].href} label={BACK[to].label} testID="order-back" />;
}
