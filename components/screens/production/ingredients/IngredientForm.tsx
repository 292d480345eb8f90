import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { ChoiceGroup } from "../../../ui/ChoiceGroup";
import { MultiChoice } from "../../../ui/MultiChoice";
import { TextField } from "../../../ui/TextField";
import { FormError } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import { ApiError } from "../../../api/client";
import { useZodForm } from "../../../forms/useZodForm";
import { checkedSchema } from "../../../forms/checkedSchema";
import { INGREDIENT_FIELDS, checkIngredient, type IngredientValues } from "../../../production/ingredientForm";
import { KIND_LABEL } from "../../../production/ingredientKinds";
import { ALLERGENS, type AllergenCode } from "../../../../shared/allergens";
import { INGREDIENT_KINDS, type IngredientKind } from "../../../../shared/production";
import type { IngredientInput } from "../../../../shared/schemas/production";
import { formatMass } from "../../../../shared/units";
import { space } from "../../../theme";

const schema = checkedSchema(checkIngredient);

/** A name another ingredient has is said beside the name, not at the top. */
async function nameTakenBesideName(send: () => Promise<unknown>): Promise<void> {
  try {
    await send();
  } catch (err) {
    if (err instanceof ApiError && err.code === "name_taken") throw new ApiError(err.status, err.code, err.message, { name: err.message });
    throw err;
  }
}

export interface IngredientFormProps {
  initial: IngredientValues;
  submitLabel: string;
  /** Sends the checked input; a rejection shows its errors on the form. */
  onSubmit: (input: IngredientInput) => Promise<unknown>;
}

export function IngredientForm({ initial, submitLabel, onSubmit }: IngredientFormProps) {
  const form = useZodForm({ schema, initial, fields: INGREDIENT_FIELDS });
  const { values: v, errors: fields } = form;
  const grams = Number(v.packGrams);
  const submit = () => void form.submit((input) => nameTakenBesideName(() => onSubmit(input)));
  return (
    <Card testID="ingredient-form">
      <FormError message={form.formError} testID="ingredient-form-error" />
      <TextField label="Name" {...form.text("name")} autoCapitalize="sentences" testID="ingredient-name" />
      <ChoiceGroup<IngredientKind>
        label="Kind"
        choices={INGREDIENT_KINDS.map((k) => ({ value: k, label: KIND_LABEL[k] }))}
        value={v.kind}
        onChange={form.set("kind")}
        error={fields.kind}
        testID="ingredient-kind"
      />
      <TextField
        label="Water content (%)"
        hint="Of its weight: milk about 87, butter 16, egg 76, flour 12. Used for effective hydration."
        {...form.text("waterPercent")}
        inputMode="decimal"
        keyboardType="decimal-pad"
        testID="ingredient-water"
      />
      <MultiChoice<AllergenCode>
        label="Allergens"
        hint="From the fixed list; products made from a formula with this ingredient carry them."
        options={ALLERGENS.map((a) => ({ value: a.code, label: a.label }))}
        value={v.allergens}
        onChange={form.set("allergens")}
        error={fields.allergens}
        testID="ingredient-allergens"
      />
      <AppText variant="overline" color="muted">
        Purchase pack
      </AppText>
      <TextField label="Pack" hint="How it is bought, e.g. 25 kg sack, 1 gal jug." {...form.text("packName")} testID="ingredient-pack" />
      <View style={styles.grid}>
        <View style={styles.cell}>
          <TextField
            label="Pack weight (g)"
            hint={grams > 0 ? `= ${formatMass(grams, "us")}` : "0 = not bought (tap water)."}
            {...form.text("packGrams")}
            inputMode="numeric"
            keyboardType="number-pad"
            testID="ingredient-pack-grams"
          />
        </View>
        <View style={styles.cell}>
          <TextField
            label="Pack cost"
            hint="Dollars, e.g. 24.50."
            value={v.packCost}
            onChangeText={form.set("packCost")}
            error={fields.packCostCents}
            inputMode="decimal"
            keyboardType="decimal-pad"
            testID="ingredient-pack-cost"
          />
        </View>
      </View>
      <Button label={submitLabel} icon="check" onPress={submit} busy={form.submitting} testID="ingredient-save" />
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 160 },
});
