import React from "react";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { QueryStates } from "../../ui/QueryStates";
import { useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { accountWeekdays, listWeekdays } from "../../ordering/standing";
import { useMoney } from "../../ordering/useMoney";
import { combinedQuery } from "../ordering/combinedQuery";
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
  const loaded = combinedQuery([settings, delivery], settings.data && delivery.data ? { settings: settings.data, delivery: delivery.data } : undefined);
  return (
    <Card title="Deliveries and ordering" testID="delivery-terms">
      <QueryStates query={loaded} loadingLabel="Loading your delivery terms…" errorTestID="delivery-terms-error">
        {(d) => (
          <DetailList
            items={[
              { label: "Delivery days", value: listWeekdays(accountWeekdays(d.settings.deliveryWeekdays, d.delivery.routeWeekdays), true) || "None set", testID: "terms-days" },
              { label: "Order by", value: `${cutoffRule(d.settings.cutoffTime, d.settings.leadDays)} (${d.settings.timeZone.replace(/_/g, " ")} time)`, testID: "terms-cutoff" },
              { label: "Minimum order", value: d.delivery.minimumOrderCents > 0 ? money(d.delivery.minimumOrderCents) : "No minimum", testID: "terms-minimum" },
              { label: "Order ahead", value: `Up to ${d.settings.horizonDays} days` },
            ]}
          />
        )}
      </QueryStates>
    </Card>
  );
}
