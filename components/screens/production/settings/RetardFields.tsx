import React from "react";
import { View } from "react-native";
import { TextField } from "../../../ui/TextField";
import { TickBox } from "../../../ui/TickBox";
import { FormError } from "../../../ui/FormError";
import { AppText, Heading } from "../../../ui/Text";
import { useFormulasQuery } from "../../../api/formulas";
import { retardIndex, setRetard, type SettingsFormValues } from "../../../production/settingsForm";
import type { FieldErrors } from "../../../../shared/errors";
import { settingsStyles as styles } from "./styles";

/** Which formulas wait overnight in the retarder, and how long. */
export function RetardFields({ values, errors, onChange }: { values: SettingsFormValues; errors: FieldErrors; onChange: (changes: Partial<SettingsFormValues>) => void }) {
  const formulas = useFormulasQuery();
  return (
    <>
      <Heading level={2} variant="heading">Overnight cold retard</Heading>
      <AppText color="muted">A retarded dough is mixed and shaped the day before; the shaped pans wait in the retarder and are proofed and baked on the day. Common practice: about 2–4 °C for 8–16 h.</AppText>
      {formulas.isError ? <FormError message="The formulas didn't load, so retarding cannot be changed now." testID="settings-retard-error" /> : null}
      {(formulas.data ?? []).map((f) => {
        const on = values.retard[f.id] !== undefined;
        return (
          <View key={f.id} style={styles.retardRow} testID={`settings-retard-${f.id}`}>
            <TickBox label={f.name} accessibilityLabel={`Retard ${f.name} overnight`} checked={on} onChange={(c) => onChange(setRetard(values, f.id, c))} testID={`settings-retard-${f.id}-on`} />
            {on ? (
              <View style={styles.cell}>
                <TextField
                  label="Hours in the retarder"
                  value={values.retard[f.id]}
                  onChangeText={(t) => onChange({ retard: { ...values.retard, [f.id]: t } })}
                  error={errors[`retard.${retardIndex(values, f.id)}.hours`]}
                  inputMode="decimal"
                  keyboardType="decimal-pad"
                  testID={`settings-retard-${f.id}-hours`}
                />
              </View>
            ) : null}
          </View>
        );
      })}
      <FormError message={errors.retard ?? null} testID="settings-retard-field-error" />
    </>
  );
}
