import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { DataTable } from "../../ui/DataTable";
import { LinkButton } from "../../ui/LinkButton";
import { MultiChoice } from "../../ui/MultiChoice";
import { TextField } from "../../ui/TextField";
import { TextLink } from "../../ui/TextLink";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { ListCard, ListCards } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { ApiError } from "../../api/client";
import { useCreateIngredientMutation, useIngredientsQuery, useUpdateIngredientMutation } from "../../api/ingredients";
import { splitError, validate } from "../../forms/errors";
import { useMoney } from "../ordering/parts";
import { useIsWide } from "../../shell/useIsWide";
import { kitchenPaths, type KitchenArea, type KitchenPaths } from "../../production/paths";
import { formatPercent } from "../../production/units";
import { KIND_LABEL } from "./FormulaEditor";
import { ALLERGENS, ALLERGEN_LABEL, type AllergenCode } from "../../../shared/allergens";
import { INGREDIENT_KINDS, type IngredientKind } from "../../../shared/production";
import { ingredientInputSchema, type IngredientDto, type IngredientInput } from "../../../shared/schemas/production";
import { parseMoney, toDecimal } from "../../../shared/money";
import { formatMass } from "../../../shared/units";
import type { FieldErrors } from "../../../shared/errors";
import { space } from "../../theme";

export interface IngredientValues {
  name: string;
  kind: IngredientKind | null;
  waterPercent: string;
  allergens: AllergenCode[];
  packName: string;
  packGrams: string;
  /** Dollars as typed, "24.50". */
  packCost: string;
}

export const EMPTY_INGREDIENT: IngredientValues = { name: "", kind: null, waterPercent: "0", allergens: [], packName: "", packGrams: "", packCost: "" };

export function ingredientValues(i: IngredientDto): IngredientValues {
  return { name: i.name, kind: i.kind, waterPercent: String(i.waterPercent), allergens: i.allergens, packName: i.packName, packGrams: String(i.packGrams), packCost: toDecimal(i.packCostCents) };
}

const FIELDS = ["name", "kind", "waterPercent", "allergens", "packName", "packGrams", "packCostCents"] as const;

/** The form checked with the shared ingredientInputSchema (the cost is typed in dollars). */
export function checkIngredient(v: IngredientValues): { ok: true; input: IngredientInput } | { ok: false; fields: FieldErrors } {
  const cents = v.packCost.trim() === "" ? 0 : parseMoney(v.packCost);
  const checked = validate(ingredientInputSchema, {
    name: v.name,
    kind: v.kind ?? "",
    waterPercent: v.waterPercent.trim().replace(",", "."),
    allergens: v.allergens,
    packName: v.packName,
    packGrams: v.packGrams.trim() === "" ? "0" : v.packGrams.trim(),
    packCostCents: cents ?? 0,
  });
  const fields: FieldErrors = checked.ok ? {} : { ...checked.fields };
  if (v.waterPercent.trim() === "") fields.waterPercent = "Enter the water content (0 for none).";
  if (cents === null) fields.packCostCents = "Write the cost in dollars and cents, like 24.50.";
  if (!checked.ok || Object.keys(fields).length) return { ok: false, fields };
  return { ok: true, input: checked.data };
}

function Back({ paths }: { paths: KitchenPaths }) {
  return paths.hub ? <TextLink href={paths.hub} label="‹ Production" testID="back-to-production" /> : null;
}

const packText = (i: IngredientDto, money: (c: number) => string) =>
  i.packGrams > 0 ? `${i.packName} (${formatMass(i.packGrams, "metric")}) · ${money(i.packCostCents)}` : `${i.packName} · not bought`;

// ---- list ---------------------------------------------------------------------------------------

