import React from "react";
import { RequireRole } from "../../../../../components/auth/RoleGate";
import { NewIngredientScreen } from "../../../../../components/screens/production/ingredients/NewIngredientScreen";

export default function OfficeNewIngredientRoute() {
  return (
    <RequireRole roles={["owner"]}>
      <NewIngredientScreen area="office" />
    </RequireRole>
  );
}
