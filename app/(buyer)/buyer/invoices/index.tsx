import React from "react";
import { InvoicesScreen } from "../../../../components/screens/billing/InvoicesScreen";

export default function BuyerInvoicesRoute() {
  return <InvoicesScreen mode="buyer" />;
}
