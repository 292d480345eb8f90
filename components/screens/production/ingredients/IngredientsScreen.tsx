import React from "react";
import { useRouter } from "expo-router";
import { AppText } from "../../../ui/Text";
import { useIngredientsQuery } from "../../../api/ingredients";
import { useMoney } from "../../ordering/parts";
import { kitchenPaths, type KitchenArea } from "../../../production/paths";
import { formatPercent } from "../../../production/units";
import { KIND_LABEL } from "../../../production/ingredientKinds";
import { ALLERGEN_LABEL } from "../../../../shared/allergens";
import type { IngredientDto } from "../../../../shared/schemas/production";
import { formatMass } from "../../../../shared/units";
import { LibraryScreen } from "../LibraryScreen";
import { CardBody, TableOrCards } from "../../../ui/TableOrCards";

const packText = (i: IngredientDto, money: (c: number) => string) =>
  i.packGrams > 0 ? `${i.packName} (${formatMass(i.packGrams, "metric")}) · ${money(i.packCostCents)}` : `${i.packName} · not bought`;

const allergenText = (i: IngredientDto) => i.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ");

/** Every ingredient: kind, water, allergens and the pack it is bought in. */
export function IngredientsScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const money = useMoney();
  const ingredients = useIngredientsQuery();
  return (
    <LibraryScreen
      paths={paths}
      name="ingredients"
      title="Ingredients"
      subtitle="Kinds and water content drive hydration; allergens flow to products; packs size the purchasing forecast."
      other={{ href: paths.formulas, label: "Formulas", icon: "book-open", testID: "open-formulas" }}
      add={{ href: paths.newIngredient, label: "New ingredient", testID: "new-ingredient" }}
      query={ingredients}
      loadingLabel="Loading ingredients…"
      errorTitle="Ingredients didn't load"
      empty={{ icon: "package", title: "No ingredients yet", message: "Add flour, milk, butter and the rest; formulas are written from them." }}
    >
      {(list) => (
        <TableOrCards
          rows={list}
          rowKey={(i) => i.id}
          onOpen={(i) => router.push(paths.ingredient(i.id))}
          rowLabel={(i) => `${i.name}, ${KIND_LABEL[i.kind]}`}
          rowTestID={(i) => `ingredient-row-${i.id}`}
          tableTestID="ingredients-table"
          columns={[
            { key: "name", label: "Ingredient", flex: 1.6, render: (i) => <AppText variant="bodyStrong">{i.name}</AppText> },
            { key: "kind", label: "Kind", render: (i) => <AppText>{KIND_LABEL[i.kind]}</AppText> },
            { key: "water", label: "Water", flex: 0.7, render: (i) => <AppText>{formatPercent(i.waterPercent)}</AppText> },
            { key: "allergens", label: "Allergens", flex: 1.4, render: (i) => <AppText variant="small">{allergenText(i) || "None"}</AppText> },
            { key: "pack", label: "Purchase pack", flex: 2, render: (i) => <AppText variant="small">{packText(i, money)}</AppText> },
          ]}
          cardsTestID="ingredients-list"
          card={(i) => (
            <CardBody>
              <AppText variant="bodyStrong">{i.name}</AppText>
              <AppText variant="small" color="muted">{`${KIND_LABEL[i.kind]} · water ${formatPercent(i.waterPercent)}${i.allergens.length ? ` · ${allergenText(i)}` : ""}`}</AppText>
              <AppText variant="small">{packText(i, money)}</AppText>
            </CardBody>
          )}
        />
      )}
    </LibraryScreen>
  );
}
