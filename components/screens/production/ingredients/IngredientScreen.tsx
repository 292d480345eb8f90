import React, { useState } from "react";
import { Screen } from "../../../ui/Screen";
import { PageHeader } from "../../../ui/PageHeader";
import { TextLink } from "../../../ui/TextLink";
import { Notice } from "../../../ui/FormError";
import { EmptyState } from "../../../ui/States";
import { QueryStates } from "../../../ui/QueryStates";
import { useIngredientsQuery, useUpdateIngredientMutation } from "../../../api/ingredients";
import { ingredientValues } from "../../../production/ingredientForm";
import { KIND_LABEL } from "../../../production/ingredientKinds";
import { kitchenPaths, type KitchenArea } from "../../../production/paths";
import { IngredientForm } from "./IngredientForm";

/** One ingredient, to edit (the list query holds them all). */
export function IngredientScreen({ area, id }: { area: KitchenArea; id: number }) {
  const paths = kitchenPaths(area);
  const ingredients = useIngredientsQuery();
  const update = useUpdateIngredientMutation(id);
  const [saved, setSaved] = useState<string | null>(null);
  return (
    <Screen narrow testID="ingredient-detail">
      <TextLink href={paths.ingredients} label="‹ All ingredients" testID="back-to-ingredients" />
      <QueryStates query={ingredients} loadingLabel="Loading the ingredient…" errorTitle="The ingredient didn't load">
        {(list) => {
          const found = list.find((i) => i.id === id);
          if (!found) return <EmptyState icon="help-circle" title="There's no such ingredient" testID="ingredient-not-found" />;
          return (
            <>
              <PageHeader overline={KIND_LABEL[found.kind]} title={found.name} testID="ingredient-title" />
              {saved ? <Notice message={saved} testID="ingredient-saved" /> : null}
              <IngredientForm
                key={found.id}
                initial={ingredientValues(found)}
                submitLabel="Save changes"
                onSubmit={async (input) => {
                  setSaved(null);
                  const i = await update.mutateAsync(input);
                  setSaved(`${i.name} is saved. Formulas and plans use it now.`);
                }}
              />
            </>
          );
        }}
      </QueryStates>
    </Screen>
  );
}
