import React from "react";
import { useLocalSearchParams } from "expo-router";
import { PayReturnScreen } from "@/components/screens/billing/PayReturnScreen";
import { firstParam, idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

/** Where the card processor's hosted page sends the payer back: ?invoice=<id>&session_id=… or &cancelled=1. */
export default function PayReturnRoute() {
  const { invoice, cancelled } = useLocalSearchParams<{ invoice?: string; cancelled?: string; session_id?: string }>();
  return (
    <>
      <ScreenTitle title="Payment" />
      <PayReturnScreen invoiceId={idParam(invoice)} cancelled={firstParam(cancelled) === "1"} />
    </>
  );
}
