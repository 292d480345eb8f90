import React from "react";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { ErrorState, LoadingState } from "../../ui/States";
import { useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { accountWeekdays, listWeekdays } from "./StandingOrderScreen";
import { useMoney } from "../ordering/parts";

/** "14:00 the day before delivery", "14:00 two days before delivery". */
export function cutoffRule(cutoffTime: string, leadDays: number): string {
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
