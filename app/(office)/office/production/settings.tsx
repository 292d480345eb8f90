import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { ProductionSettingsScreen } from "../../../../components/screens/production/settings/ProductionSettingsScreen";

export default function ProductionSettingsRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <ProductionSettingsScreen />
    </RequireRole>
  );
}
