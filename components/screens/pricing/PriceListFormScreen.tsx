import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { usePriceListsQuery } from "../../api/priceLists";
import { useProductsQuery } from "../../api/products";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { PriceListForm } from "./PriceListForm";

/** New price list, or edit one (`id`). */
export function PriceListFormScreen({ id }: { id?: number }) {
  const lists = usePriceListsQuery();
  const products = useProductsQuery({ all: true });
  const router = useRouter();
  const wantsExisting = id !== undefined;
  const existing = wantsExisting ? lists.data?.find((l) => l.id === id) : undefined;

  const body = (productList: ProductDto[]) =>
    wantsExisting && !existing ? (
      <EmptyState icon="help-circle" title="There's no such price list" testID="price-list-not-found" />
    ) : (
      <PriceListForm
        key={existing?.id ?? "new"}
        existing={existing}
        products={productList}
        onDone={(message) => router.replace(`/office/price-lists?done=${encodeURIComponent(message)}`)}
      />
    );

  return (
    <Screen narrow testID="price-list-form-screen">
      <TextLink href="/office/price-lists" label="‹ All price lists" />
      <PageHeader title={existing ? existing.name : "New price list"} overline={existing ? "Price list" : undefined} testID="price-list-title" />
      <QueryStates query={lists} loadingTestID="loading" errorTestID="error" loadingLabel="Loading…">
        {() => (
          <QueryStates query={products} loadingTestID="loading" errorTestID="error" loadingLabel="Loading…">
            {body}
          </QueryStates>
        )}
      </QueryStates>
    </Screen>
  );
}
