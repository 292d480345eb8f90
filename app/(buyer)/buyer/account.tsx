import React from "react";
import { BuyerAccountScreen } from "@/components/screens/buyer/BuyerAccountScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BuyerAccountRoute() {
  return (
    <>
      <ScreenTitle title="Account" />
      <BuyerAccountScreen />
    </>
  );
}
