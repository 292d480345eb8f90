import React from "react";
import { useLocalSearchParams } from "expo-router";
import { OrderScreen } from "@/components/screens/buyer/OrderScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OrderRoute() {
  const { date, from } = useLocalSearchParams<{ date: string; from?: string }>();
  const d = firstParam(date) ?? "";
  return (
    <>
      <ScreenTitle title="Order" />
      <OrderScreen key={d} date={d} from={firstParam(from) === "history" ? "history" : from === "standing" ? "standing" : "home"} />
    </>
  );
}
