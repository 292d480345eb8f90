import React from "react";
import { AgingScreen } from "@/components/screens/billing/AgingScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function AgingRoute() {
  return (
    <>
      <ScreenTitle title="Aging" />
      <AgingScreen />
    </>
  );
}
