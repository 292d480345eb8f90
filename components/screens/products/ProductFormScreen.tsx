import React, { useRef, useState } from "react";
import { Platform, StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { MultiChoice } from "../../ui/MultiChoice";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { DetailList } from "../../ui/DetailList";
import { ProgressBar } from "../../ui/ProgressBar";
import { Badge } from "../../ui/Badge";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useArchiveProductMutation, useCreateProductMutation, useProductQuery, useUpdateProductMutation, useUploadProductPhotoMutation } from "../../api/products";
import { useFormulasQuery } from "../../api/formulas";
import { useIngredientsQuery } from "../../api/ingredients";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { InlinePicker } from "../../ui/InlinePicker";
import { ComponentRows, newComponentRow, type ComponentRow } from "./ComponentRows";
import { ADDED_BY_BAKERY, declaredAllergens, groupComponents, type DeclaredAllergens } from "../../../shared/components";
import { celsiusToFahrenheit } from "../../../shared/units";
import type { FormulaDto, IngredientDto } from "../../../shared/schemas/production";
import { ApiError, messageOf } from "../../api/client";
import { splitError, validate } from "../../forms/errors";
import { mmToInches } from "../../ordering/pan";
import { mayContainLabel, mayContainParts, mayContainText } from "../../ordering/allergens";
import { AllergenChips, ProductPhoto, useMoney } from "../ordering/parts";
import { useIsWide } from "../../shell/useIsWide";
import { ALLERGENS, ALLERGEN_LABEL, sortAllergens, type AllergenCode } from "../../../shared/allergens";
import { parseMoney, toDecimal } from "../../../shared/money";
import { productInputSchema, type ProductDto, type ProductInput } from "../../../shared/schemas/catalog";
import type { FieldErrors } from "../../../shared/errors";
import { quantityText, suggestPlural } from "../../../shared/quantity";
import { colors, radii, space } from "../../theme";

/** "How it's made": baked here from a formula, or bought in / not planned. */
export type Making = "formula" | "bought_in";

export interface ProductValues {
  name: string;
  description: string;
  saleUnit: string;
  /** Pre-filled from the singular (shared/quantity.ts suggestPlural) until the owner writes their own. */
  saleUnitPlural: string;
  piecesPerUnit: string;
  pieceGrams: string;
  panName: string;
  panLengthMm: string;
  panWidthMm: string;
  unitsPerPan: string;
  /** Dollars as typed, "18.00". */
  price: string;
  minQuantity: string;
  maxQuantity: string;
  /** Blank: the bakery's usual cut-off. */
  leadDays: string;
  /** Null until the owner chooses: a new product on offer needs the choice. */
  making: Making | null;
  formulaId: number | null;
  /** Blank: the formula's bake step and cool step. */
  bakeTempC: string;
  bakeMinutes: string;
  coolMinutes: string;
  components: ComponentRow[];
  /** The product's own allergens, added to what the formula and components bring (for a bought-in product: all of them). */
  allergens: AllergenCode[];
  mayContain: AllergenCode[];
  /** Anything in "may contain" that isn't an allergen code, kept as it was. */
  mayContainOther: string[];
}

const FIELDS = ["name", "description", "saleUnit", "saleUnitPlural", "piecesPerUnit", "pieceGrams", "panName", "panLengthMm", "panWidthMm", "unitsPerPan", "priceCents", "minQuantity", "maxQuantity", "leadDays", "allergens", "mayContain", "formulaId", "boughtIn", "bakeTempC", "bakeMinutes", "coolMinutes", "components"] as const;
const COMPONENT_FIELDS = ["kind", "name", "ingredientId", "grams", "per", "note"] as const;
/** Every field the form shows a message beside, the component rows' included. */
export const formFields = (v: Pick<ProductValues, "components">): string[] => [...FIELDS, ...v.components.flatMap((_, i) => COMPONENT_FIELDS.map((k) => `components.${i}.${k}`))];

export const EMPTY_PRODUCT: ProductValues = {
  name: "",
  description: "",
  saleUnit: "",
  saleUnitPlural: "",
  piecesPerUnit: "",
  pieceGrams: "",
  panName: "",
  panLengthMm: "",
  panWidthMm: "",
  unitsPerPan: "1",
  price: "",
  minQuantity: "1",
  maxQuantity: "100",
  leadDays: "",
  making: null,
  formulaId: null,
  bakeTempC: "",
  bakeMinutes: "",
  coolMinutes: "",
  components: [],
  allergens: [],
  mayContain: [],
  mayContainOther: [],
};

