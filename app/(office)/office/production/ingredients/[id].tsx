import React from "react";
import { useLocalSearchParams } from "expo-router";
import { RequireRole } from "@/components/auth/RoleGate";
import { IngredientScreen } from "@/components/screens/production/ingredients/IngredientScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function OfficeIngredientRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <ScreenTitle title="Ingredient" />
      <RequireRole roles={["owner"]}>
        <IngredientScreen key={String(id)} area="office" id={idParam(id)} />
      </RequireRole>
    </>
  );
}
