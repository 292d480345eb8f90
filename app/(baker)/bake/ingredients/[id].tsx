import React from "react";
import { useLocalSearchParams } from "expo-router";
import { IngredientScreen } from "@/components/screens/production/ingredients/IngredientScreen";
import { idParam } from "@/components/routing";
import { ScreenTitle } from "@/components/ui/ScreenTitle";

export default function BakerIngredientRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <ScreenTitle title="Ingredient" />
      <IngredientScreen key={String(id)} area="baker" id={idParam(id)} />
    </>
  );
}
