import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { FieldFrame } from "../../ui/Field";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useCreatePriceListMutation, useUpdatePriceListMutation } from "../../api/priceLists";
import { useZodForm } from "../../forms/useZodForm";
import { useMoney } from "../ordering/parts";
import { applyPercentOff } from "../../../shared/money";
import type { PriceListDto, ProductDto } from "../../../shared/schemas/catalog";
import { isPriceListField, priceListFormInput, priceListFormSchema, priceListValues } from "./priceListForm";
import { PriceListDeleteCard } from "./PriceListDeleteCard";
import { TextLink } from "../../ui/TextLink";
import { space } from "../../theme";

export interface PriceListFormProps {
  existing?: PriceListDto;
  products: ProductDto[];
  /** Back to the list with this notice. */
  onDone: (message: string) => void;
}

/** A price list's name and kind, and its percentage off or its own prices per product. */
export function PriceListForm({ existing, products, onDone }: PriceListFormProps) {
  const money = useMoney();
  const create = useCreatePriceListMutation();
  const update = useUpdatePriceListMutation(existing?.id ?? 0);
  const initial = priceListValues(existing);
  const shown = products.filter((p) => p.active || initial.prices[p.id] !== undefined);
  const form = useZodForm({
    schema: priceListFormSchema,
    initial,
    toInput: (v) => priceListFormInput(v, shown.map((p) => p.id)),
    fields: isPriceListField,
    manyMessage: null,
  });
  const { values, errors } = form;
  const pct = Number(values.percent);

  const submit = () =>
    void form.submit(async (input) => {
      if (existing) onDone(`${(await update.mutateAsync(input)).name} is saved.`);
      else onDone(`${(await create.mutateAsync(input)).name} is made. Choose it on an account's page to use it.`);
    });

  return (
    <>
      <Card testID="price-list-form">
        <FormError message={form.formError} testID="price-list-form-error" />
        <TextField label="Name" {...form.text("name")} hint="e.g. Café partners." testID="price-list-name" />
        <ChoiceGroup<PriceListDto["kind"]>
          label="Kind"
          layout="list"
          value={values.kind}
          onChange={form.set("kind")}
          error={errors.kind}
          testID="price-list-kind"
          choices={[
            { value: "percent", label: "A percentage off", hint: "Every product at its list price less this much." },
            { value: "fixed", label: "Own prices per product", hint: "Set prices for some products; the rest stay at list price." },
          ]}
        />
        {values.kind === "percent" ? (
          <TextField
            label="Percent off"
            value={values.percent}
            onChangeText={form.set("percent")}
            error={errors.percentOff}
            inputMode="decimal"
            keyboardType="decimal-pad"
            hint={Number.isFinite(pct) && pct > 0 && products[0] ? `e.g. ${products[0].name}: ${money(products[0].listPriceCents)} becomes ${money(applyPercentOff(products[0].listPriceCents, pct))}.` : "Between 0 and 90."}
            testID="price-list-percent"
          />
        ) : (
          <View style={styles.items} testID="price-list-items">
            <FieldFrame label="Own prices" hideLabel error={errors.items} testID="price-list-items">
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
                      value={values.prices[p.id] ?? ""}
                      onChangeText={(t) => form.setValue("prices", { ...values.prices, [p.id]: t })}
                      placeholder="List price"
                      error={errors[`price.${p.id}`]}
                      inputMode="decimal"
                      keyboardType="decimal-pad"
                      testID={`price-list-price-${p.id}`}
                    />
                  </View>
                </View>
              ))}
            </FieldFrame>
            <AppText variant="small" color="muted">
              Leave a price empty to keep that product at its list price.
            </AppText>
          </View>
        )}
        <Button label={existing ? "Save price list" : "Make price list"} icon="check" busy={form.submitting} onPress={submit} testID="price-list-save" />
      </Card>
      {existing ? (
        <Card title="Accounts on this price list" testID="price-list-accounts">
          {existing.accounts?.length ? (
            existing.accounts.map((a) => <TextLink key={a.id} href={`/office/accounts/${a.id}`} label={a.businessName} testID={`price-list-account-${a.id}`} />)
          ) : (
            <AppText color="muted">No account pays these prices yet. Choose the list on an account's page.</AppText>
          )}
        </Card>
      ) : null}
      {existing ? <PriceListDeleteCard list={existing} onDone={onDone} /> : null}
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  items: { gap: space.md },
  itemRow: { flexDirection: "row", alignItems: "flex-end", gap: space.md, flexWrap: "wrap" },
  priceInput: { width: 140 },
});
