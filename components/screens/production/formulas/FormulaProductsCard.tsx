import React from "react";
import { z } from "zod";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { MultiChoice } from "../../../ui/MultiChoice";
import { FormError, Notice } from "../../../ui/FormError";
import { QueryStates } from "../../../ui/QueryStates";
import { AppText } from "../../../ui/Text";
import { useSignedInUser } from "../../../auth/useAuth";
import { useLinkProductsMutation } from "../../../api/formulas";
import { useProductsQuery } from "../../../api/products";
import { useZodForm } from "../../../forms/useZodForm";
import type { FormulaDto } from "../../../../shared/schemas/production";
import type { ProductDto } from "../../../../shared/schemas/catalog";
import { productNames } from "./formulaText";

/** Which products to move onto this formula and off it. */
const linkSchema = z.object({ link: z.array(z.number().int().positive()), unlink: z.array(z.number().int().positive()) });

/** Which products are made from this dough; the owner links products to it. */
export function FormulaProductsCard({ formula }: { formula: FormulaDto }) {
  const isOwner = useSignedInUser().role === "owner";
  const products = useProductsQuery();
  return (
    <Card title="Products" testID="formula-products-card">
      <QueryStates query={products} loadingLabel="Loading products…" loadingTestID="formula-products-loading" errorTitle="Products didn't load">
        {(list) =>
          isOwner ? (
            <LinkProducts formula={formula} products={list} />
          ) : (
            <>
              <AppText testID="formula-products-list">{productNames(formula.productIds, list)}</AppText>
              <AppText variant="small" color="muted">
                The owner links products to formulas.
              </AppText>
            </>
          )
        }
      </QueryStates>
    </Card>
  );
}

function LinkProducts({ formula, products }: { formula: FormulaDto; products: ProductDto[] }) {
  const link = useLinkProductsMutation(formula.id);
  // Null until the owner changes the choice: until then it follows the formula as loaded.
  const form = useZodForm({
    schema: linkSchema,
    initial: { chosen: null as number[] | null },
    toInput: ({ chosen }) => ({ link: (chosen ?? []).filter((id) => !formula.productIds.includes(id)), unlink: formula.productIds.filter((id) => !(chosen ?? formula.productIds).includes(id)) }),
  });
  const selected = form.values.chosen ?? formula.productIds;
  const others = new Map(products.filter((p) => p.formulaId !== null && p.formulaId !== formula.id).map((p) => [p.id, p]));
  const moving = selected.filter((id) => others.has(id));
  const save = () =>
    void form.submit(async (body) => {
      await link.mutateAsync(body);
      form.setValue("chosen", null);
    });
  return (
    <>
      <MultiChoice<number>
        label="Made from this dough"
        hint="A product has one formula: choosing one here moves it from its current formula."
        options={products.map((p) => ({ value: p.id, label: p.name }))}
        value={selected}
        onChange={form.set("chosen")}
        testID="formula-products"
      />
      {moving.length ? <AppText variant="small" color="muted">{`Moves from another formula: ${moving.map((id) => others.get(id)!.name).join(", ")}.`}</AppText> : null}
      <FormError message={form.formError} testID="formula-products-error" />
      {form.saved ? <Notice message="Products linked. Their dough is planned from this formula." testID="formula-products-saved" /> : null}
      <Button label="Save products" icon="link" variant="secondary" busy={form.submitting} disabled={form.values.chosen === null} onPress={save} testID="formula-products-save" />
    </>
  );
}
