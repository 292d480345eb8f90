import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { formulaKeys, ingredientKeys, productKeys, productionKeys } from "./keys";
import type { IngredientDto, IngredientInput } from "../../shared/schemas/production";

export { ingredientKeys } from "./keys";

export const ingredientsApi = {
  list: () => api<{ ingredients: IngredientDto[] }>("/api/ingredients").then((r) => r.ingredients),
  create: (input: IngredientInput) => api<{ ingredient: IngredientDto }>("/api/ingredients", { method: "POST", body: input }).then((r) => r.ingredient),
  update: (id: number, input: IngredientInput) => api<{ ingredient: IngredientDto }>(`/api/ingredients/${id}`, { method: "PUT", body: input }).then((r) => r.ingredient),
};

/** The ingredient library (there is no single-ingredient GET: screens pick one out of the list). */
export function useIngredientsQuery() {
  return useQuery({ queryKey: ingredientKeys.list(), queryFn: ingredientsApi.list });
}

function useIngredientSaved() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: ingredientKeys.all });
    // Names, water content, allergens and packs show in formulas, plans and the forecast.
    void qc.invalidateQueries({ queryKey: formulaKeys.all });
    void qc.invalidateQueries({ queryKey: productionKeys.all });
    // Products declare their formula's and components' ingredients' allergens.
    void qc.invalidateQueries({ queryKey: productKeys.all });
  };
}

export function useCreateIngredientMutation() {
  const saved = useIngredientSaved();
  return useMutation({ mutationFn: ingredientsApi.create, onSuccess: saved });
}

export function useUpdateIngredientMutation(id: number) {
  const saved = useIngredientSaved();
  return useMutation({ mutationFn: (input: IngredientInput) => ingredientsApi.update(id, input), onSuccess: saved });
}
