import React from "react";
import { BillingSettingsScreen } from "@/components/screens/billing/BillingSettingsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BillingSettingsRoute() {
  return (
    <>
      <ScreenTitle title="Billing settings" />
      <BillingSettingsScreen />
    </>
  );
}
