import React from "react";
import { PayoutsScreen } from "@/components/screens/billing/PayoutsScreens";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PayoutsRoute() {
  return (
    <>
      <ScreenTitle title="Payouts" />
      <PayoutsScreen />
    </>
  );
}
