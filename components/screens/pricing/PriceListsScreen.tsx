import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { TextLink } from "../../ui/TextLink";
import { Badge } from "../../ui/Badge";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { ListCard, ListCards } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { useCreatePriceListMutation, useDeletePriceListMutation, usePriceListsQuery, useUpdatePriceListMutation } from "../../api/priceLists";
import { useProductsQuery } from "../../api/products";
import { messageOf } from "../../api/client";
import { splitError, validate } from "../../forms/errors";
import { useMoney } from "../ordering/parts";
import { applyPercentOff, parseMoney, toDecimal } from "../../../shared/money";
import { priceListInputSchema, type PriceListDto, type PriceListInput, type ProductDto } from "../../../shared/schemas/catalog";
import type { FieldErrors } from "../../../shared/errors";
import { colors, radii, space } from "../../theme";

export function describePriceList(list: PriceListDto): string {
  if (list.kind === "percent") return `${list.percentOff} % off list prices`;
  return list.items.length === 1 ? "Own price for 1 product" : `Own prices for ${list.items.length} products`;
}

const usedBy = (n: number) => (n === 0 ? "No accounts use it" : n === 1 ? "Used by 1 account" : `Used by ${n} accounts`);

/** The owner's price lists: a percentage off, or fixed prices per product. Accounts choose one on their page. */
export function PriceListsScreen({ notice }: { notice?: string }) {
  const lists = usePriceListsQuery();
  const router = useRouter();
  return (
    <Screen testID="price-lists-screen">
      <PageHeader
        title="Price lists"
        subtitle="Give some accounts their own prices. Pick an account's list on its page, under Delivery and prices."
        actions={<LinkButton href="/office/price-lists/new" label="New price list" icon="plus" testID="new-price-list" />}
        testID="price-lists-title"
      />
      {notice ? <Notice message={notice} testID="price-lists-notice" /> : null}
      {lists.isPending ? (
        <LoadingState label="Loading price lists…" />
      ) : lists.isError ? (
        <ErrorState error={lists.error} title="Price lists didn't load" onRetry={() => lists.refetch()} retrying={lists.isFetching} testID="price-lists-error" />
      ) : lists.data.length === 0 ? (
        <EmptyState icon="tag" title="No price lists yet" message="Every account pays list prices until you make one." action={<LinkButton href="/office/price-lists/new" label="New price list" icon="plus" />} testID="price-lists-empty" />
      ) : (
        <ListCards testID="price-lists-list">
          {lists.data.map((l) => (
            <ListCard
              key={l.id}
              onPress={() => router.push(`/office/price-lists/${l.id}`)}
              accessibilityLabel={`${l.name}, ${describePriceList(l)}`}
              testID={`price-list-${l.id}`}
            >
              <View style={styles.cardText}>
                <AppText variant="bodyStrong">{l.name}</AppText>
                <AppText variant="small" color="muted">
                  {describePriceList(l)}
                </AppText>
                <Badge label={usedBy(l.accountCount)} tone={l.accountCount ? "crust" : "neutral"} />
              </View>
            </ListCard>
          ))}
        </ListCards>
      )}
    </Screen>
  );
}

/** New price list, or edit one (`id`). */
export function PriceListFormScreen({ id }: { id?: number }) {
  const lists = usePriceListsQuery();
  const products = useProductsQuery({ all: true });
  const router = useRouter();
  const wantsExisting = id !== undefined;
  const existing = wantsExisting ? lists.data?.find((l) => l.id === id) : undefined;

  let body: React.ReactNode;
  if (lists.isPending || products.isPending) body = <LoadingState label="Loading…" />;
  else if (lists.isError || products.isError) {
    const q = lists.isError ? lists : products;
    body = <ErrorState error={q.error} onRetry={() => q.refetch()} retrying={q.isFetching} />;
  } else if (wantsExisting && !existing) body = <EmptyState icon="help-circle" title="There's no such price list" testID="price-list-not-found" />;
  else
    body = (
      <PriceListForm
        key={existing?.id ?? "new"}
        existing={existing}
        products={products.data}
        onDone={(message) => router.replace(`/office/price-lists?done=${encodeURIComponent(message)}`)}
      />
    );

  return (
    <Screen narrow testID="price-list-form-screen">
      <TextLink href="/office/price-lists" label="‹ All price lists" />
      <PageHeader title={existing ? existing.name : "New price list"} overline={existing ? "Price list" : undefined} testID="price-list-title" />
      {body}
    </Screen>
  );
}

