import React from "react";
import { RequireRole } from "../../../../../components/auth/RoleGate";
import { IngredientsScreen } from "../../../../../components/screens/production/ingredients/IngredientsScreen";

export default function OfficeIngredientsRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <IngredientsScreen area="office" />
    </RequireRole>
  );
}
