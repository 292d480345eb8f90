import React from "react";
import { RequireRole } from "../../../../components/auth/RoleGate";
import { ProductionSettingsScreen } from "../../../../components/screens/production/ProductionOfficeScreens";

export default function ProductionSettingsRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <ProductionSettingsScreen />
    </RequireRole>
  );
}
