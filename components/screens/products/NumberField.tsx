import React from "react";
import { View } from "react-native";
import { TextField, type TextFieldProps } from "../../ui/TextField";
import { useIsWide } from "../../shell/useIsWide";
import type { NumberKey } from "./productForm";
import type { ProductFormState } from "./useProductForm";
import { formStyles as styles } from "./formStyles";

/** One cell of a row of product fields. */
export function FieldCell({ children }: { children: React.ReactNode }) {
  const wide = useIsWide();
  return <View style={[styles.cell, wide && styles.cellWide]}>{children}</View>;
}

/** A whole-number field of the product form, in its cell ("product-<name>"). */
export function NumberField({ form, name, label, ...extra }: { form: ProductFormState; name: NumberKey; label: string } & Partial<TextFieldProps>) {
  return (
    <FieldCell>
      <TextField label={label} {...form.text(name)} inputMode="numeric" keyboardType="number-pad" testID={`product-${name}`} {...extra} />
    </FieldCell>
  );
}