const text = (n: number | null) => (n === null ? "" : String(n));

export function valuesOf(p: ProductDto, currency = "USD"): ProductValues {
  const traces = mayContainParts(p.mayContain);
  return {
    name: p.name,
    description: p.description,
    saleUnit: p.saleUnit,
    saleUnitPlural: p.saleUnitPlural,
    piecesPerUnit: String(p.piecesPerUnit),
    pieceGrams: String(p.pieceGrams),
    panName: p.panName,
    panLengthMm: String(p.panLengthMm),
    panWidthMm: String(p.panWidthMm),
    unitsPerPan: String(p.unitsPerPan),
    price: toDecimal(p.listPriceCents, currency),
    minQuantity: String(p.minQuantity),
    maxQuantity: String(p.maxQuantity),
    leadDays: p.leadDays === null ? "" : String(p.leadDays),
    making: p.formulaId !== null ? "formula" : p.boughtIn ? "bought_in" : null,
    formulaId: p.formulaId,
    bakeTempC: text(p.bakeTempC),
    bakeMinutes: text(p.bakeMinutes),
    coolMinutes: text(p.coolMinutes),
    components: p.components.map((c) => newComponentRow({ kind: c.kind, name: c.name, ingredientId: c.ingredientId, grams: String(c.grams), per: c.per, note: c.note })),
    allergens: p.addedAllergens,
    mayContain: traces.codes,
    mayContainOther: traces.other,
  };
}

/**
 * What the product declares as the form stands: the chosen formula's allergens and the components' ingredients'
 * (which the owner cannot take off), plus the product's own additions — the same union the server computes
 * (shared/components.ts declaredAllergens).
 */
export function previewAllergens(values: ProductValues, formulas: readonly FormulaDto[], ingredients: readonly IngredientDto[]): DeclaredAllergens {
  const formula = values.making === "formula" ? formulas.find((f) => f.id === values.formulaId) : undefined;
  const byId = new Map(ingredients.map((i) => [i.id, i]));
  const rows = values.making === "bought_in" ? [] : values.components;
  return declaredAllergens({
    formulaName: formula?.name ?? null,
    formula: formula?.allergens ?? [],
    components: groupComponents(rows).map((g) => ({ name: g.name, allergens: g.lines.flatMap((l) => (l.ingredientId !== null ? byId.get(l.ingredientId)?.allergens ?? [] : [])) })),
    added: values.allergens,
  });
}

const blankToNull = (s: string) => (s.trim() === "" ? null : s.trim());

/**
 * Check the form with the shared productInputSchema; the price is typed in dollars and read with
 * parseMoney. The allergens sent are the whole declaration: `derived` (from the formula and components) plus the
 * product's own. Returns the API body, or the messages per field.
 */
