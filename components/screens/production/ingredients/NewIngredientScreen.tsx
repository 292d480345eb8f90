import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../../ui/Screen";
import { PageHeader } from "../../../ui/PageHeader";
import { TextLink } from "../../../ui/TextLink";
import { useCreateIngredientMutation } from "../../../api/ingredients";
import { EMPTY_INGREDIENT } from "../../../production/ingredientForm";
import { kitchenPaths, type KitchenArea } from "../../../production/paths";
import { IngredientForm } from "./IngredientForm";

export function NewIngredientScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const create = useCreateIngredientMutation();
  return (
    <Screen narrow testID="ingredient-new">
      <TextLink href={paths.ingredients} label="‹ All ingredients" testID="back-to-ingredients" />
      <PageHeader title="New ingredient" testID="ingredient-title" />
      <IngredientForm
        initial={EMPTY_INGREDIENT}
        submitLabel="Add ingredient"
        onSubmit={async (input) => {
          await create.mutateAsync(input);
          router.replace(paths.ingredients);
        }}
      />
    </Screen>
  );
}
