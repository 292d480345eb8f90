import React, { useState } from "react";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { Notice } from "../../ui/FormError";
import { NotFoundState, isNotFound } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { useSignedInUser } from "../../auth/useAuth";
import { useProductQuery, useUpdateProductMutation } from "../../api/products";
import { valuesOf } from "./productForm";
import { ProductForm } from "./ProductFormScreen";
import { PhotoCard } from "./PhotoCard";
import { ArchiveCard } from "./ArchiveCard";
import { ProductFacts } from "./ProductFacts";

/** One product: the owner edits it, uploads its photo, archives it; the bookkeeper reads it. */
export function ProductDetailScreen({ id, created }: { id: number; created?: boolean }) {
  const user = useSignedInUser();
  const valid = Number.isInteger(id) && id > 0;
  const product = useProductQuery(valid ? id : null);
  const update = useUpdateProductMutation(id);
  const [saved, setSaved] = useState<string | null>(created ? "Product added. Now add a photo so buyers recognise it." : null);

  if (!valid || isNotFound(product.error)) {
    return (
      <Screen narrow testID="product-detail">
        <NotFoundState title="There's no such product" back={{ href: "/office/products", label: "All products" }} testID="product-not-found" />
      </Screen>
    );
  }
  return (
    <Screen narrow testID="product-detail">
      {product.isError ? <TextLink href="/office/products" label="‹ All products" /> : null}
      <QueryStates query={product} loadingLabel="Loading the product…">
        {(p) => (
          <>
            <TextLink href="/office/products" label="‹ All products" testID="back-to-products" />
            <PageHeader overline={p.active ? "On offer" : "Archived"} title={p.name} testID="product-title" />
            {saved ? <Notice message={saved} testID="product-saved" /> : null}
            {user.role === "owner" ? (
              <>
                <PhotoCard product={p} />
                <ProductForm
                  key={p.id}
                  initial={valuesOf(p)}
                  active={p.active}
                  submitLabel="Save changes"
                  onSubmit={async (input) => {
                    setSaved(null);
                    const s = await update.mutateAsync(input);
                    setSaved(`${s.name} is saved.`);
                  }}
                />
                <ArchiveCard product={p} />
              </>
            ) : (
              <ProductFacts product={p} />
            )}
          </>
        )}
      </QueryStates>
    </Screen>
  );
}