export function checkProduct(values: ProductValues, currency = "USD", opts: { derived?: readonly AllergenCode[]; active?: boolean } = {}): { ok: true; input: ProductInput } | { ok: false; fields: FieldErrors } {
  const priceCents = parseMoney(values.price, currency);
  const made = values.making === "formula";
  const candidate = {
    name: values.name,
    description: values.description,
    saleUnit: values.saleUnit,
    saleUnitPlural: values.saleUnitPlural,
    piecesPerUnit: values.piecesPerUnit,
    pieceGrams: values.pieceGrams,
    panName: values.panName,
    panLengthMm: values.panLengthMm,
    panWidthMm: values.panWidthMm,
    unitsPerPan: values.unitsPerPan,
    priceCents: priceCents ?? 0,
    minQuantity: values.minQuantity,
    maxQuantity: values.maxQuantity,
    leadDays: values.leadDays.trim() === "" ? null : values.leadDays,
    allergens: sortAllergens([...(opts.derived ?? []), ...values.allergens]),
    mayContain: mayContainText(values.mayContain, values.mayContainOther),
    active: opts.active ?? true,
    formulaId: made ? values.formulaId : null,
    boughtIn: values.making === "bought_in",
    bakeTempC: made ? blankToNull(values.bakeTempC) : null,
    bakeMinutes: made ? blankToNull(values.bakeMinutes) : null,
    coolMinutes: made ? blankToNull(values.coolMinutes) : null,
    components: made ? values.components.map((c) => ({ kind: c.kind, name: c.name, ingredientId: c.ingredientId, grams: c.grams.trim() === "" ? undefined : c.grams.trim(), per: c.per, note: c.note })) : [],
  };
  const checked = validate(productInputSchema, candidate);
  const fields: FieldErrors = checked.ok ? {} : { ...checked.fields };
  for (const k of ["piecesPerUnit", "pieceGrams", "panLengthMm", "panWidthMm", "unitsPerPan", "minQuantity", "maxQuantity"] as const) {
    if (values[k].trim() === "") fields[k] = "Enter a whole number.";
  }
  if (priceCents === null) fields.priceCents = values.price.trim() ? "Write the list price in dollars and cents, like 18.00." : "Enter the list price.";
  if (made && values.formulaId === null) fields.formulaId = "Choose the formula it is baked from.";
  if (made) values.components.forEach((c, i) => { if (c.grams.trim() === "") fields[`components.${i}.grams`] = "Enter the grams, e.g. 2 or 1.5."; });
  if (Object.keys(fields).length || !checked.ok) return { ok: false, fields };
  const { active: _active, ...input } = checked.data;
  return { ok: true, input };
}

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
        busy={create.isPending}
        onSubmit={(input, fail) => create.mutate({ ...input, active: true }, { onSuccess: (p) => router.replace(`/office/products/${p.id}?created=1`), onError: fail })}
      />
    </Screen>
  );
}

/** One product: the owner edits it, uploads its photo, archives it; the bookkeeper reads it. */
export function ProductDetailScreen({ id, created }: { id: number; created?: boolean }) {
  const user = useSignedInUser();
  const valid = Number.isInteger(id) && id > 0;
  const product = useProductQuery(valid ? id : null);
  const update = useUpdateProductMutation(id);
  const [saved, setSaved] = useState<string | null>(created ? "Product added. Now add a photo so buyers recognise it." : null);

  if (!valid || (product.error instanceof ApiError && product.error.status === 404)) {
    return (
      <Screen narrow testID="product-detail">
        <EmptyState icon="help-circle" title="There's no such product" testID="product-not-found" />
        <TextLink href="/office/products" label="All products" />
      </Screen>
    );
  }
  if (product.isPending) {
    return (
      <Screen narrow testID="product-detail">
        <LoadingState label="Loading the product…" />
      </Screen>
    );
  }
  if (product.isError) {
    return (
      <Screen narrow testID="product-detail">
        <TextLink href="/office/products" label="‹ All products" />
        <ErrorState error={product.error} onRetry={() => product.refetch()} retrying={product.isFetching} />
      </Screen>
    );
  }
  const p = product.data;
  const isOwner = user.role === "owner";
  return (
    <Screen narrow testID="product-detail">
      <TextLink href="/office/products" label="‹ All products" testID="back-to-products" />
      <PageHeader overline={p.active ? "On offer" : "Archived"} title={p.name} testID="product-title" />
      {saved ? <Notice message={saved} testID="product-saved" /> : null}
      {isOwner ? (
        <>
          <PhotoCard product={p} />
          <ProductForm
            key={p.id}
            initial={valuesOf(p)}
            active={p.active}
            submitLabel="Save changes"
            busy={update.isPending}
            onSubmit={(input, fail) => {
              setSaved(null);
              update.mutate(input, { onSuccess: (s) => setSaved(`${s.name} is saved.`), onError: fail });
            }}
          />
          <ArchiveCard product={p} />
        </>
      ) : (
        <ProductFacts product={p} />
      )}
    </Screen>
  );
}

