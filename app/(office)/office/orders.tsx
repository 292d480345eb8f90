import React from "react";
import { useLocalSearchParams } from "expo-router";
import { OrdersBoardScreen } from "@/components/screens/board/OrdersBoardScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeOrdersRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <ScreenTitle title="Orders" />
      <OrdersBoardScreen mode="office" date={firstParam(date)} />
    </>
  );
}
