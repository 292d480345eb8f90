import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { NewIngredientScreen } from "@/components/screens/production/ingredients/NewIngredientScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeNewIngredientRoute() {
  return (
    <>
      <ScreenTitle title="New ingredient" />
      <RequireRole roles={["owner"]}>
        <NewIngredientScreen area="office" />
      </RequireRole>
    </>
  );
}
