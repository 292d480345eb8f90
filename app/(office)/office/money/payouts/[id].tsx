import React from "react";
import { useLocalSearchParams } from "expo-router";
import { PayoutDetailScreen } from "@/components/screens/billing/PayoutDetailScreen";
import { firstParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function PayoutRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const payoutId = firstParam(id) ?? "";
  return (
    <>
      <ScreenTitle title="Payout" />
      <PayoutDetailScreen key={payoutId} id={payoutId} />
    </>
  );
}
