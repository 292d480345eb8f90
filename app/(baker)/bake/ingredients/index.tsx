import React from "react";
import { IngredientsScreen } from "../../../../components/screens/production/ingredients/IngredientsScreen";

export default function BakerIngredientsRoute() {
  return <IngredientsScreen area="baker" />;
}
