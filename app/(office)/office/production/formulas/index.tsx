import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { FormulasScreen } from "@/components/screens/production/formulas/FormulasScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeFormulasRoute() {
  return (
    <>
      <ScreenTitle title="Formulas" />
      <RequireRole roles={["owner"]}>
        <FormulasScreen area="office" />
      </RequireRole>
    </>
  );
}