function PriceListForm({ existing, products, onDone }: { existing?: PriceListDto; products: ProductDto[]; onDone: (message: string) => void }) {
  const money = useMoney();
  const create = useCreatePriceListMutation();
  const update = useUpdatePriceListMutation(existing?.id ?? 0);
  const remove = useDeletePriceListMutation();
  const [name, setName] = useState(existing?.name ?? "");
  const [kind, setKind] = useState<PriceListDto["kind"]>(existing?.kind ?? "percent");
  const [percent, setPercent] = useState(existing ? String(existing.percentOff) : "10");
  const [prices, setPrices] = useState<Record<number, string>>(() => Object.fromEntries((existing?.items ?? []).map((i) => [i.productId, toDecimal(i.priceCents)])));
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const busy = create.isPending || update.isPending;
  const shown = products.filter((p) => p.active || prices[p.id] !== undefined);
  const pct = Number(percent);

  const submit = () => {
    setFormError(null);
    const priceErrors: FieldErrors = {};
    const items: PriceListInput["items"] = [];
    if (kind === "fixed") {
      for (const p of shown) {
        const t = (prices[p.id] ?? "").trim();
        if (!t) continue;
        const cents = parseMoney(t);
        if (cents === null) priceErrors[`price.${p.id}`] = "Write it in dollars and cents, like 16.50.";
        else items.push({ productId: p.id, priceCents: cents });
      }
    }
    const body = { name, kind, percentOff: kind === "percent" ? percent : 0, items };
    const checked = validate(priceListInputSchema, body);
    const all = { ...(checked.ok ? {} : checked.fields), ...priceErrors };
    if (kind === "fixed" && items.length === 0 && !Object.keys(priceErrors).length) all.items = "Set a price for at least one product.";
    if (Object.keys(all).length || !checked.ok) {
      setFields(all);
      return;
    }
    setFields({});
    const fail = (err: unknown) => {
      const split = splitError(err, ["name", "kind", "percentOff", "items"]);
      setFields(split.fields);
      setFormError(split.formError);
    };
    const input = checked.data as PriceListInput;
    if (existing) update.mutate(input, { onSuccess: (l) => onDone(`${l.name} is saved.`), onError: fail });
    else create.mutate(input, { onSuccess: (l) => onDone(`${l.name} is made. Choose it on an account's page to use it.`), onError: fail });
  };

  return (
    <>
      <Card testID="price-list-form">
        <FormError message={formError} testID="price-list-form-error" />
        <TextField label="Name" value={name} onChangeText={setName} error={fields.name} hint="e.g. Café partners." testID="price-list-name" />
        <ChoiceGroup<PriceListDto["kind"]>
          label="Kind"
          layout="list"
          value={kind}
          onChange={setKind}
          error={fields.kind}
          testID="price-list-kind"
          choices={[
            { value: "percent", label: "A percentage off", hint: "Every product at its list price less this much." },
            { value: "fixed", label: "Own prices per product", hint: "Set prices for some products; the rest stay at list price." },
          ]}
        />
        {kind === "percent" ? (
          <TextField
            label="Percent off"
            value={percent}
            onChangeText={setPercent}
            error={fields.percentOff}
            inputMode="decimal"
            keyboardType="decimal-pad"
            hint={Number.isFinite(pct) && pct > 0 && products[0] ? `e.g. ${products[0].name}: ${money(products[0].listPriceCents)} becomes ${money(applyPercentOff(products[0].listPriceCents, pct))}.` : "Between 0 and 90."}
            testID="price-list-percent"
          />
        ) : (
          <View style={styles.items} testID="price-list-items">
            {fields.items ? (
              <AppText variant="small" color="dangerInk" testID="price-list-items-error">
                {fields.items}
              </AppText>
            ) : null}
            {shown.map((p) => (
              <View key={p.id} style={styles.itemRow}>
                <View style={styles.flex}>
                  <AppText variant="bodyStrong">{p.name}</AppText>
                  <AppText variant="small" color="muted">{`${p.saleUnit} · list ${money(p.listPriceCents)}${p.active ? "" : " · archived"}`}</AppText>
                </View>
                <View style={styles.priceInput}>
                  <TextField
                    label="Own price"
                    accessibilityLabel={`Price for ${p.name}`}
                    value={prices[p.id] ?? ""}
                    onChangeText={(t) => setPrices((s) => ({ ...s, [p.id]: t }))}
                    placeholder="List price"
                    error={fields[`price.${p.id}`]}
                    inputMode="decimal"
                    keyboardType="decimal-pad"
                    testID={`price-list-price-${p.id}`}
                  />
                </View>
              </View>
            ))}
            <AppText variant="small" color="muted">
              Leave a price empty to keep that product at its list price.
            </AppText>
          </View>
        )}
        <Button label={existing ? "Save price list" : "Make price list"} icon="check" busy={busy} onPress={submit} testID="price-list-save" />
      </Card>
      {existing ? (
        <Card title="Delete" testID="price-list-delete-card">
          <AppText color="muted">{`${usedBy(existing.accountCount)}. Deleting it puts those accounts back on list prices.`}</AppText>
          <FormError message={remove.isError ? messageOf(remove.error) : null} />
          {confirmDelete ? (
            <View style={styles.confirm}>
              <AppText variant="bodyStrong" color="dangerInk">{`Delete ${existing.name}?`}</AppText>
              <View style={styles.buttons}>
                <Button label="Yes, delete" variant="danger" busy={remove.isPending} onPress={() => remove.mutate(existing.id, { onSuccess: () => onDone(`${existing.name} is deleted.`) })} testID="price-list-delete-confirm" />
                <Button label="Keep it" variant="secondary" onPress={() => setConfirmDelete(false)} />
              </View>
            </View>
          ) : (
            <Button label="Delete price list" icon="trash-2" variant="ghost" onPress={() => setConfirmDelete(true)} testID="price-list-delete" />
          )}
        </Card>
      ) : null}
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  cardText: { flex: 1, gap: space.xxs },
  items: { gap: space.md },
  itemRow: { flexDirection: "row", alignItems: "flex-end", gap: space.md, flexWrap: "wrap" },
  priceInput: { width: 140 },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
