import React from "react";
import { NewIngredientScreen } from "../../../../components/screens/production/IngredientScreens";

export default function BakerNewIngredientRoute() {
  return <NewIngredientScreen area="baker" />;
}
