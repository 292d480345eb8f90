import React from "react";
import { useLocalSearchParams } from "expo-router";
import { PayoutDetailScreen } from "../../../../../components/screens/billing/PayoutDetailScreen";
import { firstParam } from "../../../../../components/routing";

export default function PayoutRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const payoutId = firstParam(id) ?? "";
  return <PayoutDetailScreen key={payoutId} id={payoutId} />;
}
