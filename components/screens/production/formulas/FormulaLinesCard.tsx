import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { TextField } from "../../../ui/TextField";
import { InlinePicker, type PickerOption } from "../../../ui/InlinePicker";
import { AppText } from "../../../ui/Text";
import { addLine, removeLine, setLine } from "../../../production/formulaDraft";
import { editorStyles, type EditorCardProps, type OpenRow } from "./editorParts";
import { RoundIconButton } from "../RoundIconButton";
import { space } from "../../../theme";

/** The ingredient lines in baker's percentages. */
export function FormulaLinesCard({ v, fields, update, options, openRow, opened }: EditorCardProps & OpenRow & { options: PickerOption<number>[] }) {
  return (
    <Card title="Ingredients" testID="formula-lines">
      <AppText variant="small" color="muted">
        {"Baker's percentages: every line is a share of the flour, and the flour lines add up to 100 %."}
      </AppText>
      {fields.lines ? (
        <AppText variant="bodyStrong" color="dangerInk" testID="formula-lines-error" accessibilityLiveRegion="polite">
          {fields.lines}
        </AppText>
      ) : null}
      <View>
        {v.lines.map((l, i) => (
          <View key={l.key} style={[styles.line, i > 0 && editorStyles.divider]} testID={`line-${i}`}>
            <View style={[styles.linePicker, openRow === l.key && editorStyles.full]}>
              <InlinePicker<number>
                onOpenChange={opened(l.key)}
                label={`Ingredient ${i + 1}`}
                hideLabel={i > 0}
                value={l.ingredientId}
                options={options}
                onChange={(id) => update(setLine(v, i, { ingredientId: id }))}
                placeholder="Choose an ingredient"
                error={fields[`lines.${i}.ingredientId`]}
                testID={`line-${i}-ingredient`}
              />
            </View>
            <View style={styles.lineRight}>
              <View style={styles.percent}>
                <TextField
                  label="Percent"
                  accessibilityLabel={`Percent for ingredient ${i + 1}`}
                  value={l.percent}
                  onChangeText={(t) => update(setLine(v, i, { percent: t }))}
                  error={fields[`lines.${i}.percent`]}
                  inputMode="decimal"
                  keyboardType="decimal-pad"
                  testID={`line-${i}-percent`}
                />
              </View>
              <RoundIconButton icon="trash-2" label={`Remove ingredient ${i + 1}`} onPress={() => update(removeLine(v, i))} testID={`line-${i}-remove`} />
            </View>
          </View>
        ))}
      </View>
      <Button label="Add an ingredient" icon="plus" variant="secondary" onPress={() => update(addLine(v))} testID="add-line" />
    </Card>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, paddingVertical: space.sm, alignItems: "flex-end" },
  linePicker: { flexGrow: 1, flexShrink: 1, flexBasis: 150, minWidth: 0 },
  lineRight: { flexDirection: "row", alignItems: "flex-end", gap: space.sm, flexGrow: 0 },
  percent: { width: 92 },
});
