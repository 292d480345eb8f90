import React from "react";
import { View } from "react-native";
import { TextField } from "../../ui/TextField";
import { AppText } from "../../ui/Text";
import { mmToInches } from "../../ordering/pan";
import { withSaleUnit } from "./productForm";
import type { ProductFormState } from "./useProductForm";
import { FieldCell, NumberField } from "./NumberField";
import { formStyles as styles } from "./formStyles";

/** "= 13 in" under a pan side while it holds a length. */
const inchesHint = (typed: string) => (mmToInches(Number(typed)) ? `= ${mmToInches(Number(typed))}` : "1 in = 25.4 mm");

/** How it's sold (sale unit, pieces, price, notice, order limits) and the pan it is baked in. */
export function ProductSoldSection({ form }: { form: ProductFormState }) {
  const { values, errors } = form;
  return (
    <>
      <AppText variant="overline" color="muted">
        How it's sold
      </AppText>
      <TextField
        label="Sale unit"
        value={values.saleUnit}
        onChangeText={(t) => form.patch(withSaleUnit(values, t))}
        error={errors.saleUnit}
        hint="What one unit on an order is, e.g. tray of 15 rolls."
        testID="product-saleUnit"
      />
      <TextField
        label="Plural of the sale unit"
        {...form.text("saleUnitPlural")}
        hint={`How an order of more than one reads: “3 ${values.saleUnitPlural.trim() || "trays of 15 rolls"}”.`}
        testID="product-saleUnitPlural"
      />
      <View style={styles.grid}>
        <NumberField form={form} name="piecesPerUnit" label="Pieces per unit" />
        <NumberField form={form} name="pieceGrams" label="Piece weight (g)" hint="Scaled dough per piece, before baking." />
      </View>
      <View style={styles.grid}>
        <FieldCell>
          <TextField
            label="List price"
            value={values.price}
            onChangeText={form.set("price")}
            error={errors.priceCents}
            hint="Dollars, e.g. 18.00."
            inputMode="decimal"
            keyboardType="decimal-pad"
            testID="product-price"
          />
        </FieldCell>
        <NumberField form={form} name="leadDays" label="Days of notice" optional hint="Blank: usual cut-off." />
      </View>
      <View style={styles.grid}>
        <NumberField form={form} name="minQuantity" label="Minimum per order" />
        <NumberField form={form} name="maxQuantity" label="Maximum per order" />
      </View>

      <AppText variant="overline" color="muted">
        Pan
      </AppText>
      <TextField label="Pan name" {...form.text("panName")} hint="e.g. 9×13 in pan, half-sheet pan." testID="product-panName" />
      <View style={styles.grid}>
        <NumberField form={form} name="panLengthMm" label="Pan length (mm)" hint={inchesHint(values.panLengthMm)} />
        <NumberField form={form} name="panWidthMm" label="Pan width (mm)" hint={inchesHint(values.panWidthMm)} />
        <NumberField form={form} name="unitsPerPan" label="Units per pan" hint="Sale units one pan holds." />
      </View>
    </>
  );
}
