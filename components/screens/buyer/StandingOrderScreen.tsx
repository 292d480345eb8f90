import React from "react";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { useSignedInUser } from "../../auth/useAuth";
import { useBakeryQuery } from "../../api/bakery";
import { useCalendarSettingsQuery } from "../../api/calendar";
import { useAccountDeliveryQuery } from "../../api/delivery";
import { useProductsQuery } from "../../api/products";
import { useStandingOrderQuery } from "../../api/standing";
import { accountWeekdays } from "../../ordering/standing";
import { combinedQuery } from "../ordering/combinedQuery";
import { StandingForm } from "./standing/StandingForm";

// Where other screens found these before the standing order's logic had its own module.
export { accountWeekdays, listWeekdays, standingPayload } from "../../ordering/standing";

/** The buyer's standing order: quantities per product per delivery weekday, how often, and the dates it makes. */
export function StandingOrderScreen() {
  const user = useSignedInUser();
  const bakery = useBakeryQuery();
  const standing = useStandingOrderQuery();
  const products = useProductsQuery();
  const settings = useCalendarSettingsQuery();
  const delivery = useAccountDeliveryQuery(user.accountId);

  if (!user.accountId) {
    return (
      <Screen testID="standing-screen">
        <PageHeader title="Standing order" testID="standing-title" />
        <EmptyState icon="link" title="No customer account yet" message="Ask the bakery to link your sign-in to your business's account." />
      </Screen>
    );
  }
  const loaded = combinedQuery(
    [standing, products, settings, delivery, bakery],
    !standing.isPending && products.data && settings.data && delivery.data && bakery.data
      ? { standing: standing.data ?? null, products: products.data, settings: settings.data, delivery: delivery.data, bakery: bakery.data }
      : undefined,
  );
  if (!loaded.data) {
    return (
      <Screen testID="standing-screen">
        <PageHeader title="Standing order" testID="standing-title" />
        <QueryStates query={loaded} loadingLabel="Loading your standing order…" loadingTestID="standing-loading" errorTitle="Your standing order didn't load" errorTestID="standing-error">
          {() => null /* the loaded screen is drawn below, with its own header */}
        </QueryStates>
      </Screen>
    );
  }
  const d = loaded.data;
  return (
    <StandingForm
      standing={d.standing}
      products={d.products}
      weekdays={accountWeekdays(d.settings.deliveryWeekdays, d.delivery.routeWeekdays)}
      today={d.bakery.today}
      horizonDays={d.settings.horizonDays}
    />
  );
}
