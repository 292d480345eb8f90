import React from "react";
import { NewIngredientScreen } from "../../../../components/screens/production/ingredients/NewIngredientScreen";

export default function BakerNewIngredientRoute() {
  return <NewIngredientScreen area="baker" />;
}
