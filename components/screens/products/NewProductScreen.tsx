import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { useCreateProductMutation } from "../../api/products";
import { EMPTY_PRODUCT } from "./productForm";
import { ProductForm } from "./ProductFormScreen";

/** New product (owner). */
export function NewProductScreen() {
  const router = useRouter();
  const create = useCreateProductMutation();
  return (
    <Screen narrow testID="product-new">
      <TextLink href="/office/products" label="‹ All products" />
      <PageHeader title="New product" subtitle="Add a photo once it's saved." testID="product-title" />
      <ProductForm
        initial={EMPTY_PRODUCT}
        submitLabel="Add product"
        onSubmit={async (input) => {
          const p = await create.mutateAsync({ ...input, active: true });
          router.replace(`/office/products/${p.id}?created=1`);
        }}
      />
    </Screen>
  );
}
