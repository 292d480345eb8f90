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
import { ApiError, messageOf } from "../../api/client";
import { splitError, validate } from "../../forms/errors";
import { mmToInches } from "../../ordering/pan";
import { mayContainLabel, mayContainParts, mayContainText } from "../../ordering/allergens";
import { AllergenChips, ProductPhoto, useMoney } from "../ordering/parts";
import { useIsWide } from "../../shell/useIsWide";
import { ALLERGENS, ALLERGEN_LABEL, type AllergenCode } from "../../../shared/allergens";
import { parseMoney, toDecimal } from "../../../shared/money";
import { productInputSchema, type ProductDto, type ProductInput } from "../../../shared/schemas/catalog";
import type { FieldErrors } from "../../../shared/errors";
import { colors, radii, space } from "../../theme";

export interface ProductValues {
  name: string;
  description: string;
  saleUnit: string;
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
  allergens: AllergenCode[];
  mayContain: AllergenCode[];
  /** Anything in "may contain" that isn't an allergen code, kept as it was. */
  mayContainOther: string[];
}

const FIELDS = ["name", "description", "saleUnit", "piecesPerUnit", "pieceGrams", "panName", "panLengthMm", "panWidthMm", "unitsPerPan", "priceCents", "minQuantity", "maxQuantity", "leadDays", "allergens", "mayContain"] as const;

export const EMPTY_PRODUCT: ProductValues = {
  name: "",
  description: "",
  saleUnit: "",
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
  allergens: [],
  mayContain: [],
  mayContainOther: [],
};

export function valuesOf(p: ProductDto, currency = "USD"): ProductValues {
  const traces = mayContainParts(p.mayContain);
  return {
    name: p.name,
    description: p.description,
    saleUnit: p.saleUnit,
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
    allergens: p.allergens,
    mayContain: traces.codes,
    mayContainOther: traces.other,
  };
}

/**
 * Check the form with the shared productInputSchema; the price is typed in dollars and read with
 * parseMoney. Returns the API body, or the messages per field.
 */
export function checkProduct(values: ProductValues, currency = "USD"): { ok: true; input: ProductInput } | { ok: false; fields: FieldErrors } {
  const priceCents = parseMoney(values.price, currency);
  const candidate = {
    name: values.name,
    description: values.description,
    saleUnit: values.saleUnit,
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
    allergens: values.allergens,
    mayContain: mayContainText(values.mayContain, values.mayContainOther),
  };
  const checked = validate(productInputSchema, candidate);
  const fields: FieldErrors = checked.ok ? {} : { ...checked.fields };
  for (const k of ["piecesPerUnit", "pieceGrams", "panLengthMm", "panWidthMm", "unitsPerPan", "minQuantity", "maxQuantity"] as const) {
    if (values[k].trim() === "") fields[k] = "Enter a whole number.";
  }
  if (priceCents === null) fields.priceCents = values.price.trim() ? "Write the price in dollars and cents, like 18.00." : "Enter the price.";
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
          { label: "Per order", value: `${p.minQuantity} to ${p.maxQuantity}` },
          { label: "Notice", value: p.leadDays === null ? "The bakery's usual cut-off" : `${p.leadDays} days before delivery` },
          { label: "Allergens", value: p.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ") || "None listed" },
          { label: "May contain", value: mayContainLabel(p.mayContain) || "Nothing listed" },
        ]}
      />
    </Card>
  );
}

interface ProductFormProps {
  initial: ProductValues;
  submitLabel: string;
  busy: boolean;
  onSubmit: (input: ProductInput, fail: (err: unknown) => void) => void;
}

export function ProductForm({ initial, submitLabel, busy, onSubmit }: ProductFormProps) {
  const wide = useIsWide();
  const [values, setValues] = useState<ProductValues>(initial);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const set = (key: keyof ProductValues) => (v: string) => setValues((s) => ({ ...s, [key]: v }));

  const submit = () => {
    if (busy) return;
    setFormError(null);
    const checked = checkProduct(values);
    if (!checked.ok) {
      setFields(checked.fields);
      setFormError(Object.keys(checked.fields).length > 1 ? "Some fields need attention." : null);
      return;
    }
    setFields({});
    onSubmit(checked.input, (err) => {
      const split = splitError(err, FIELDS);
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

  return (
    <Card testID="product-form">
      <FormError message={formError} testID="product-form-error" />
      <TextField label="Name" value={values.name} onChangeText={set("name")} error={fields.name} testID="product-name" autoCapitalize="sentences" />
      <TextField label="Description" optional value={values.description} onChangeText={set("description")} error={fields.description} multiline testID="product-description" />

      <AppText variant="overline" color="muted">
        How it's sold
      </AppText>
      <TextField label="Sale unit" value={values.saleUnit} onChangeText={set("saleUnit")} error={fields.saleUnit} hint="What one unit on an order is, e.g. tray of 15 rolls." testID="product-saleUnit" />
      <View style={styles.grid}>
        {num("piecesPerUnit", "Pieces per unit")}
        {num("pieceGrams", "Piece weight (g)")}
      </View>
      <View style={styles.grid}>
        <View style={[styles.cell, wide && styles.cellWide]}>
          <TextField
            label="Price (list)"
            value={values.price}
            onChangeText={set("price")}
            error={fields.priceCents}
            hint="Dollars, e.g. 18.00."
            inputMode="decimal"
            keyboardType="decimal-pad"
            testID="product-price"
          />
        </View>
        {num("leadDays", "Notice (days)", { optional: true, hint: "Blank: usual cut-off." })}
      </View>
      <View style={styles.grid}>
        {num("minQuantity", "Least per order")}
        {num("maxQuantity", "Most per order")}
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
        Allergens
      </AppText>
      <MultiChoice<AllergenCode>
        label="Contains"
        hint="Choose from the fixed list (US major food allergens and the EU's 14)."
        options={ALLERGENS.map((a) => ({ value: a.code, label: a.label }))}
        value={values.allergens}
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
      {values.allergens.length || values.mayContain.length ? (
        <View style={styles.preview}>
          <AppText variant="caption" color="muted">
            Buyers see
          </AppText>
          <AllergenChips allergens={values.allergens} mayContain={mayContainText(values.mayContain, values.mayContainOther)} testID="product-allergen-preview" />
        </View>
      ) : null}

      <Button label={submitLabel} icon="check" onPress={submit} busy={busy} testID="product-save" />
    </Card>
  );
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
  photoRow: { flexDirection: "row", gap: space.md, alignItems: "center" },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
