import React from "react";
import { BillingHubScreen } from "@/components/screens/billing/BillingHubScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function MoneyRoute() {
  return (
    <>
      <ScreenTitle title="Money" />
      <BillingHubScreen />
    </>
  );
}
