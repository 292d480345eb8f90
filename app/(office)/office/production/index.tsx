import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { ProductionHubScreen } from "../../../../components/screens/production/ProductionHubScreen";

export default function ProductionHubRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <ProductionHubScreen />
    </RequireRole>
  );
}
