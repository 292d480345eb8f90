import React from "react";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { FormError } from "../../ui/FormError";
import type { ProductInput } from "../../../shared/schemas/catalog";
import type { ProductValues } from "./productForm";
import { useProductForm } from "./useProductForm";
import { ProductSoldSection } from "./ProductSoldSection";
import { ProductMakingSection } from "./ProductMakingSection";
import { ProductAllergensSection } from "./ProductAllergensSection";

export { EMPTY_PRODUCT, checkProduct, previewAllergens, valuesOf, type Making, type ProductValues } from "./productForm";

export interface ProductFormProps {
  initial: ProductValues;
  submitLabel: string;
  /** Whether the product is on offer (a new one is). */
  active?: boolean;
  /** Sends the checked input; a rejection shows its errors on the form. */
  onSubmit: (input: ProductInput) => Promise<unknown>;
}

/** The product form (owner): name, how it's sold, its pan, how it's made, allergens. */
export function ProductForm({ initial, submitLabel, active = true, onSubmit }: ProductFormProps) {
  const { form, formulas, ingredients, declared, defaults, submit } = useProductForm({ initial, active, onSubmit });
  return (
    <Card testID="product-form">
      <FormError message={form.formError} testID="product-form-error" />
      <TextField label="Name" {...form.text("name")} testID="product-name" autoCapitalize="sentences" />
      <TextField label="Description" optional {...form.text("description")} multiline testID="product-description" />
      <ProductSoldSection form={form} />
      <ProductMakingSection form={form} formulas={formulas} ingredients={ingredients} defaults={defaults} />
      <ProductAllergensSection form={form} declared={declared} />
      <Button label={submitLabel} icon="check" onPress={submit} busy={form.submitting} testID="product-save" />
    </Card>
  );
}
