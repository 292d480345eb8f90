import React from "react";
import { InvoicesScreen } from "@/components/screens/billing/InvoicesScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BuyerInvoicesRoute() {
  return (
    <>
      <ScreenTitle title="Invoices" />
      <InvoicesScreen mode="buyer" />
    </>
  );
}
