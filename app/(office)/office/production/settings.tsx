import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { ProductionSettingsScreen } from "@/components/screens/production/settings/ProductionSettingsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function ProductionSettingsRoute() {
  return (
    <>
      <ScreenTitle title="Production settings" />
      <RequireRole roles={["owner"]}>
        <ProductionSettingsScreen />
      </RequireRole>
    </>
  );
}
