import React from "react";
import { View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { TextField } from "../../../ui/TextField";
import { FormError, Notice } from "../../../ui/FormError";
import { AppText, Heading } from "../../../ui/Text";
import { useSaveProductionSettingsMutation, type ProductionSettingsDto } from "../../../api/production";
import { useZodForm } from "../../../forms/useZodForm";
import { SETTINGS_FIELDS, addMixer, addOven, capacitySummary, decimal, formValues, removeMixer, setMixer, settingsBody, type CrewKey } from "../../../production/settingsForm";
import { productionSettingsSchema } from "../../../../shared/schemas/production";
import { formatMass } from "../../../../shared/units";
import { OvenFields } from "./OvenFields";
import { RetardFields } from "./RetardFields";
import { settingsStyles as styles } from "./styles";

const CREW: { key: CrewKey; label: string; hint: string; field: string; testID: string }[] = [
  { key: "people", label: "People on the shift", hint: "They divide and shape together, one dough at a time.", field: "crew.people", testID: "settings-crew-people" },
  { key: "divide", label: "Dividing (person-minutes per piece)", hint: "To scale and round one piece; 0.15 is about 9 s.", field: "crew.divideMinutesPerPiece", testID: "settings-crew-divide" },
  { key: "shape", label: "Shaping (person-minutes per piece)", hint: "To shape one piece; 0.2 is 12 s.", field: "crew.shapeMinutesPerPiece", testID: "settings-crew-shape" },
  { key: "pan", label: "Panning (person-minutes per pan)", hint: "To fill and set out one pan.", field: "crew.panMinutesPerPan", testID: "settings-crew-pan" },
];

/** The settings form: checked with the API's own productionSettingsSchema, the API's messages beside the fields. */
export function SettingsForm({ initial }: { initial: ProductionSettingsDto }) {
  const save = useSaveProductionSettingsMutation();
  const form = useZodForm({ schema: productionSettingsSchema, initial: () => formValues(initial), toInput: settingsBody, fields: SETTINGS_FIELDS, manyMessage: null });
  const { values, errors, patch } = form;
  const err = (k: string) => errors[k];
  const submit = () => void form.submit((body) => save.mutateAsync(body));
  return (
    <Card testID="production-settings-form">
      <Heading level={2} variant="heading">Dispatch and the shift</Heading>
      <View style={styles.grid}>
        <View style={styles.cell}>
          <TextField label="Dispatch time" hint="24-hour, bakery time: when the vans leave." {...form.text("dispatchTime")} placeholder="06:30" autoCorrect={false} testID="settings-dispatch" />
        </View>
        <View style={styles.cell}>
          <TextField label="Shift starts" optional hint="24-hour; later than dispatch means the evening before. The plan says when a day does not fit it." {...form.text("shiftStart")} placeholder="23:30" autoCorrect={false} testID="settings-shift" />
        </View>
        <View style={styles.cell}>
          <TextField label="Packing and loading (minutes)" hint="Every step ends this long before dispatch." {...form.text("packingMinutes")} inputMode="numeric" keyboardType="number-pad" testID="settings-packing" />
        </View>
      </View>

      <Heading level={2} variant="heading">Crew</Heading>
      <View style={styles.grid}>
        {CREW.map((c) => (
          <View key={c.key} style={styles.cell}>
            <TextField label={c.label} hint={c.hint} value={values[c.key]} onChangeText={form.set(c.key)} error={err(c.field)} inputMode="decimal" keyboardType="decimal-pad" testID={c.testID} />
          </View>
        ))}
      </View>

      <Heading level={2} variant="heading">Mixers</Heading>
      <FormError message={err("mixers") ?? null} testID="settings-mixers-error" />
      {values.mixers.map((m, i) => {
        const kg = decimal(m.capacityKg);
        const oneAtATime = "One mix at a time; bigger doughs are split into mixes.";
        return (
          <View key={i} style={styles.item} testID={`settings-mixer-${i}`}>
            <View style={styles.grid}>
              <View style={styles.cell}>
                <TextField label="Name" value={m.name} onChangeText={(t) => patch(setMixer(values, i, "name", t))} error={err(`mixers.${i}.name`)} testID={`settings-mixer-${i}-name`} />
              </View>
              <View style={styles.cell}>
                <TextField
                  label="Capacity (kg of dough)"
                  hint={kg > 0 ? `= ${formatMass(kg * 1000, "us")}. ${oneAtATime}` : oneAtATime}
                  value={m.capacityKg}
                  onChangeText={(t) => patch(setMixer(values, i, "capacityKg", t))}
                  error={err(`mixers.${i}.capacityKg`)}
                  inputMode="decimal"
                  keyboardType="decimal-pad"
                  testID={`settings-mixer-${i}-capacity`}
                />
              </View>
            </View>
            {values.mixers.length > 1 ? <Button label="Remove this mixer" variant="ghost" small icon="trash-2" onPress={() => patch(removeMixer(values, i))} testID={`settings-mixer-${i}-remove`} /> : null}
          </View>
        );
      })}
      {values.mixers.length < 10 ? <Button label="Add a mixer" variant="secondary" small icon="plus" onPress={() => patch(addMixer(values))} testID="settings-mixer-add" /> : null}

      <Heading level={2} variant="heading">Ovens</Heading>
      <FormError message={err("ovens") ?? null} testID="settings-ovens-error" />
      {values.ovens.map((o, i) => (
        <OvenFields key={i} index={i} oven={o} values={values} errors={errors} onChange={patch} />
      ))}
      {values.ovens.length < 20 ? <Button label="Add an oven" variant="secondary" small icon="plus" onPress={() => patch(addOven(values))} testID="settings-oven-add" /> : null}

      <RetardFields values={values} errors={errors} onChange={patch} />

      <AppText color="muted" testID="settings-summary">{capacitySummary(values)}</AppText>
      <FormError message={form.formError} testID="production-settings-form-error" />
      {form.saved ? <Notice message="Production settings saved. Plans not yet set at their cut-off use them now; recalculate a day already set to apply them." testID="production-settings-saved" /> : null}
      <Button label="Save production settings" icon="check" onPress={submit} busy={form.submitting} testID="production-settings-save" block />
    </Card>
  );
}
