import React from "react";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { ErrorState, LoadingState } from "../../ui/States";
import { useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { accountWeekdays, listWeekdays } from "../../ordering/standing";
import { useMoney } from "../ordering/parts";
import { formatTimeOfDay } from "../../../shared/format";
import { currentLocale } from "../../format";

/** "2:00 PM the day before delivery", "2:00 PM, 2 days before delivery" (the stored "14:00" in the bakery's locale). */
export function cutoffRule(stored: string, leadDays: number): string {
  const cutoffTime = formatTimeOfDay(stored, currentLocale());
  if (leadDays === 0) return `${cutoffTime} on the delivery day`;
  if (leadDays === 1) return `${cutoffTime} the day before delivery`;
  return `${cutoffTime}, ${leadDays} days before delivery`;
}

/** The buyer's own delivery terms: which days, when ordering closes, the minimum order. */
export function DeliveryTermsCard({ accountId }: { accountId: number }) {
  const settings = useCalendarSettingsQuery();
  const delivery = useAccountDeliveryQuery(accountId);
  const money = useMoney();
  const failed = settings.isError ? settings : delivery.isError ? delivery : null;
  return (
    <Card title="Deliveries and ordering" testID="delivery-terms">
      {failed ? (
        <ErrorState error={failed.error} onRetry={() => failed.refetch()} retrying={failed.isFetching} testID="delivery-terms-error" />
      ) : !settings.data || !delivery.data ? (
        <LoadingState label="Loading your delivery terms…" />
      ) : (
        <DetailList
          items={[
            { label: "Delivery days", value: listWeekdays(accountWeekdays(settings.data.deliveryWeekdays, delivery.data.routeWeekdays), true) || "None set", testID: "terms-days" },
            { label: "Order by", value: `${cutoffRule(settings.data.cutoffTime, settings.data.leadDays)} (${settings.data.timeZone.replace(/_/g, " ")} time)`, testID: "terms-cutoff" },
            { label: "Minimum order", value: delivery.data.minimumOrderCents > 0 ? money(delivery.data.minimumOrderCents) : "No minimum", testID: "terms-minimum" },
            { label: "Order ahead", value: `Up to ${settings.data.horizonDays} days` },
          ]}
        />
      )}
    </Card>
  );
}
