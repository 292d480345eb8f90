import React from "react";
import { IngredientsScreen } from "@/components/screens/production/ingredients/IngredientsScreen";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerIngredientsRoute() {
  return (
    <>
      <ScreenTitle title="Ingredients" />
      <IngredientsScreen area="baker" />
    </>
  );
}
