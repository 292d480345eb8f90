import { useFormulasQuery } from "../../api/formulas";
import { useIngredientsQuery } from "../../api/ingredients";
import { useZodForm, type ZodForm } from "../../forms/useZodForm";
import { checkedSchema } from "../../forms/checkedSchema";
import type { ProductInput } from "../../../shared/schemas/catalog";
import { PRODUCT_FIELDS, checkProduct, chosenFormula, formulaDefaults, previewAllergens, type ProductValues } from "./productForm";

export type ProductFormState = ZodForm<ProductValues, ProductInput>;

export interface UseProductFormOptions {
  initial: ProductValues;
  /** Whether the product is on offer (a new one is). */
  active: boolean;
  /** Sends the checked input; a rejection shows its errors on the form. */
  onSubmit: (input: ProductInput) => Promise<unknown>;
}

/**
 * The product form: its values in useZodForm, checked by checkProduct (the shared productInputSchema and the
 * form's own rules), with the formulas and ingredients it needs for the declaration and the bake hints.
 */
export function useProductForm({ initial, active, onSubmit }: UseProductFormOptions) {
  const formulas = useFormulasQuery();
  const ingredients = useIngredientsQuery();
  const formulaList = formulas.data ?? [];
  const ingredientList = ingredients.data ?? [];
  // The declaration sent is the derived allergens (formula and components) plus the product's own.
  const schema = checkedSchema((v: ProductValues) => checkProduct(v, "USD", { derived: previewAllergens(v, formulaList, ingredientList).derived, active }));
  const form: ProductFormState = useZodForm({ schema, initial, fields: PRODUCT_FIELDS });
  const formula = chosenFormula(form.values, formulaList);
  return {
    form,
    formulas,
    ingredients,
    declared: previewAllergens(form.values, formulaList, ingredientList),
    defaults: formulaDefaults(formula),
    submit: () => void form.submit(onSubmit),
  };
}
