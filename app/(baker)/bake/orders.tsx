import React from "react";
import { useLocalSearchParams } from "expo-router";
import { OrdersBoardScreen } from "../../../components/screens/board/OrdersBoardScreen";
import { firstParam } from "../../../components/routing";

export default function BakerOrdersRoute() {
  const { date } = useLocalSearchParams<{ date?: string }>();
  return <OrdersBoardScreen mode="baker" date={firstParam(date)} />;
}
