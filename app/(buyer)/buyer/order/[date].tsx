import React from "react";
import { useLocalSearchParams } from "expo-router";
import { OrderScreen } from "../../../../components/screens/buyer/OrderScreen";
import { firstParam } from "../../../../components/routing";

export default function OrderRoute() {
  const { date } = useLocalSearchParams<{ date: string }>();
  const d = firstParam(date) ?? "";
  return <OrderScreen key={d} date={d} />;
}