function ProductFacts({ product: p }: { product: ProductDto }) {
  const money = useMoney();
  return (
    <Card title="Details" testID="product-facts">
      <ProductPhoto url={p.photoUrl} name={p.name} size={120} />
      <DetailList
        items={[
          { label: "Description", value: p.description },
          { label: "Sold as", value: `${p.saleUnit} (${p.piecesPerUnit} × ${p.pieceGrams} g)` },
          { label: "Pan", value: `${p.panName}: ${p.panLengthMm} × ${p.panWidthMm} mm (${mmToInches(p.panLengthMm)} × ${mmToInches(p.panWidthMm)}), ${p.unitsPerPan} per pan` },
          { label: "List price", value: money(p.listPriceCents) },
          { label: "Per order", value: `Minimum ${quantityText(p.minQuantity, p)}, maximum ${quantityText(p.maxQuantity, p)}` },
          { label: "Days of notice", value: p.leadDays === null ? "The bakery's usual cut-off" : `${p.leadDays} days before delivery` },
          { label: "Made", value: p.formulaId !== null ? `From the ${p.formulaName ?? "chosen"} formula` : p.boughtIn ? "Bought in / not planned" : "Not chosen yet: production cannot plan it" },
          ...(p.formulaId !== null ? [{ label: "Bake", value: bakeText(p) }] : []),
          ...(p.components.length ? [{ label: "Components", value: componentsText(p) }] : []),
          { label: "Allergens", value: p.allergens.map((a) => `${ALLERGEN_LABEL[a]} (${(p.allergenSources[a] ?? []).join(", ")})`).join("; ") || "None listed" },
          { label: "May contain", value: mayContainLabel(p.mayContain) || "Nothing listed" },
        ]}
      />
    </Card>
  );
}

/** "16 min at 177 °C, then 30 min cooling" — the product's own values or its formula's. */
export function bakeText(p: Pick<ProductDto, "bake">): string {
  const { bakeTempC, bakeMinutes, coolMinutes } = p.bake;
  if (bakeMinutes === null && bakeTempC === null && coolMinutes === null) return "No bake step in the formula";
  const oven = [bakeMinutes !== null ? `${bakeMinutes} min` : null, bakeTempC !== null ? `at ${bakeTempC} °C` : null].filter(Boolean).join(" ");
  return [oven || null, coolMinutes !== null ? `then ${coolMinutes} min cooling` : null].filter(Boolean).join(", ");
}

/** "Egg wash: Whole egg 1.2 g, Whole milk 0.3 g per piece · Toasted sesame topping: …" */
export function componentsText(p: Pick<ProductDto, "components">): string {
  return groupComponents(p.components)
    .map((g) => `${g.name}: ${g.lines.map((l) => `${l.ingredientName} ${l.grams} g per ${l.per}`).join(", ")}`)
    .join(" · ");
}

interface ProductFormProps {
  initial: ProductValues;
  submitLabel: string;
  busy: boolean;
  /** Whether the product is on offer (a new one is). */
  active?: boolean;
  onSubmit: (input: ProductInput, fail: (err: unknown) => void) => void;
}

