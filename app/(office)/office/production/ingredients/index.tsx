import React from "react";
import { RequireRole } from "@/components/auth/RoleGate";
import { IngredientsScreen } from "@/components/screens/production/ingredients/IngredientsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeIngredientsRoute() {
  return (
    <>
      <ScreenTitle title="Ingredients" />
      <RequireRole roles={["owner"]}>
        <IngredientsScreen area="office" />
      </RequireRole>
    </>
  );
}
