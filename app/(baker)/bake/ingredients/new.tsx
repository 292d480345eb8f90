import React from "react";
import { NewIngredientScreen } from "@/components/screens/production/ingredients/NewIngredientScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerNewIngredientRoute() {
  return (
    <>
      <ScreenTitle title="New ingredient" />
      <NewIngredientScreen area="baker" />
    </>
  );
}
