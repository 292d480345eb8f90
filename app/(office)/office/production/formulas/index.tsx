import React from "react";
import { RequireRole } from "../../../../../components/auth/RoleGate";
import { FormulasScreen } from "../../../../../components/screens/production/formulas/FormulasScreen";

export default function OfficeFormulasRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <FormulasScreen area="office" />
    </RequireRole>
  );
}
