import React from "react";
import { useLocalSearchParams } from "expo-router";
import { InvoicesScreen } from "@/components/screens/billing/InvoicesScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BuyerInvoicesRoute() {
  const { show } = useLocalSearchParams<{ show?: string }>();
  return (
    <>
      <ScreenTitle title="Invoices" />
      <InvoicesScreen mode="buyer" show={typeof show === "string" ? show : undefined} />
    </>
  );
}
