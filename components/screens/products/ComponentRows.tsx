import React, { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { TextField } from "../../ui/TextField";
import { InlinePicker, type PickerOption } from "../../ui/InlinePicker";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { AppText } from "../../ui/Text";
import { COMPONENT_KINDS, COMPONENT_KIND_LABEL, type ComponentKind, type ComponentPer } from "../../../shared/components";
import { ALLERGEN_LABEL } from "../../../shared/allergens";
import type { IngredientDto } from "../../../shared/schemas/production";
import type { FieldErrors } from "../../../shared/errors";
import { nextComponentRow, type ComponentRow } from "./productForm";
import { colors, radii, space } from "../../theme";

const KIND_OPTIONS: PickerOption<ComponentKind>[] = COMPONENT_KINDS.map((k) => ({ value: k, label: COMPONENT_KIND_LABEL[k] }));

/**
 * The product's components: each row one ingredient of a topping, wash, filling or garnish, in grams per piece or
 * per pan. Rows with the same kind and name are one component ("Egg wash": egg and milk).
 */
export function ComponentRows({ rows, onChange, ingredients, loading, fields, testID = "product-components" }: {
  rows: ComponentRow[];
  onChange: (rows: ComponentRow[]) => void;
  ingredients: IngredientDto[];
  /** The library is still on its way (a chosen ingredient cannot be named yet). */
  loading?: boolean;
  fields: FieldErrors;
  testID?: string;
}) {
  const [openRow, setOpenRow] = useState<string | null>(null);
  const set = (i: number, patch: Partial<ComponentRow>) => onChange(rows.map((r, n) => (n === i ? { ...r, ...patch } : r)));
  const options: PickerOption<number>[] = [...ingredients]
    .sort((a, b) => a.name.localeCompare(b.name))
    .map((i) => ({ value: i.id, label: i.name, hint: i.allergens.length ? `Contains ${i.allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}` : undefined }));
  return (
    <View style={styles.wrap} testID={testID}>
      {rows.length === 0 ? (
        <AppText variant="small" color="muted" testID={`${testID}-empty`}>
          No toppings, washes, fillings or garnishes: the product is its dough alone.
        </AppText>
      ) : null}
      {rows.map((r, i) => {
        const id = `component-${i}`;
        return (
          <View key={r.key} style={[styles.row, i > 0 && styles.divider]} testID={id}>
            <View style={styles.head}>
              <AppText variant="label">{`Line ${i + 1}`}</AppText>
              <Pressable
                accessibilityRole="button"
                accessibilityLabel={`Remove component line ${i + 1}`}
                onPress={() => onChange(rows.filter((_, n) => n !== i))}
                testID={`${id}-remove`}
                style={({ pressed }) => [styles.remove, pressed && styles.pressed]}
              >
                <Feather name="trash-2" size={18} color={colors.crustInk} />
              </Pressable>
            </View>
            <View style={styles.grid}>
              <View style={[styles.cell, openRow === `${r.key}-kind` && styles.full]}>
                <InlinePicker<ComponentKind>
                  label="Kind"
                  value={r.kind}
                  options={KIND_OPTIONS}
                  onChange={(kind) => set(i, { kind })}
                  onOpenChange={(open) => setOpenRow(open ? `${r.key}-kind` : null)}
                  error={fields[`components.${i}.kind`]}
                  testID={`${id}-kind`}
                />
              </View>
              <View style={styles.cell}>
                <TextField
                  label="Component name"
                  optional
                  value={r.name}
                  onChangeText={(name) => set(i, { name })}
                  hint={`Blank: "${COMPONENT_KIND_LABEL[r.kind]}". Same name, same component.`}
                  placeholder="e.g. Egg wash"
                  error={fields[`components.${i}.name`]}
                  testID={`${id}-name`}
                />
              </View>
            </View>
            <View style={openRow === `${r.key}-ingredient` ? styles.full : undefined}>
              <InlinePicker<number>
                label="Ingredient"
                value={r.ingredientId}
                options={options}
                onChange={(ingredientId) => set(i, { ingredientId })}
                onOpenChange={(open) => setOpenRow(open ? `${r.key}-ingredient` : null)}
                placeholder={loading ? "Loading the ingredients…" : "Choose an ingredient"}
                error={fields[`components.${i}.ingredientId`]}
                testID={`${id}-ingredient`}
              />
            </View>
            <View style={styles.grid}>
              <View style={styles.cell}>
                <TextField
                  label="Grams"
                  value={r.grams}
                  onChangeText={(grams) => set(i, { grams })}
                  hint="To 0.1 g, as weighed out."
                  inputMode="decimal"
                  keyboardType="decimal-pad"
                  error={fields[`components.${i}.grams`]}
                  testID={`${id}-grams`}
                />
              </View>
              <View style={styles.cell}>
                <ChoiceGroup<ComponentPer>
                  label="Per"
                  value={r.per}
                  onChange={(per) => set(i, { per })}
                  choices={[{ value: "piece", label: "Per piece" }, { value: "pan", label: "Per pan" }]}
                  error={fields[`components.${i}.per`]}
                  testID={`${id}-per`}
                />
              </View>
            </View>
            <TextField label="Note" optional value={r.note} onChangeText={(note) => set(i, { note })} placeholder="e.g. Brush just before baking" error={fields[`components.${i}.note`]} testID={`${id}-note`} />
          </View>
        );
      })}
      {fields.components ? (
        <AppText variant="small" color="dangerInk" testID={`${testID}-error`}>
          {fields.components}
        </AppText>
      ) : null}
      <Button label="Add a component line" icon="plus" variant="secondary" onPress={() => onChange([...rows, nextComponentRow(rows)])} testID="add-component" />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  row: { gap: space.sm, paddingVertical: space.sm },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  head: { flexDirection: "row", alignItems: "center", justifyContent: "space-between" },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 160 },
  full: { flexBasis: "100%" },
  remove: { minWidth: 44, minHeight: 44, alignItems: "center", justifyContent: "center", borderRadius: radii.md },
  pressed: { backgroundColor: colors.crustSoft },
});
