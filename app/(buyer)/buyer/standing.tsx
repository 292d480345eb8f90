import React from "react";
import { StandingOrderScreen } from "@/components/screens/buyer/StandingOrderScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function StandingOrderRoute() {
  return (
    <>
      <ScreenTitle title="Standing order" />
      <StandingOrderScreen />
    </>
  );
}
