import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { TextField } from "../../../ui/TextField";
import { FormError, Notice } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import type { PlanView } from "../../../api/production";
import { useZodForm } from "../../../forms/useZodForm";
import { checkedSchema } from "../../../forms/checkedSchema";
import { TEMP_FIELDS, checkTemps, shownTemps, storedTemps, type Temps } from "../../../production/temperatures";
import type { Units } from "../../../production/units";
import { space } from "../../../theme";

export interface TemperaturesCardProps {
  plan: PlanView;
  units: Units;
  /** A save of the day is on its way with these temperatures. */
  busy: boolean;
  /** Saves them with the day; rejects with the server's answer, shown on this card. */
  onSave: (temps: Temps) => Promise<unknown>;
  saved: boolean;
}

/**
 * Room, flour and paste temperatures (the liquid temperatures on the cards are worked out from them), and the tap
 * water and milk as they come (the ice and chilling on the cards are worked out from those).
 */
export function TemperaturesCard({ plan, units, busy, onSave, saved }: TemperaturesCardProps) {
  const stored = storedTemps(plan.inputs);
  const shown = shownTemps(stored, units);
  const form = useZodForm({ schema: checkedSchema((values: typeof shown) => checkTemps(values, shown, stored, units)), initial: shown, manyMessage: null });
  const submit = () => void form.submit(onSave);
  return (
    <Card title="Temperatures" testID="temperatures">
      <AppText variant="small" color="muted">
        {`Measure before weighing. The liquid temperature on each card comes from these and the dough's target; the ice for the water, or how cold the milk must be, from the tap water and milk.${plan.frozen ? " Saving recalculates the plan set at the cut-off." : ""}`}
      </AppText>
      <View style={styles.temps}>
        {TEMP_FIELDS.map((f) => (
          <View key={f.key} style={styles.tempCell}>
            <TextField
              label={`${f.label} (${units.tempUnit})`}
              hint={f.hint}
              {...form.text(f.key)}
              inputMode="decimal"
              keyboardType="numbers-and-punctuation"
              onSubmitEditing={submit}
              testID={f.testID}
            />
          </View>
        ))}
      </View>
      <FormError message={form.formError} testID="temps-error" />
      {saved ? <Notice message="Temperatures saved. Liquid temperatures are updated." testID="temps-saved" /> : null}
      <Button label="Save temperatures" icon="thermometer" onPress={submit} busy={busy || form.submitting} testID="temps-save" />
    </Card>
  );
}

const styles = StyleSheet.create({
  temps: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  tempCell: { flexGrow: 1, flexBasis: 150 },
});
