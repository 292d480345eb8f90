import React from "react";
import { useLocalSearchParams } from "expo-router";
import { InvoiceDetailScreen } from "@/components/screens/billing/InvoiceDetailScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeInvoiceRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <ScreenTitle title="Invoice" />
      <InvoiceDetailScreen key={String(id)} id={idParam(id)} mode="office" />
    </>
  );
}
