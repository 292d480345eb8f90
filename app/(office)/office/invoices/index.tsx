import React from "react";
import { useLocalSearchParams } from "expo-router";
import { InvoicesScreen } from "@/components/screens/billing/InvoicesScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeInvoicesRoute() {
  const { accountId, show } = useLocalSearchParams<{ accountId?: string; show?: string }>();
  const id = idParam(accountId);
  return (
    <>
      <ScreenTitle title="Invoices" />
      <InvoicesScreen key={`${accountId ?? ""}-${show ?? ""}`} mode="office" accountId={Number.isNaN(id) ? undefined : id} show={typeof show === "string" ? show : undefined} />
    </>
  );
}
