import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { ProductionHubScreen } from "@/components/screens/production/ProductionHubScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function ProductionHubRoute() {
  return (
    <>
      <ScreenTitle title="Production" />
      <RequireRole roles={["owner"]}>
        <ProductionHubScreen />
      </RequireRole>
    </>
  );
}
