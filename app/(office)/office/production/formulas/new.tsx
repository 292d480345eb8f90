import React from "react";
import { RequireRole } from "../../../../../components/auth/RoleGate";
import { NewFormulaScreen } from "../../../../../components/screens/production/formulas/NewFormulaScreen";

export default function OfficeNewFormulaRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <NewFormulaScreen area="office" />
    </RequireRole>
  );
}
