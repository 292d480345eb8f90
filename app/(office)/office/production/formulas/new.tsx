import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { NewFormulaScreen } from "@/components/screens/production/formulas/NewFormulaScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeNewFormulaRoute() {
  return (
    <>
      <ScreenTitle title="New formula" />
      <RequireRole roles={["owner"]}>
        <NewFormulaScreen area="office" />
      </RequireRole>
    </>
  );
}
