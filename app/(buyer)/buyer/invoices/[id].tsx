import React from "react";
import { useLocalSearchParams } from "expo-router";
import { InvoiceDetailScreen } from "../../../../components/screens/billing/InvoiceDetailScreen";
import { idParam } from "../../../../components/routing";

export default function BuyerInvoiceRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <InvoiceDetailScreen key={String(id)} id={idParam(id)} mode="buyer" />;
}