export function ProductForm({ initial, submitLabel, busy, active = true, onSubmit }: ProductFormProps) {
  const wide = useIsWide();
  const formulas = useFormulasQuery();
  const ingredients = useIngredientsQuery();
  const [values, setValues] = useState<ProductValues>(initial);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const set = (key: keyof ProductValues) => (v: string) => setValues((s) => ({ ...s, [key]: v }));
  // The plural follows the singular while it is blank or still the suggestion; once the owner writes their own it stays.
  const setSaleUnit = (v: string) =>
    setValues((s) => ({ ...s, saleUnit: v, saleUnitPlural: s.saleUnitPlural.trim() === "" || s.saleUnitPlural === suggestPlural(s.saleUnit) ? suggestPlural(v) : s.saleUnitPlural }));
  const declared = previewAllergens(values, formulas.data ?? [], ingredients.data ?? []);
  const formula = values.making === "formula" ? formulas.data?.find((f) => f.id === values.formulaId) : undefined;
  const defaults = formulaDefaults(formula);

  const submit = () => {
    if (busy) return;
    setFormError(null);
    const checked = checkProduct(values, "USD", { derived: declared.derived, active });
    if (!checked.ok) {
      setFields(checked.fields);
      setFormError(Object.keys(checked.fields).length > 1 ? "Some fields need attention." : null);
      return;
    }
    setFields({});
    onSubmit(checked.input, (err) => {
      const split = splitError(err, formFields(values));
      setFields(split.fields);
      setFormError(split.formError);
    });
  };

  const num = (key: keyof ProductValues, label: string, extra: Partial<React.ComponentProps<typeof TextField>> = {}) => (
    <View style={[styles.cell, wide && styles.cellWide]}>
      <TextField
        label={label}
        value={values[key] as string}
        onChangeText={set(key)}
        error={fields[key]}
        inputMode="numeric"
        keyboardType="number-pad"
        testID={`product-${key}`}
        {...extra}
      />
    </View>
  );
  const fahrenheit = Number(values.bakeTempC);
  const derivedOptions = ALLERGENS.filter((a) => !declared.derived.includes(a.code));

  return (
    <Card testID="product-form">
      <FormError message={formError} testID="product-form-error" />
      <TextField label="Name" value={values.name} onChangeText={set("name")} error={fields.name} testID="product-name" autoCapitalize="sentences" />
      <TextField label="Description" optional value={values.description} onChangeText={set("description")} error={fields.description} multiline testID="product-description" />

      <AppText variant="overline" color="muted">
        How it's sold
      </AppText>
      <TextField label="Sale unit" value={values.saleUnit} onChangeText={setSaleUnit} error={fields.saleUnit} hint="What one unit on an order is, e.g. tray of 15 rolls." testID="product-saleUnit" />
      <TextField
        label="Plural of the sale unit"
        value={values.saleUnitPlural}
        onChangeText={set("saleUnitPlural")}
        error={fields.saleUnitPlural}
        hint={`How an order of more than one reads: “3 ${values.saleUnitPlural.trim() || "trays of 15 rolls"}”.`}
        testID="product-saleUnitPlural"
      />
      <View style={styles.grid}>
        {num("piecesPerUnit", "Pieces per unit")}
        {num("pieceGrams", "Piece weight (g)", { hint: "Scaled dough per piece, before baking." })}
      </View>
      <View style={styles.grid}>
        <View style={[styles.cell, wide && styles.cellWide]}>
          <TextField
            label="List price"
            value={values.price}
            onChangeText={set("price")}
            error={fields.priceCents}
            hint="Dollars, e.g. 18.00."
            inputMode="decimal"
            keyboardType="decimal-pad"
            testID="product-price"
          />
        </View>
        {num("leadDays", "Days of notice", { optional: true, hint: "Blank: usual cut-off." })}
      </View>
      <View style={styles.grid}>
        {num("minQuantity", "Minimum per order")}
        {num("maxQuantity", "Maximum per order")}
      </View>

      <AppText variant="overline" color="muted">
        Pan
      </AppText>
      <TextField label="Pan name" value={values.panName} onChangeText={set("panName")} error={fields.panName} hint="e.g. 9×13 in pan, half-sheet pan." testID="product-panName" />
      <View style={styles.grid}>
        {num("panLengthMm", "Pan length (mm)", { hint: mmToInches(Number(values.panLengthMm)) ? `= ${mmToInches(Number(values.panLengthMm))}` : "1 in = 25.4 mm" })}
        {num("panWidthMm", "Pan width (mm)", { hint: mmToInches(Number(values.panWidthMm)) ? `= ${mmToInches(Number(values.panWidthMm))}` : "1 in = 25.4 mm" })}
        {num("unitsPerPan", "Units per pan", { hint: "Sale units one pan holds." })}
      </View>

      <AppText variant="overline" color="muted">
        How it's made
      </AppText>
      <ChoiceGroup<Making>
        label="Production"
        layout="list"
        value={values.making}
        onChange={(making) => setValues((s) => ({ ...s, making }))}
        choices={[
          { value: "formula", label: "Baked here from a formula", hint: "Its dough is planned, mixed and baked on the bake day." },
          { value: "bought_in", label: "Bought in / not planned", hint: "Sold as it comes: no dough, components or bake are planned." },
        ]}
        error={values.making === null ? fields.formulaId ?? fields.boughtIn : fields.boughtIn}
        testID="product-making"
      />
      {values.making === "formula" ? (
        <>
          {formulas.isError ? (
            <FormError message={`The formulas didn't load: ${messageOf(formulas.error)}`} testID="product-formulas-error" />
          ) : (
            <InlinePicker<number>
              label="Formula"
              value={values.formulaId}
              options={(formulas.data ?? []).map((f) => ({ value: f.id, label: f.name, hint: f.allergens.length ? `Contains ${f.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}` : undefined }))}
              onChange={(formulaId) => setValues((s) => ({ ...s, formulaId }))}
              placeholder={formulas.isPending ? "Loading the formulas…" : "Choose the formula"}
              error={fields.formulaId}
              testID="product-formula"
            />
          )}
          <View style={styles.grid}>
            {num("bakeTempC", "Bake temperature (°C)", { optional: true, hint: values.bakeTempC.trim() && Number.isFinite(fahrenheit) ? `= ${Math.round(celsiusToFahrenheit(fahrenheit))} °F` : defaults.temp })}
            {num("bakeMinutes", "Bake time (min)", { optional: true, hint: defaults.bake })}
            {num("coolMinutes", "Cooling time (min)", { optional: true, hint: defaults.cool })}
          </View>

          <AppText variant="overline" color="muted">
            Components
          </AppText>
          <AppText variant="small" color="muted">
            Toppings, washes, fillings and garnishes, in grams per piece or per pan. They go on the bake day's weigh-out, the ingredient totals and the purchasing forecast, and their allergens are declared with the dough's.
          </AppText>
          {ingredients.isError ? <FormError message={`The ingredients didn't load: ${messageOf(ingredients.error)}`} testID="product-ingredients-error" /> : null}
          <ComponentRows rows={values.components} onChange={(components) => setValues((s) => ({ ...s, components }))} ingredients={ingredients.data ?? []} loading={ingredients.isPending} fields={fields} />
        </>
      ) : null}

      <AppText variant="overline" color="muted">
        Allergens
      </AppText>
      {declared.derived.length ? (
        <View style={styles.derived} testID="product-derived-allergens">
          <AppText variant="label">From the formula and components</AppText>
          <AppText variant="small" color="muted">
            Always declared: change the formula or the component to change these.
          </AppText>
          {declared.derived.map((a) => (
            <AppText key={a} testID={`product-derived-${a}`}>{`${ALLERGEN_LABEL[a]} — ${(declared.sources[a] ?? []).filter((x) => x !== ADDED_BY_BAKERY).join(", ")}`}</AppText>
          ))}
        </View>
      ) : null}
      <MultiChoice<AllergenCode>
        label={declared.derived.length ? "Also contains" : "Contains"}
        hint={
          values.making === "bought_in"
            ? "The supplier's declaration, from the fixed list (US major food allergens and the EU's 14)."
            : "Anything else it contains, from the fixed list (US major food allergens and the EU's 14)."
        }
        options={derivedOptions.map((a) => ({ value: a.code, label: a.label }))}
        value={values.allergens.filter((a) => !declared.derived.includes(a))}
        onChange={(allergens) => setValues((s) => ({ ...s, allergens }))}
        error={fields.allergens}
        testID="product-allergens"
      />
      <MultiChoice<AllergenCode>
        label="May contain (traces)"
        options={ALLERGENS.map((a) => ({ value: a.code, label: a.label }))}
        value={values.mayContain}
        onChange={(mayContain) => setValues((s) => ({ ...s, mayContain }))}
        error={fields.mayContain}
        testID="product-mayContain"
      />
      {values.mayContainOther.length ? <AppText variant="small" color="muted">{`Also noted: ${values.mayContainOther.join(", ")}`}</AppText> : null}
      {declared.declared.length || values.mayContain.length ? (
        <View style={styles.preview}>
          <AppText variant="caption" color="muted">
            Buyers see
          </AppText>
          <AllergenChips allergens={declared.declared} mayContain={mayContainText(values.mayContain, values.mayContainOther)} testID="product-allergen-preview" />
        </View>
      ) : null}

      <Button label={submitLabel} icon="check" onPress={submit} busy={busy} testID="product-save" />
    </Card>
  );
}

