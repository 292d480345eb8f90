import React from "react";
import { PayoutsScreen } from "@/components/screens/billing/PayoutsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PayoutsRoute() {
  return (
    <>
      <ScreenTitle title="Payouts" />
      <PayoutsScreen />
    </>
  );
}
