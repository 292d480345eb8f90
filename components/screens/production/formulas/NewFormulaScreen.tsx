import React, { useState } from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../../ui/Screen";
import { PageHeader } from "../../../ui/PageHeader";
import { LinkButton } from "../../../ui/LinkButton";
import { TextLink } from "../../../ui/TextLink";
import { QueryStates } from "../../../ui/QueryStates";
import { useCreateFormulaMutation } from "../../../api/formulas";
import { useIngredientsQuery } from "../../../api/ingredients";
import { emptyFormula, ingredientMap } from "../../../production/formulaForm";
import { kitchenPaths, type KitchenArea } from "../../../production/paths";
import { FormulaEditor } from "./FormulaEditor";

export function NewFormulaScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const ingredients = useIngredientsQuery();
  const create = useCreateFormulaMutation();
  const [initial] = useState(emptyFormula);
  return (
    <Screen testID="formula-new">
      <TextLink href={paths.formulas} label="‹ All formulas" testID="back-to-formulas" />
      <PageHeader title="New formula" subtitle="Start with the flour at 100 %; every other line is a share of it." testID="formula-title" />
      <QueryStates
        query={ingredients}
        loadingLabel="Loading the ingredients…"
        errorTitle="The ingredients didn't load"
        isEmpty={(list) => list.length === 0}
        empty={{
          icon: "package",
          title: "No ingredients yet",
          message: "Add the ingredients first; formulas are written from them.",
          action: <LinkButton href={paths.newIngredient} label="New ingredient" icon="plus" />,
          testID: "formula-no-ingredients",
        }}
      >
        {(list) => (
          <FormulaEditor
            initial={initial}
            ingredients={list}
            infos={ingredientMap(list)}
            submitLabel="Add formula"
            askNote={false}
            onSubmit={async (input) => {
              const f = await create.mutateAsync(input);
              router.replace(paths.createdFormula(f.id));
            }}
          />
        )}
      </QueryStates>
    </Screen>
  );
}
