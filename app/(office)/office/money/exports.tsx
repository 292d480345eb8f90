import React from "react";
import { ExportsScreen } from "@/components/screens/billing/ExportsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function ExportsRoute() {
  return (
    <>
      <ScreenTitle title="Exports" />
      <ExportsScreen />
    </>
  );
}
