import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { DataTable } from "../../ui/DataTable";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { LinkButton } from "../../ui/LinkButton";
import { Badge } from "../../ui/Badge";
import { Notice } from "../../ui/FormError";
import { ListCard, ListCards } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useProductsQuery } from "../../api/products";
import { useIsWide } from "../../shell/useIsWide";
import { ProductPhoto, useMoney } from "../ordering/parts";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { space } from "../../theme";

type Filter = "active" | "archived" | "all";

export function filterProducts(products: ProductDto[], filter: Filter): ProductDto[] {
  if (filter === "all") return products;
  return products.filter((p) => (filter === "active" ? p.active : !p.active));
}

/** The catalog for the office: every product including archived ones; the owner adds and edits. */
export function ProductsScreen({ archived }: { archived?: string }) {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const wide = useIsWide();
  const router = useRouter();
  const money = useMoney();
  const [filter, setFilter] = useState<Filter>("active");
  const products = useProductsQuery({ all: true });
  const open = (p: ProductDto) => router.push(`/office/products/${p.id}`);

  let body: React.ReactNode;
  if (products.isPending) body = <LoadingState label="Loading products…" />;
  else if (products.isError) body = <ErrorState error={products.error} title="Products didn't load" onRetry={() => products.refetch()} retrying={products.isFetching} testID="products-error" />;
  else {
    const shown = filterProducts(products.data, filter);
    body =
      shown.length === 0 ? (
        <EmptyState
          icon="shopping-bag"
          title={products.data.length === 0 ? "No products yet" : filter === "archived" ? "Nothing archived" : "No products on offer"}
          message={products.data.length === 0 && isOwner ? "Add the first thing buyers can order." : undefined}
          action={products.data.length === 0 && isOwner ? <LinkButton href="/office/products/new" label="New product" icon="plus" /> : undefined}
          testID="products-empty"
        />
      ) : wide ? (
        <DataTable
          testID="products-table"
          rows={shown}
          rowKey={(p) => p.id}
          onRowPress={open}
          rowLabel={(p) => `${p.name}, ${p.active ? "on offer" : "archived"}`}
          rowTestID={(p) => `product-row-${p.id}`}
          columns={[
            {
              key: "name",
              label: "Product",
              flex: 2.6,
              render: (p) => (
                <View style={styles.nameCell}>
                  <ProductPhoto url={p.photoUrl} name={p.name} size={40} />
                  <View style={styles.flex}>
                    <AppText variant="bodyStrong" numberOfLines={1}>
                      {p.name}
                    </AppText>
                    <AppText variant="small" color="muted" numberOfLines={1}>
                      {p.saleUnit}
                    </AppText>
                  </View>
                </View>
              ),
            },
            { key: "price", label: "List price", flex: 1, render: (p) => <AppText>{money(p.listPriceCents)}</AppText> },
            { key: "qty", label: "Per order", flex: 1, render: (p) => <AppText>{`${p.minQuantity}–${p.maxQuantity}`}</AppText> },
            { key: "lead", label: "Notice", flex: 1, render: (p) => <AppText>{p.leadDays === null ? "Usual" : `${p.leadDays} days`}</AppText> },
            { key: "allergens", label: "Allergens", flex: 0.9, render: (p) => <AppText>{String(p.allergens.length)}</AppText> },
            {
              key: "status",
              label: "Status",
              flex: 1.2,
              render: (p) => (
                <View style={styles.badges}>
                  <Badge label={p.active ? "On offer" : "Archived"} tone={p.active ? "sage" : "neutral"} />
                  <MakingBadge product={p} />
                </View>
              ),
            },
          ]}
        />
      ) : (
        <ListCards testID="products-list">
          {shown.map((p) => (
            <ListCard
              key={p.id}
              onPress={() => open(p)}
              accessibilityLabel={`${p.name}, ${p.active ? "on offer" : "archived"}`}
              testID={`product-row-${p.id}`}
              compact
            >
              <ProductPhoto url={p.photoUrl} name={p.name} size={52} />
              <View style={styles.cardText}>
                <AppText variant="bodyStrong">{p.name}</AppText>
                <AppText variant="small" color="muted">{`${p.saleUnit} · ${money(p.listPriceCents)}`}</AppText>
                <View style={styles.badges}>
                  <Badge label={p.active ? "On offer" : "Archived"} tone={p.active ? "sage" : "neutral"} />
                  <MakingBadge product={p} />
                </View>
              </View>
            </ListCard>
          ))}
        </ListCards>
      );
  }

  return (
    <Screen testID="products-screen">
      <PageHeader
        title="Products"
        subtitle="What buyers can order: sale units, pans, prices, limits and allergens."
        actions={isOwner ? <LinkButton href="/office/products/new" label="New product" icon="plus" testID="new-product" /> : null}
        testID="products-title"
      />
      {archived ? <Notice message={`${archived} is archived: it stays on past orders but can't be ordered.`} testID="archived-notice" /> : null}
      <ChoiceGroup<Filter>
        label="Show"
        testID="products-filter"
        value={filter}
        onChange={setFilter}
        choices={[
          { value: "active", label: "On offer" },
          { value: "archived", label: "Archived" },
          { value: "all", label: "All" },
        ]}
      />
      {body}
    </Screen>
  );
}

/** "Bought in", or a warning when a product has neither a formula nor the bought-in choice (production cannot plan it). */
function MakingBadge({ product: p }: { product: ProductDto }) {
  if (p.boughtIn) return <Badge label="Bought in" tone="neutral" testID={`product-${p.id}-bought-in`} />;
  if (p.formulaId === null) return <Badge label="No formula" tone="danger" testID={`product-${p.id}-no-formula`} />;
  return null;
}

const styles = StyleSheet.create({
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  flex: { flex: 1, minWidth: 0 },
  nameCell: { flexDirection: "row", alignItems: "center", gap: space.md },
  cardText: { flex: 1, gap: space.xxs },
});