/** Hints for the blank bake fields: what the chosen formula's steps give. */
function formulaDefaults(formula: FormulaDto | undefined): { temp: string; bake: string; cool: string } {
  if (!formula) return { temp: "Blank: the formula's.", bake: "Blank: the formula's.", cool: "Blank: the formula's." };
  const bake = formula.steps.find((s) => s.kind === "bake");
  const cool = formula.steps.find((s) => s.kind === "cool");
  return {
    temp: bake?.temperatureC != null ? `Blank: the formula's ${bake.temperatureC} °C.` : "The formula sets none.",
    bake: bake ? `Blank: the formula's ${bake.minutes} min.` : "The formula has no bake step.",
    cool: cool ? `Blank: the formula's ${cool.minutes} min.` : "The formula has no cool step.",
  };
}

const PHOTO_MAX_BYTES = 5 * 1024 * 1024;

/** Photo upload (web): choose a file, watch it go up, see the server's answer (415 wrong type, 413 too large). */
function PhotoCard({ product }: { product: ProductDto }) {
  const upload = useUploadProductPhotoMutation(product.id);
  const input = useRef<HTMLInputElement | null>(null);
  const [localError, setLocalError] = useState<string | null>(null);
  const [done, setDone] = useState(false);

  const pick = (file: File | undefined) => {
    setDone(false);
    setLocalError(null);
    if (!file) return;
    if (file.size > PHOTO_MAX_BYTES) {
      setLocalError("The photo is larger than 5 MB. Use a smaller one.");
      return;
    }
    upload.mutate(file, { onSuccess: () => setDone(true) });
  };

  const error = localError ?? (upload.isError ? messageOf(upload.error) : null);
  return (
    <Card title="Photo" testID="photo-card">
      <View style={styles.photoRow}>
        <ProductPhoto url={product.photoUrl} name={product.name} size={96} />
        <View style={styles.flex}>
          <AppText color="muted">JPEG, PNG or WebP, up to 5 MB. A square photo on a plain background looks best.</AppText>
        </View>
      </View>
      {upload.isPending ? <ProgressBar value={upload.progress} label="Uploading the photo" testID="photo-progress" /> : null}
      {upload.isPending ? <AppText variant="small" color="muted" testID="photo-progress-text">{`Uploading… ${Math.round(upload.progress * 100)} %`}</AppText> : null}
      {done ? <Notice message="Photo saved. Buyers see it now." testID="photo-done" /> : null}
      <FormError message={error} testID="photo-error" />
      {Platform.OS === "web" ? (
        <>
          <input
            ref={input}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            style={{ display: "none" }}
            data-testid="photo-input"
            aria-label="Photo file"
            onChange={(e) => {
              pick(e.currentTarget.files?.[0]);
              e.currentTarget.value = "";
            }}
          />
          <Button label={product.photoUrl ? "Replace photo" : "Choose a photo"} icon="upload" variant="secondary" busy={upload.isPending} onPress={() => input.current?.click()} testID="photo-choose" />
        </>
      ) : (
        <AppText variant="small" color="muted">
          Upload photos from the web app on a computer.
        </AppText>
      )}
    </Card>
  );
}

