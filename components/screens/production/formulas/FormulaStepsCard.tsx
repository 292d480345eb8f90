import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { TextField } from "../../../ui/TextField";
import { InlinePicker } from "../../../ui/InlinePicker";
import { AppText } from "../../../ui/Text";
import { addStep, fahrenheitHint, moveStep, removeStep, setStep, setStepKind } from "../../../production/formulaDraft";
import { STEP_KINDS, STEP_LABELS, type StepKind } from "../../../../shared/production";
import { editorStyles, type EditorCardProps, type OpenRow } from "./editorParts";
import { RoundIconButton } from "../RoundIconButton";
import { space } from "../../../theme";

const STEP_OPTIONS = STEP_KINDS.map((k) => ({ value: k, label: STEP_LABELS[k] }));

/** The steps in order, with minutes each; the bake takes the oven temperature. */
export function FormulaStepsCard({ v, fields, update, openRow, opened }: EditorCardProps & OpenRow) {
  const move = (i: number, by: -1 | 1) => {
    const change = moveStep(v, i, by);
    if (change) update(change);
  };
  return (
    <Card title="Steps" testID="formula-steps">
      <AppText variant="small" color="muted">
        In order, with minutes each. The timeline is scheduled back from dispatch; the bake takes the oven temperature.
      </AppText>
      {v.steps.length === 0 ? (
        <AppText color="muted" testID="steps-empty">
          No steps yet: the timeline stays empty for this dough.
        </AppText>
      ) : null}
      <View>
        {v.steps.map((s, i) => (
          <View key={s.key} style={[styles.step, i > 0 && editorStyles.divider]} testID={`step-${i}`}>
            <View style={[styles.stepKind, openRow === s.key && editorStyles.full]}>
              <InlinePicker<StepKind>
                onOpenChange={opened(s.key)}
                label={`Step ${i + 1}`}
                value={s.kind}
                options={STEP_OPTIONS}
                onChange={(kind) => update(setStepKind(v, i, kind))}
                error={fields[`steps.${i}.kind`]}
                testID={`step-${i}-kind`}
              />
            </View>
            <View style={styles.stepRight}>
              <View style={styles.minutes}>
                <TextField
                  label="Minutes"
                  accessibilityLabel={`Minutes for step ${i + 1}`}
                  value={s.minutes}
                  onChangeText={(t) => update(setStep(v, i, { minutes: t }))}
                  error={fields[`steps.${i}.minutes`]}
                  inputMode="numeric"
                  keyboardType="number-pad"
                  testID={`step-${i}-minutes`}
                />
              </View>
              {s.kind === "bake" ? (
                <View style={styles.minutes}>
                  <TextField
                    label="Oven (°C)"
                    accessibilityLabel={`Oven temperature for step ${i + 1}`}
                    hint={fahrenheitHint(s.temperatureC)}
                    value={s.temperatureC}
                    onChangeText={(t) => update(setStep(v, i, { temperatureC: t }))}
                    error={fields[`steps.${i}.temperatureC`]}
                    inputMode="numeric"
                    keyboardType="number-pad"
                    testID={`step-${i}-temp`}
                  />
                </View>
              ) : null}
              <View style={styles.stepButtons}>
                <RoundIconButton icon="arrow-up" label={`Move step ${i + 1} earlier`} disabled={i === 0} onPress={() => move(i, -1)} testID={`step-${i}-up`} />
                <RoundIconButton icon="arrow-down" label={`Move step ${i + 1} later`} disabled={i === v.steps.length - 1} onPress={() => move(i, 1)} testID={`step-${i}-down`} />
                <RoundIconButton icon="trash-2" label={`Remove step ${i + 1}`} onPress={() => update(removeStep(v, i))} testID={`step-${i}-remove`} />
              </View>
            </View>
          </View>
        ))}
      </View>
      <Button label="Add a step" icon="plus" variant="secondary" onPress={() => update(addStep(v))} testID="add-step" />
    </Card>
  );
}

const styles = StyleSheet.create({
  step: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, paddingVertical: space.sm, alignItems: "flex-end" },
  stepKind: { flexGrow: 1, flexShrink: 1, flexBasis: 180, minWidth: 0 },
  stepRight: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", gap: space.sm, flexShrink: 1, maxWidth: "100%" },
  minutes: { width: 110 },
  stepButtons: { flexDirection: "row", gap: space.xs, paddingBottom: 2 },
});
