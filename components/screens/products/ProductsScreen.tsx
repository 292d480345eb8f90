import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { LinkButton } from "../../ui/LinkButton";
import { Badge } from "../../ui/Badge";
import { Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { TextField } from "../../ui/TextField";
import { useSignedInUser } from "../../auth/useAuth";
import { useProductsQuery } from "../../api/products";
import { ProductPhoto, useMoney } from "../ordering/parts";
import type { ProductDto } from "../../../shared/schemas/catalog";
import { TableOrCards } from "../../ui/TableOrCards";
import { TitleCell } from "../../ui/DataTable";
import { ListCardText } from "../../ui/ListCard";
import { space } from "../../theme";

type Filter = "active" | "archived" | "all";
export type ProductSort = "menu" | "name" | "price" | "price_desc";

/** The filter, a search over name, sale unit and description (accents and case ignored), then the chosen order. */
export function filterProducts(products: ProductDto[], filter: Filter, search = "", sort: ProductSort = "menu"): ProductDto[] {
  const fold = (t: string) => t.normalize("NFD").replace(/[\u0300-\u036f]/g, "").toLowerCase();
  const words = fold(search.trim()).split(/\s+/).filter(Boolean);
  const shown = products.filter((p) => {
    if (filter !== "all" && (filter === "active" ? !p.active : p.active)) return false;
    const hay = fold(`${p.name} ${p.saleUnit} ${p.description ?? ""}`);
    return words.every((w) => hay.includes(w));
  });
  if (sort === "menu") return shown;
  const byName = (a: ProductDto, b: ProductDto) => a.name.localeCompare(b.name);
  return [...shown].sort(sort === "name" ? byName : (a, b) => (sort === "price" ? a.listPriceCents - b.listPriceCents : b.listPriceCents - a.listPriceCents) || byName(a, b));
}

/** The catalog for the office: every product including archived ones; the owner adds and edits. */
export function ProductsScreen({ archived }: { archived?: string }) {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const [filter, setFilter] = useState<Filter>("active");
  const [search, setSearch] = useState("");
  const [sort, setSort] = useState<ProductSort>("menu");
  const products = useProductsQuery({ all: true });

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
      <View style={styles.tools}>
        <View style={styles.search}>
          <TextField label="Search" value={search} onChangeText={setSearch} placeholder="Name, sale unit or description" autoCorrect={false} testID="products-search" />
        </View>
        <ChoiceGroup<ProductSort>
          label="Sort by"
          testID="products-sort"
          value={sort}
          onChange={setSort}
          choices={[
            { value: "menu", label: "Menu order" },
            { value: "name", label: "Name" },
            { value: "price", label: "Price, low to high" },
            { value: "price_desc", label: "Price, high to low" },
          ]}
        />
      </View>
      <QueryStates query={products} loadingLabel="Loading products…" errorTitle="Products didn't load" errorTestID="products-error">
        {(all) => <ProductList all={all} filter={filter} search={search} sort={sort} isOwner={isOwner} />}
      </QueryStates>
    </Screen>
  );
}

/** The products the filter shows: a table on wide screens, cards on a phone. */
function ProductList({ all, filter, search, sort, isOwner }: { all: ProductDto[]; filter: Filter; search: string; sort: ProductSort; isOwner: boolean }) {
  const router = useRouter();
  const money = useMoney();
  const shown = filterProducts(all, filter, search, sort);
  if (shown.length === 0 && search.trim() && filterProducts(all, filter).length > 0) {
    return <EmptyState icon="search" title={`Nothing matches “${search.trim()}”`} message="Try part of the name, or clear the search." testID="products-no-match" />;
  }
  if (shown.length === 0) {
    return (
      <EmptyState
        icon="shopping-bag"
        title={all.length === 0 ? "No products yet" : filter === "archived" ? "Nothing archived" : "No products on offer"}
        message={all.length === 0 && isOwner ? "Add the first thing buyers can order." : undefined}
        action={all.length === 0 && isOwner ? <LinkButton href="/office/products/new" label="New product" icon="plus" /> : undefined}
        testID="products-empty"
      />
    );
  }
  const status = (p: ProductDto) => (
    <View style={styles.badges}>
      <Badge label={p.active ? "On offer" : "Archived"} tone={p.active ? "sage" : "neutral"} />
      <MakingBadge product={p} />
    </View>
  );
  return (
    <TableOrCards
      rows={shown}
      rowKey={(p) => p.id}
      onOpen={(p) => router.push(`/office/products/${p.id}`)}
      rowLabel={(p) => `${p.name}, ${p.active ? "on offer" : "archived"}`}
      rowTestID={(p) => `product-row-${p.id}`}
      tableTestID="products-table"
      columns={[
        {
          key: "name",
          label: "Product",
          flex: 2.6,
          render: (p) => (
            <View style={styles.nameCell}>
              <ProductPhoto url={p.photoUrl} thumbUrl={p.photoThumbUrl} name={p.name} size={40} />
              <View style={styles.flex}>
                <TitleCell title={p.name} detail={p.saleUnit} oneLine />
              </View>
            </View>
          ),
        },
        { key: "price", label: "List price", flex: 1, render: (p) => <AppText>{money(p.listPriceCents)}</AppText> },
        { key: "qty", label: "Per order", flex: 1, render: (p) => <AppText>{`${p.minQuantity}–${p.maxQuantity}`}</AppText> },
        { key: "lead", label: "Notice", flex: 1, render: (p) => <AppText>{p.leadDays === null ? "Usual" : `${p.leadDays} days`}</AppText> },
        { key: "allergens", label: "Allergens", flex: 0.9, render: (p) => <AppText>{String(p.allergens.length)}</AppText> },
        { key: "status", label: "Status", flex: 1.2, render: status },
      ]}
      cardsTestID="products-list"
      compact
      card={(p) => (
        <>
          <ProductPhoto url={p.photoUrl} thumbUrl={p.photoThumbUrl} name={p.name} size={52} />
          <ListCardText>
            <AppText variant="bodyStrong">{p.name}</AppText>
            <AppText variant="small" color="muted">{`${p.saleUnit} · ${money(p.listPriceCents)}`}</AppText>
            {status(p)}
          </ListCardText>
        </>
      )}
    />
  );
}

/** "Bought in", or a warning when a product has neither a formula nor the bought-in choice (production cannot plan it). */
function MakingBadge({ product: p }: { product: ProductDto }) {
  if (p.boughtIn) return <Badge label="Bought in" tone="neutral" testID={`product-${p.id}-bought-in`} />;
  if (p.formulaId === null) return <Badge label="No formula" tone="danger" testID={`product-${p.id}-no-formula`} />;
  return null;
}

const styles = StyleSheet.create({
  tools: { flexDirection: "row", flexWrap: "wrap", gap: space.md, alignItems: "flex-end" },
  search: { flexGrow: 1, flexBasis: 260, maxWidth: 420 },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  flex: { flex: 1, minWidth: 0 },
  nameCell: { flexDirection: "row", alignItems: "center", gap: space.md },
});
