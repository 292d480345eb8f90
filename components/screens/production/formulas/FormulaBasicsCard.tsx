import React from "react";
import { View } from "react-native";
import { Card } from "../../../ui/Card";
import { TextField } from "../../../ui/TextField";
import { fahrenheitHint } from "../../../production/formulaDraft";
import { liveWarnings, type FormulaValues } from "../../../production/formulaForm";
import { FieldWarning, editorStyles as styles, type EditorCardProps } from "./editorParts";

type Key = "lossPercent" | "ddtC" | "frictionC" | "targetInternalC";

/** The dough's name, loss allowance and temperatures. */
export function FormulaBasicsCard({ v, fields, update }: EditorCardProps) {
  // Values that can be saved but look like a mistake (a °F friction habit): said beside the field, not refused.
  const warnings = liveWarnings(v);
  const decimalField = (key: Key) => ({
    value: v[key],
    onChangeText: (t: string) => update({ [key]: t } as Partial<FormulaValues>),
    error: fields[key],
    inputMode: "decimal" as const,
    keyboardType: "decimal-pad" as const,
  });
  return (
    <Card title="Dough" testID="formula-basics">
      <TextField label="Name" value={v.name} onChangeText={(t) => update({ name: t })} error={fields.name} autoCapitalize="sentences" testID="formula-name" />
      <View style={styles.grid}>
        <View style={styles.cellSmall}>
          <TextField label="Loss allowance (%)" hint="Scaling and bench loss." {...decimalField("lossPercent")} testID="formula-loss" />
        </View>
        <View style={styles.cellSmall}>
          <TextField label="Desired dough temperature (°C)" hint={fahrenheitHint(v.ddtC) ?? "The target after mixing."} {...decimalField("ddtC")} testID="formula-ddt" />
        </View>
        <View style={styles.cellSmall}>
          <TextField
            label="Friction factor (°C)"
            hint="In °C: the factor that makes the measured dough temperature come out. From a mix you measured: target × factors − room − flour − liquid (− paste)."
            {...decimalField("frictionC")}
            testID="formula-friction"
          />
          {warnings.frictionC && !fields.frictionC ? <FieldWarning text={warnings.frictionC} testID="formula-friction-warning" /> : null}
        </View>
        <View style={styles.cellSmall}>
          <TextField label="Target internal temperature (°C)" optional hint={fahrenheitHint(v.targetInternalC) ?? "In the center of the loaf when it is done."} {...decimalField("targetInternalC")} testID="formula-internal" />
        </View>
      </View>
    </Card>
  );
}