function ArchiveCard({ product }: { product: ProductDto }) {
  const router = useRouter();
  const archive = useArchiveProductMutation(product.id);
  const restore = useUpdateProductMutation(product.id);
  const [confirming, setConfirming] = useState(false);
  const error = archive.error ?? restore.error;
  return (
    <Card title={product.active ? "Stop offering it" : "Archived"} testID="archive-card" action={product.active ? null : <Badge label="Archived" tone="neutral" />}>
      <AppText color="muted">
        {product.active
          ? "Archiving takes it off the buyers' list. It stays on past orders, and you can offer it again later."
          : "Buyers can't order it. Offer it again to put it back on their list."}
      </AppText>
      <FormError message={error ? messageOf(error) : null} testID="archive-error" />
      {product.active ? (
        confirming ? (
          <View style={styles.confirm}>
            <AppText variant="bodyStrong" color="dangerInk">{`Archive ${product.name}?`}</AppText>
            <View style={styles.buttons}>
              <Button
                label="Yes, archive"
                variant="danger"
                busy={archive.isPending}
                onPress={() => archive.mutate(undefined, { onSuccess: (p) => router.replace(`/office/products?archived=${encodeURIComponent(p.name)}`) })}
                testID="archive-confirm"
              />
              <Button label="Keep offering it" variant="secondary" onPress={() => setConfirming(false)} />
            </View>
          </View>
        ) : (
          <Button label="Archive product" icon="archive" variant="secondary" onPress={() => setConfirming(true)} testID="archive-product" />
        )
      ) : (
        <Button label="Offer it again" icon="rotate-ccw" variant="accent" busy={restore.isPending} onPress={() => restore.mutate({ active: true })} testID="restore-product" />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 140 },
  cellWide: { flexBasis: 150 },
  preview: { gap: space.xs, padding: space.md, backgroundColor: colors.sunken, borderRadius: radii.md },
  derived: { gap: space.xxs, padding: space.md, backgroundColor: colors.surface, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
  photoRow: { flexDirection: "row", gap: space.md, alignItems: "center" },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
