import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { PriceListFormScreen } from "../../../../components/screens/pricing/PriceListFormScreen";

export default function NewPriceListRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <PriceListFormScreen />
    </RequireRole>
  );
}
