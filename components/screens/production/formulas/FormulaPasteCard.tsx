import React from "react";
import { View } from "react-native";
import { Card } from "../../../ui/Card";
import { TextField } from "../../../ui/TextField";
import { InlinePicker, type PickerOption } from "../../../ui/InlinePicker";
import { TickBox } from "../../../ui/TickBox";
import { AppText } from "../../../ui/Text";
import { fahrenheitHint, linesOfKind, setPaste, setPasteOn } from "../../../production/formulaDraft";
import type { PasteValues } from "../../../production/formulaForm";
import type { IngredientInfo } from "../../../../shared/production";
import { editorStyles as styles, type EditorCardProps } from "./editorParts";

type NumberKey = "flourPercent" | "liquidRatio" | "cookToC";

/** The paste cooks one flour line and one liquid line of the formula. */
const COOKED = [
  { kind: "flour", key: "flourIngredientId", label: "Flour to cook", placeholder: "Choose a flour line", testID: "paste-flour" },
  { kind: "liquid", key: "liquidIngredientId", label: "Liquid to cook", placeholder: "Choose a liquid line", testID: "paste-liquid" },
] as const;

/** Part of the flour cooked with part of the liquid before the final mix. */
export function FormulaPasteCard({ v, fields, update, options, infos }: EditorCardProps & { options: PickerOption<number>[]; infos: Map<number, IngredientInfo> }) {
  const numberField = (key: NumberKey) => ({
    value: v.paste[key],
    onChangeText: (t: string) => update(setPaste(v, { [key]: t } as Partial<PasteValues>)),
    error: fields[`paste.${key}`],
    inputMode: "decimal" as const,
    keyboardType: "decimal-pad" as const,
  });
  return (
    <Card title="Cooked paste" testID="formula-paste">
      <AppText variant="small" color="muted">
        Part of the flour is cooked with part of the liquid into a paste before the final mix. It comes out of those lines, not on top.
      </AppText>
      <TickBox label="This dough uses a cooked paste" checked={v.pasteOn} onChange={(on) => update(setPasteOn(v, on))} testID="paste-toggle" />
      {v.pasteOn ? (
        <>
          <View style={styles.grid}>
            {COOKED.map((c) => (
              <View key={c.kind} style={styles.cell}>
                <InlinePicker<number>
                  label={c.label}
                  value={v.paste[c.key]}
                  options={linesOfKind(v, infos, options, c.kind)}
                  onChange={(id) => update(setPaste(v, { [c.key]: id }))}
                  placeholder={c.placeholder}
                  error={fields[`paste.${c.key}`]}
                  testID={c.testID}
                />
              </View>
            ))}
          </View>
          <View style={styles.grid}>
            <View style={styles.cellSmall}>
              <TextField label="Share of flour cooked (%)" hint="Of all the flour." {...numberField("flourPercent")} testID="paste-share" />
            </View>
            <View style={styles.cellSmall}>
              <TextField label="Liquid-to-flour ratio" hint="5 means 5 g liquid per 1 g flour." {...numberField("liquidRatio")} testID="paste-ratio" />
            </View>
            <View style={styles.cellSmall}>
              <TextField label="Cook-to temperature (°C)" hint={fahrenheitHint(v.paste.cookToC) ?? "60–70 °C, usually 65 °C: the starch must gelatinize."} {...numberField("cookToC")} testID="paste-cook" />
            </View>
          </View>
        </>
      ) : null}
    </Card>
  );
}
