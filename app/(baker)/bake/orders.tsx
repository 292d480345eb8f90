import React from "react";
import { useLocalSearchParams } from "expo-router";
import { OrdersBoardScreen } from "@/components/screens/board/OrdersBoardScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerOrdersRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return (
    <>
      <ScreenTitle title="Orders" />
      <OrdersBoardScreen mode="baker" date={firstParam(date)} />
    </>
  );
}
