import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { PriceListFormScreen } from "@/components/screens/pricing/PriceListFormScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function NewPriceListRoute() {
  return (
    <>
      <ScreenTitle title="New price list" />
      <RequireRole roles={["owner"]}>
        <PriceListFormScreen />
      </RequireRole>
    </>
  );
}
