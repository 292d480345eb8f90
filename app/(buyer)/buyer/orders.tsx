import React from "react";
import { OrderHistoryScreen } from "@/components/screens/buyer/OrderHistoryScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OrderHistoryRoute() {
  return (
    <>
      <ScreenTitle title="Orders" />
      <OrderHistoryScreen />
    </>
  );
}
