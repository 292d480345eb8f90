import React, { useRef, useState } from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { TextField } from "../../../ui/TextField";
import { FormError } from "../../../ui/FormError";
import { useZodForm } from "../../../forms/useZodForm";
import { checkedSchema } from "../../../forms/checkedSchema";
import { useIsWide } from "../../../shell/useIsWide";
import { FORMULA_FIELDS, formulaBody, liveFigures, liveProblems, type FormulaValues } from "../../../production/formulaForm";
import { ingredientOptions, type DraftChange } from "../../../production/formulaDraft";
import type { IngredientInfo } from "../../../../shared/production";
import type { FormulaInput, IngredientDto } from "../../../../shared/schemas/production";
import type { FieldErrors } from "../../../../shared/errors";
import { FiguresPanel } from "./FiguresPanel";
import { FormulaBasicsCard } from "./FormulaBasicsCard";
import { FormulaLinesCard } from "./FormulaLinesCard";
import { FormulaPasteCard } from "./FormulaPasteCard";
import { FormulaStepsCard } from "./FormulaStepsCard";
import { space } from "../../../theme";

export interface FormulaEditorProps {
  initial: FormulaValues;
  ingredients: IngredientDto[];
  infos: Map<number, IngredientInfo>;
  submitLabel: string;
  /** Existing formulas ask for a note on what changed (kept in the history). */
  askNote: boolean;
  /** Sends the checked input; a rejection shows its errors on the form. */
  onSubmit: (input: FormulaInput) => Promise<unknown>;
}

/**
 * The formula editor: baker's percentages with live figures (total, hydration, paste share, yield) and
 * the shared checks shown beside the fields as you type, so a formula that can't be baked is caught
 * before it is saved. The server checks the same again.
 */
export function FormulaEditor({ initial, ingredients, infos, submitLabel, askNote, onSubmit }: FormulaEditorProps) {
  const wide = useIsWide();
  const form = useZodForm({ schema: checkedSchema((values: FormulaValues) => formulaBody(values, infos)), initial, fields: FORMULA_FIELDS });
  const v = form.values;
  const [attempted, setAttempted] = useState(false);
  // The server's messages stand until the next edit; the checks below follow the typing.
  const edits = useRef(0);
  const [answeredAt, setAnsweredAt] = useState(-1);
  const [openRow, setOpenRow] = useState<string | null>(null);
  const opened = (key: string) => (open: boolean) => setOpenRow((cur) => (open ? key : cur === key ? null : cur));

  const live = liveProblems(v, infos, attempted);
  // After a first save attempt, every check (the shared schema's too) follows the typing.
  const checkedNow = attempted ? formulaBody(v, infos) : null;
  const fields: FieldErrors = { ...(answeredAt === edits.current ? form.errors : {}), ...(checkedNow && !checkedNow.ok ? checkedNow.fields : {}), ...live };
  const figures = liveFigures(v, infos);

  const update = (change: DraftChange) => {
    edits.current += 1;
    form.patch(change);
  };
  const submit = async () => {
    setAttempted(true);
    await form.submit(onSubmit);
    setAnsweredAt(edits.current);
  };

  const options = ingredientOptions(ingredients);
  const card = { v, fields, update };
  const basics = <FormulaBasicsCard {...card} />;
  const linesCard = <FormulaLinesCard {...card} options={options} openRow={openRow} opened={opened} />;
  const pasteCard = <FormulaPasteCard {...card} options={options} infos={infos} />;
  const stepsCard = <FormulaStepsCard {...card} openRow={openRow} opened={opened} />;
  const figuresPanel = <FiguresPanel figures={figures} hasPaste={v.pasteOn} />;
  const save = (
    <Card testID="formula-save-card">
      {askNote ? (
        <TextField label="What changed" optional hint="Kept in the history with this version." value={v.note} onChangeText={(t) => update({ note: t })} error={fields.note} maxLength={200} testID="formula-note" />
      ) : null}
      <FormError message={form.formError} testID="formula-form-error" />
      <Button label={submitLabel} icon="check" onPress={() => void submit()} busy={form.submitting} testID="formula-save" block />
    </Card>
  );

  if (wide) {
    return (
      <View style={styles.wideRow} testID="formula-form">
        <View style={styles.wideMain}>
          {basics}
          {linesCard}
          {pasteCard}
          {stepsCard}
        </View>
        <View style={styles.wideSide}>
          {figuresPanel}
          {save}
        </View>
      </View>
    );
  }
  return (
    <View style={styles.stack} testID="formula-form">
      {basics}
      {linesCard}
      {pasteCard}
      {figuresPanel}
      {stepsCard}
      {save}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  wideRow: { flexDirection: "row", gap: space.lg, alignItems: "flex-start" },
  wideMain: { flex: 2, gap: space.lg, minWidth: 0 },
  wideSide: { flex: 1, gap: space.lg, minWidth: 280 },
});