export function IngredientsScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const wide = useIsWide();
  const router = useRouter();
  const money = useMoney();
  const ingredients = useIngredientsQuery();
  const open = (i: IngredientDto) => router.push(paths.ingredient(i.id));

  let body: React.ReactNode;
  if (ingredients.isPending) body = <LoadingState label="Loading ingredients…" testID="ingredients-loading" />;
  else if (ingredients.isError) body = <ErrorState error={ingredients.error} title="Ingredients didn't load" onRetry={() => ingredients.refetch()} retrying={ingredients.isFetching} testID="ingredients-error" />;
  else if (ingredients.data.length === 0)
    body = <EmptyState icon="package" title="No ingredients yet" message="Add flour, milk, butter and the rest; formulas are written from them." action={<LinkButton href={paths.newIngredient} label="New ingredient" icon="plus" />} testID="ingredients-empty" />;
  else if (wide)
    body = (
      <DataTable
        testID="ingredients-table"
        rows={ingredients.data}
        rowKey={(i) => i.id}
        onRowPress={open}
        rowLabel={(i) => `${i.name}, ${KIND_LABEL[i.kind]}`}
        rowTestID={(i) => `ingredient-row-${i.id}`}
        columns={[
          { key: "name", label: "Ingredient", flex: 1.6, render: (i) => <AppText variant="bodyStrong">{i.name}</AppText> },
          { key: "kind", label: "Kind", render: (i) => <AppText>{KIND_LABEL[i.kind]}</AppText> },
          { key: "water", label: "Water", flex: 0.7, render: (i) => <AppText>{formatPercent(i.waterPercent)}</AppText> },
          { key: "allergens", label: "Allergens", flex: 1.4, render: (i) => <AppText variant="small">{i.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ") || "None"}</AppText> },
          { key: "pack", label: "Purchase pack", flex: 2, render: (i) => <AppText variant="small">{packText(i, money)}</AppText> },
        ]}
      />
    );
  else
    body = (
      <ListCards testID="ingredients-list">
        {ingredients.data.map((i) => (
          <ListCard key={i.id} onPress={() => open(i)} accessibilityLabel={`${i.name}, ${KIND_LABEL[i.kind]}`} testID={`ingredient-row-${i.id}`}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong">{i.name}</AppText>
              <AppText variant="small" color="muted">{`${KIND_LABEL[i.kind]} · water ${formatPercent(i.waterPercent)}${i.allergens.length ? ` · ${i.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}` : ""}`}</AppText>
              <AppText variant="small">{packText(i, money)}</AppText>
            </View>
          </ListCard>
        ))}
      </ListCards>
    );

  return (
    <Screen testID="ingredients-screen">
      <Back paths={paths} />
      <PageHeader
        title="Ingredients"
        subtitle="Kinds and water content drive hydration; allergens flow to products; packs size the purchasing forecast."
        actions={
          <>
            <LinkButton href={paths.formulas} label="Formulas" icon="book-open" variant="secondary" testID="open-formulas" />
            <LinkButton href={paths.newIngredient} label="New ingredient" icon="plus" testID="new-ingredient" />
          </>
        }
        testID="ingredients-title"
      />
      {body}
    </Screen>
  );
}

// ---- form ---------------------------------------------------------------------------------------

export function NewIngredientScreen({ area }: { area: KitchenArea }) {
  const paths = kitchenPaths(area);
  const router = useRouter();
  const create = useCreateIngredientMutation();
  return (
    <Screen narrow testID="ingredient-new">
      <TextLink href={paths.ingredients} label="‹ All ingredients" testID="back-to-ingredients" />
      <PageHeader title="New ingredient" testID="ingredient-title" />
      <IngredientForm initial={EMPTY_INGREDIENT} submitLabel="Add ingredient" busy={create.isPending} onSubmit={(input, fail) => create.mutate(input, { onSuccess: () => router.replace(paths.ingredients), onError: fail })} />
    </Screen>
  );
}

export function IngredientScreen({ area, id }: { area: KitchenArea; id: number }) {
  const paths = kitchenPaths(area);
  const ingredients = useIngredientsQuery();
  const update = useUpdateIngredientMutation(id);
  const [saved, setSaved] = useState<string | null>(null);
  const found = ingredients.data?.find((i) => i.id === id);
  return (
    <Screen narrow testID="ingredient-detail">
      <TextLink href={paths.ingredients} label="‹ All ingredients" testID="back-to-ingredients" />
      {ingredients.isPending ? (
        <LoadingState label="Loading the ingredient…" />
      ) : ingredients.isError ? (
        <ErrorState error={ingredients.error} title="The ingredient didn't load" onRetry={() => ingredients.refetch()} retrying={ingredients.isFetching} />
      ) : !found ? (
        <EmptyState icon="help-circle" title="There's no such ingredient" testID="ingredient-not-found" />
      ) : (
        <>
          <PageHeader overline={KIND_LABEL[found.kind]} title={found.name} testID="ingredient-title" />
          {saved ? <Notice message={saved} testID="ingredient-saved" /> : null}
          <IngredientForm
            key={found.id}
            initial={ingredientValues(found)}
            submitLabel="Save changes"
            busy={update.isPending}
            onSubmit={(input, fail) => {
              setSaved(null);
              update.mutate(input, { onSuccess: (i) => setSaved(`${i.name} is saved. Formulas and plans use it now.`), onError: fail });
            }}
          />
        </>
      )}
    </Screen>
  );
}

interface IngredientFormProps {
  initial: IngredientValues;
  submitLabel: string;
  busy: boolean;
  onSubmit: (input: IngredientInput, fail: (err: unknown) => void) => void;
}

export function IngredientForm({ initial, submitLabel, busy, onSubmit }: IngredientFormProps) {
  const [v, setV] = useState<IngredientValues>(initial);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const set = <K extends keyof IngredientValues>(key: K) => (value: IngredientValues[K]) => setV((s) => ({ ...s, [key]: value }));
  const grams = Number(v.packGrams);
  const submit = () => {
    if (busy) return;
    setFormError(null);
    const checked = checkIngredient(v);
    if (!checked.ok) {
      setFields(checked.fields);
      setFormError(Object.keys(checked.fields).length > 1 ? "Some fields need attention." : null);
      return;
    }
    setFields({});
    onSubmit(checked.input, (err) => {
      if (err instanceof ApiError && err.code === "name_taken") {
        setFields({ name: err.message });
        return;
      }
      const split = splitError(err, FIELDS);
      setFields(split.fields);
      setFormError(split.formError);
    });
  };
  return (
    <Card testID="ingredient-form">
      <FormError message={formError} testID="ingredient-form-error" />
      <TextField label="Name" value={v.name} onChangeText={set("name")} error={fields.name} autoCapitalize="sentences" testID="ingredient-name" />
      <ChoiceGroup<IngredientKind>
        label="Kind"
        choices={INGREDIENT_KINDS.map((k) => ({ value: k, label: KIND_LABEL[k] }))}
        value={v.kind}
        onChange={set("kind")}
        error={fields.kind}
        testID="ingredient-kind"
      />
      <TextField
        label="Water content (%)"
        hint="Of its weight: milk about 87, butter 16, egg 76, flour 12. Used for effective hydration."
        value={v.waterPercent}
        onChangeText={set("waterPercent")}
        error={fields.waterPercent}
        inputMode="decimal"
        keyboardType="decimal-pad"
        testID="ingredient-water"
      />
      <MultiChoice<AllergenCode>
        label="Allergens"
        hint="From the fixed list; products made from a formula with this ingredient carry them."
        options={ALLERGENS.map((a) => ({ value: a.code, label: a.label }))}
        value={v.allergens}
        onChange={set("allergens")}
        error={fields.allergens}
        testID="ingredient-allergens"
      />
      <AppText variant="overline" color="muted">
        Purchase pack
      </AppText>
      <TextField label="Pack" hint="How it is bought, e.g. 25 kg sack, 1 gal jug." value={v.packName} onChangeText={set("packName")} error={fields.packName} testID="ingredient-pack" />
      <View style={styles.grid}>
        <View style={styles.cell}>
          <TextField
            label="Pack weight (g)"
            hint={grams > 0 ? `= ${formatMass(grams, "us")}` : "0 = not bought (tap water)."}
            value={v.packGrams}
            onChangeText={set("packGrams")}
            error={fields.packGrams}
            inputMode="numeric"
            keyboardType="number-pad"
            testID="ingredient-pack-grams"
          />
        </View>
        <View style={styles.cell}>
          <TextField label="Pack cost" hint="Dollars, e.g. 24.50." value={v.packCost} onChangeText={set("packCost")} error={fields.packCostCents} inputMode="decimal" keyboardType="decimal-pad" testID="ingredient-pack-cost" />
        </View>
      </View>
      <Button label={submitLabel} icon="check" onPress={submit} busy={busy} testID="ingredient-save" />
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 160 },
});
