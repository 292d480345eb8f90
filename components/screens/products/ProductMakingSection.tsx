import React from "react";
import { View } from "react-native";
import type { UseQueryResult } from "@tanstack/react-query";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { InlinePicker } from "../../ui/InlinePicker";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { ALLERGEN_LABEL } from "../../../shared/allergens";
import { celsiusToFahrenheit } from "../../../shared/units";
import type { FormulaDto, IngredientDto } from "../../../shared/schemas/production";
import { ComponentRows } from "./ComponentRows";
import type { Making, formulaDefaults } from "./productForm";
import type { ProductFormState } from "./useProductForm";
import { NumberField } from "./NumberField";
import { formStyles as styles } from "./formStyles";

export interface ProductMakingSectionProps {
  form: ProductFormState;
  formulas: UseQueryResult<FormulaDto[]>;
  ingredients: UseQueryResult<IngredientDto[]>;
  defaults: ReturnType<typeof formulaDefaults>;
}

const containsHint = (allergens: readonly (keyof typeof ALLERGEN_LABEL)[]) => (allergens.length ? `Contains ${allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}` : undefined);

/** How it's made: from a formula (with its bake and components) or bought in. */
export function ProductMakingSection({ form, formulas, ingredients, defaults }: ProductMakingSectionProps) {
  const { values, errors } = form;
  const celsius = Number(values.bakeTempC);
  return (
    <>
      <AppText variant="overline" color="muted">
        How it's made
      </AppText>
      <ChoiceGroup<Making>
        label="Production"
        layout="list"
        value={values.making}
        onChange={form.set("making")}
        choices={[
          { value: "formula", label: "Baked here from a formula", hint: "Its dough is planned, mixed and baked on the bake day." },
          { value: "bought_in", label: "Bought in / not planned", hint: "Sold as it comes: no dough, components or bake are planned." },
        ]}
        error={values.making === null ? errors.formulaId ?? errors.boughtIn : errors.boughtIn}
        testID="product-making"
      />
      {values.making === "formula" ? (
        <>
          {formulas.isError ? (
            <FormError message={`The formulas didn't load: ${messageOf(formulas.error)}`} testID="product-formulas-error" />
          ) : (
            <InlinePicker<number>
              label="Formula"
              value={values.formulaId}
              options={(formulas.data ?? []).map((f) => ({ value: f.id, label: f.name, hint: containsHint(f.allergens) }))}
              onChange={form.set("formulaId")}
              placeholder={formulas.isPending ? "Loading the formulas…" : "Choose the formula"}
              error={errors.formulaId}
              testID="product-formula"
            />
          )}
          <View style={styles.grid}>
            <NumberField form={form} name="bakeTempC" label="Bake temperature (°C)" optional hint={values.bakeTempC.trim() && Number.isFinite(celsius) ? `= ${Math.round(celsiusToFahrenheit(celsius))} °F` : defaults.temp} />
            <NumberField form={form} name="bakeMinutes" label="Bake time (min)" optional hint={defaults.bake} />
            <NumberField form={form} name="coolMinutes" label="Cooling time (min)" optional hint={defaults.cool} />
          </View>

          <AppText variant="overline" color="muted">
            Components
          </AppText>
          <AppText variant="small" color="muted">
            Toppings, washes, fillings and garnishes, in grams per piece or per pan. They go on the bake day's weigh-out, the ingredient totals and the purchasing forecast, and their allergens are declared with the dough's.
          </AppText>
          {ingredients.isError ? <FormError message={`The ingredients didn't load: ${messageOf(ingredients.error)}`} testID="product-ingredients-error" /> : null}
          <ComponentRows rows={values.components} onChange={form.set("components")} ingredients={ingredients.data ?? []} loading={ingredients.isPending} fields={errors} />
        </>
      ) : null}
    </>
  );
}
