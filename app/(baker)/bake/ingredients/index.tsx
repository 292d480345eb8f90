import React from "react";
import { IngredientsScreen } from "../../../../components/screens/production/IngredientScreens";

export default function BakerIngredientsRoute() {
  return <IngredientsScreen area="baker" />;
}
