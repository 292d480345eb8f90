import React, { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { InlinePicker, type PickerOption } from "../../ui/InlinePicker";
import { TickBox } from "../../ui/TickBox";
import { FormError } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { splitError } from "../../forms/errors";
import { useIsWide } from "../../shell/useIsWide";
import {
  DEFAULT_PASTE,
  formulaBody,
  formulaFieldKeys,
  liveFigures,
  liveProblems,
  liveWarnings,
  newKey,
  type FormulaValues,
  type LineValue,
  type StepValue,
} from "../../production/formulaForm";
import { formatPercent } from "../../production/units";
import { STEP_KINDS, STEP_LABELS, type FormulaFigures, type IngredientInfo, type StepKind } from "../../../shared/production";
import { celsiusToFahrenheit } from "../../../shared/units";
import { formatNum } from "../../format";
import type { FormulaInput, IngredientDto } from "../../../shared/schemas/production";
import type { FieldErrors } from "../../../shared/errors";
import { colors, fonts, layout, radii, space } from "../../theme";

export const KIND_LABEL: Record<string, string> = {
  flour: "Flour",
  liquid: "Liquid",
  fat: "Fat",
  sugar: "Sugar",
  salt: "Salt",
  leavening: "Leavening",
  egg: "Egg",
  inclusion: "Inclusion",
  other: "Other",
};

/** Flour first, then what is usually weighed with it. */
const KIND_ORDER: string[] = ["flour", "liquid", "egg", "fat", "sugar", "salt", "leavening", "inclusion", "other"];

const fahrenheitHint = (typed: string) => {
  const n = Number(typed.trim().replace(",", "."));
  return typed.trim() !== "" && Number.isFinite(n) ? `= ${Math.round(celsiusToFahrenheit(n))} °F` : undefined;
};

export interface FormulaEditorProps {
  initial: FormulaValues;
  ingredients: IngredientDto[];
  infos: Map<number, IngredientInfo>;
  submitLabel: string;
  busy: boolean;
  /** Existing formulas ask for a note on what changed (kept in the history). */
  askNote: boolean;
  onSubmit: (input: FormulaInput, fail: (err: unknown) => void) => void;
}

/**
 * The formula editor: baker's percentages with live figures (total, hydration, paste share, yield) and
 * the shared checks shown beside the fields as you type, so a formula that can't be baked is caught
 * before it is saved. The server checks the same again.
 */
export function FormulaEditor({ initial, ingredients, infos, submitLabel, busy, askNote, onSubmit }: FormulaEditorProps) {
  const wide = useIsWide();
  const [v, setV] = useState<FormulaValues>(initial);
  const [attempted, setAttempted] = useState(false);
  const [serverFields, setServerFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  // The row whose picker is open takes the full width, so its options have room.
  const [openRow, setOpenRow] = useState<string | null>(null);
  const opened = (key: string) => (open: boolean) => setOpenRow((cur) => (open ? key : cur === key ? null : cur));

  const live = liveProblems(v, infos, attempted);
  // After a first save attempt, every check (the shared schema's too) follows the typing.
  const checkedNow = attempted ? formulaBody(v, infos) : null;
  const fields: FieldErrors = { ...serverFields, ...(checkedNow && !checkedNow.ok ? checkedNow.fields : {}), ...live };
  const figures = liveFigures(v, infos);
  // Values that can be saved but look like a mistake (a °F friction habit): said beside the field, not refused.
  const warnings = liveWarnings(v);

  const update = (patch: Partial<FormulaValues>) => {
    setServerFields({});
    setV((s) => ({ ...s, ...patch }));
  };
  const setLine = (i: number, patch: Partial<LineValue>) => update({ lines: v.lines.map((l, n) => (n === i ? { ...l, ...patch } : l)) });
  const setStep = (i: number, patch: Partial<StepValue>) => update({ steps: v.steps.map((s, n) => (n === i ? { ...s, ...patch } : s)) });
  const moveStep = (i: number, by: -1 | 1) => {
    const j = i + by;
    if (j < 0 || j >= v.steps.length) return;
    const steps = [...v.steps];
    [steps[i], steps[j]] = [steps[j], steps[i]];
    update({ steps });
  };

  const submit = () => {
    if (busy) return;
    setAttempted(true);
    setFormError(null);
    const checked = formulaBody(v, infos);
    if (!checked.ok) {
      setFormError(Object.keys(checked.fields).length > 1 ? "Some fields need attention." : null);
      return;
    }
    onSubmit(checked.input, (err) => {
      const split = splitError(err, formulaFieldKeys(v));
      setServerFields(split.fields);
      setFormError(split.formError);
    });
  };

  const options: PickerOption<number>[] = [...ingredients]
    .sort((a, b) => KIND_ORDER.indexOf(a.kind) - KIND_ORDER.indexOf(b.kind) || a.name.localeCompare(b.name))
    .map((i) => ({ value: i.id, label: i.name, hint: KIND_LABEL[i.kind] }));
  const inFormula = (kind: string) => v.lines.filter((l) => l.ingredientId !== null && infos.get(l.ingredientId)?.kind === kind).map((l) => options.find((o) => o.value === l.ingredientId)!).filter(Boolean);

  const figuresPanel = <FiguresPanel figures={figures} hasPaste={v.pasteOn} />;

  const linesCard = (
    <Card title="Ingredients" testID="formula-lines">
      <AppText variant="small" color="muted">
        {"Baker's percentages: every line is a share of the flour, and the flour lines add up to 100 %."}
      </AppText>
      {fields.lines ? (
        <AppText variant="bodyStrong" color="dangerInk" testID="formula-lines-error" accessibilityLiveRegion="polite">
          {fields.lines}
        </AppText>
      ) : null}
      <View style={styles.lines}>
        {v.lines.map((l, i) => (
          <View key={l.key} style={[styles.line, i > 0 && styles.divider]} testID={`line-${i}`}>
            <View style={[styles.linePicker, openRow === l.key && styles.full]}>
              <InlinePicker<number>
                onOpenChange={opened(l.key)}
                label={`Ingredient ${i + 1}`}
                hideLabel={i > 0}
                value={l.ingredientId}
                options={options}
                onChange={(id) => setLine(i, { ingredientId: id })}
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
                  onChangeText={(t) => setLine(i, { percent: t })}
                  error={fields[`lines.${i}.percent`]}
                  inputMode="decimal"
                  keyboardType="decimal-pad"
                  testID={`line-${i}-percent`}
                />
              </View>
              <IconButton icon="trash-2" label={`Remove ingredient ${i + 1}`} onPress={() => update({ lines: v.lines.filter((_, n) => n !== i) })} testID={`line-${i}-remove`} />
            </View>
          </View>
        ))}
      </View>
      <Button label="Add an ingredient" icon="plus" variant="secondary" onPress={() => update({ lines: [...v.lines, { key: newKey("line"), ingredientId: null, percent: "" }] })} testID="add-line" />
    </Card>
  );

  const pasteCard = (
    <Card title="Cooked paste" testID="formula-paste">
      <AppText variant="small" color="muted">
        Part of the flour is cooked with part of the liquid into a paste before the final mix. It comes out of those lines, not on top.
      </AppText>
      <TickBox label="This dough uses a cooked paste" checked={v.pasteOn} onChange={(on) => update({ pasteOn: on, paste: on ? v.paste : { ...DEFAULT_PASTE } })} testID="paste-toggle" />
      {v.pasteOn ? (
        <>
          <View style={styles.grid}>
            <View style={styles.cell}>
              <InlinePicker<number>
                label="Flour to cook"
                value={v.paste.flourIngredientId}
                options={inFormula("flour")}
                onChange={(id) => update({ paste: { ...v.paste, flourIngredientId: id } })}
                placeholder="Choose a flour line"
                error={fields["paste.flourIngredientId"]}
                testID="paste-flour"
              />
            </View>
            <View style={styles.cell}>
              <InlinePicker<number>
                label="Liquid to cook"
                value={v.paste.liquidIngredientId}
                options={inFormula("liquid")}
                onChange={(id) => update({ paste: { ...v.paste, liquidIngredientId: id } })}
                placeholder="Choose a liquid line"
                error={fields["paste.liquidIngredientId"]}
                testID="paste-liquid"
              />
            </View>
          </View>
          <View style={styles.grid}>
            <View style={styles.cellSmall}>
              <TextField label="Share of flour cooked (%)" hint="Of all the flour." value={v.paste.flourPercent} onChangeText={(t) => update({ paste: { ...v.paste, flourPercent: t } })} error={fields["paste.flourPercent"]} inputMode="decimal" keyboardType="decimal-pad" testID="paste-share" />
            </View>
            <View style={styles.cellSmall}>
              <TextField label="Liquid-to-flour ratio" hint="5 means 5 g liquid per 1 g flour." value={v.paste.liquidRatio} onChangeText={(t) => update({ paste: { ...v.paste, liquidRatio: t } })} error={fields["paste.liquidRatio"]} inputMode="decimal" keyboardType="decimal-pad" testID="paste-ratio" />
            </View>
            <View style={styles.cellSmall}>
              <TextField label="Cook-to temperature (°C)" hint={fahrenheitHint(v.paste.cookToC) ?? "60–70 °C, usually 65 °C: the starch must gelatinize."} value={v.paste.cookToC} onChangeText={(t) => update({ paste: { ...v.paste, cookToC: t } })} error={fields["paste.cookToC"]} inputMode="decimal" keyboardType="decimal-pad" testID="paste-cook" />
            </View>
          </View>
        </>
      ) : null}
    </Card>
  );

  const stepsCard = (
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
          <View key={s.key} style={[styles.step, i > 0 && styles.divider]} testID={`step-${i}`}>
            <View style={[styles.stepKind, openRow === s.key && styles.full]}>
              <InlinePicker<StepKind>
                onOpenChange={opened(s.key)}
                label={`Step ${i + 1}`}
                value={s.kind}
                options={STEP_KINDS.map((k) => ({ value: k, label: STEP_LABELS[k] }))}
                onChange={(kind) => setStep(i, { kind, temperatureC: kind === "bake" && !s.temperatureC ? "180" : s.temperatureC })}
                error={fields[`steps.${i}.kind`]}
                testID={`step-${i}-kind`}
              />
            </View>
            <View style={styles.stepRight}>
              <View style={styles.minutes}>
                <TextField label="Minutes" accessibilityLabel={`Minutes for step ${i + 1}`} value={s.minutes} onChangeText={(t) => setStep(i, { minutes: t })} error={fields[`steps.${i}.minutes`]} inputMode="numeric" keyboardType="number-pad" testID={`step-${i}-minutes`} />
              </View>
              {s.kind === "bake" ? (
                <View style={styles.minutes}>
                  <TextField label="Oven (°C)" accessibilityLabel={`Oven temperature for step ${i + 1}`} hint={fahrenheitHint(s.temperatureC)} value={s.temperatureC} onChangeText={(t) => setStep(i, { temperatureC: t })} error={fields[`steps.${i}.temperatureC`]} inputMode="numeric" keyboardType="number-pad" testID={`step-${i}-temp`} />
                </View>
              ) : null}
              <View style={styles.stepButtons}>
                <IconButton icon="arrow-up" label={`Move step ${i + 1} earlier`} disabled={i === 0} onPress={() => moveStep(i, -1)} testID={`step-${i}-up`} />
                <IconButton icon="arrow-down" label={`Move step ${i + 1} later`} disabled={i === v.steps.length - 1} onPress={() => moveStep(i, 1)} testID={`step-${i}-down`} />
                <IconButton icon="trash-2" label={`Remove step ${i + 1}`} onPress={() => update({ steps: v.steps.filter((_, n) => n !== i) })} testID={`step-${i}-remove`} />
              </View>
            </View>
          </View>
        ))}
      </View>
      <Button label="Add a step" icon="plus" variant="secondary" onPress={() => update({ steps: [...v.steps, { key: newKey("step"), kind: "rest", minutes: "", temperatureC: "" }] })} testID="add-step" />
    </Card>
  );

  const basics = (
    <Card title="Dough" testID="formula-basics">
      <TextField label="Name" value={v.name} onChangeText={(t) => update({ name: t })} error={fields.name} autoCapitalize="sentences" testID="formula-name" />
      <View style={styles.grid}>
        <View style={styles.cellSmall}>
          <TextField label="Loss allowance (%)" hint="Scaling and bench loss." value={v.lossPercent} onChangeText={(t) => update({ lossPercent: t })} error={fields.lossPercent} inputMode="decimal" keyboardType="decimal-pad" testID="formula-loss" />
        </View>
        <View style={styles.cellSmall}>
          <TextField label="Desired dough temperature (°C)" hint={fahrenheitHint(v.ddtC) ?? "The target after mixing."} value={v.ddtC} onChangeText={(t) => update({ ddtC: t })} error={fields.ddtC} inputMode="decimal" keyboardType="decimal-pad" testID="formula-ddt" />
        </View>
        <View style={styles.cellSmall}>
          <TextField
            label="Friction factor (°C)"
            hint="In °C: the factor that makes the measured dough temperature come out. From a mix you measured: target × factors − room − flour − liquid (− paste)."
            value={v.frictionC}
            onChangeText={(t) => update({ frictionC: t })}
            error={fields.frictionC}
            inputMode="decimal"
            keyboardType="decimal-pad"
            testID="formula-friction"
          />
          {warnings.frictionC && !fields.frictionC ? <FieldWarning text={warnings.frictionC} testID="formula-friction-warning" /> : null}
        </View>
        <View style={styles.cellSmall}>
          <TextField label="Target internal temperature (°C)" optional hint={fahrenheitHint(v.targetInternalC) ?? "In the center of the loaf when it is done."} value={v.targetInternalC} onChangeText={(t) => update({ targetInternalC: t })} error={fields.targetInternalC} inputMode="decimal" keyboardType="decimal-pad" testID="formula-internal" />
        </View>
      </View>
    </Card>
  );

  const save = (
    <Card testID="formula-save-card">
      {askNote ? (
        <TextField label="What changed" optional hint="Kept in the history with this version." value={v.note} onChangeText={(t) => update({ note: t })} error={fields.note} maxLength={200} testID="formula-note" />
      ) : null}
      <FormError message={formError} testID="formula-form-error" />
      <Button label={submitLabel} icon="check" onPress={submit} busy={busy} testID="formula-save" block />
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

/** The figures the formula works out to, from the shared formulaFigures. */
export function FiguresPanel({ figures, hasPaste, testID = "formula-figures" }: { figures: FormulaFigures; hasPaste: boolean; testID?: string }) {
  const rows: { label: string; value: string; id: string; hint?: string }[] = [
    { label: "Total", value: formatPercent(figures.totalPercent), id: "total", hint: "All lines" },
    { label: "Flour", value: formatPercent(figures.flourPercent), id: "flour", hint: "Must be 100 %" },
    { label: "Hydration", value: formatPercent(figures.hydrationPercent), id: "hydration", hint: "Liquid lines" },
    { label: "Effective hydration", value: formatPercent(figures.effectiveHydrationPercent), id: "effective", hint: "Water in liquids, egg, butter, honey" },
    { label: "Flour's own moisture", value: formatPercent(figures.flourMoisturePercent ?? 0), id: "flour-moisture", hint: "Apart: not in the hydration" },
    { label: "Paste share", value: hasPaste ? formatPercent(figures.pasteSharePercent) : "No paste", id: "paste-share", hint: "Flour cooked" },
    { label: "Paste weight", value: hasPaste ? formatPercent(figures.pastePercent) : "–", id: "paste", hint: "Of the flour" },
    { label: "Dough per kg flour", value: `${formatNum(Math.round(figures.doughYieldPerKgFlour))} g`, id: "yield" },
  ];
  const flourOff = Math.abs(figures.flourPercent - 100) > 0.01;
  return (
    <Card title="Figures" testID={testID}>
      <AppText variant="small" color="muted">
        Worked out as you type.
      </AppText>
      <View style={styles.figures}>
        {rows.map((r) => (
          <View key={r.id} style={styles.figure} testID={`figure-${r.id}-box`} accessible accessibilityLabel={`${r.label}: ${r.value}`}>
            <AppText style={styles.figureValue} color={r.id === "flour" && flourOff ? "dangerInk" : "ink"} testID={`figure-${r.id}`}>
              {r.value}
            </AppText>
            <AppText variant="caption" color="muted">
              {r.label}
            </AppText>
            {r.hint ? (
              <AppText variant="caption" color="muted">
                {r.hint}
              </AppText>
            ) : null}
          </View>
        ))}
      </View>
    </Card>
  );
}

/** A field that can be saved but probably should not be: amber, beside the field, read out when it appears. */
function FieldWarning({ text, testID }: { text: string; testID?: string }) {
  return (
    <View style={styles.warning} testID={testID} accessibilityLiveRegion="polite">
      <Feather name="alert-triangle" size={15} color={colors.amberInk} style={styles.warningIcon} />
      <AppText variant="small" color="amberInk" style={styles.warningText}>
        {text}
      </AppText>
    </View>
  );
}

function IconButton({ icon, label, onPress, disabled, testID }: { icon: React.ComponentProps<typeof Feather>["name"]; label: string; onPress: () => void; disabled?: boolean; testID?: string }) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ disabled: !!disabled }}
      disabled={disabled}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [styles.icon, pressed && styles.iconPressed, disabled && styles.iconDisabled]}
    >
      <Feather name={icon} size={18} color={disabled ? colors.muted : colors.crustInk} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  wideRow: { flexDirection: "row", gap: space.lg, alignItems: "flex-start" },
  wideMain: { flex: 2, gap: space.lg, minWidth: 0 },
  wideSide: { flex: 1, gap: space.lg, minWidth: 280 },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 220 },
  cellSmall: { flexGrow: 1, flexBasis: 150 },
  lines: {},
  line: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, paddingVertical: space.sm, alignItems: "flex-end" },
  linePicker: { flexGrow: 1, flexShrink: 1, flexBasis: 150, minWidth: 0 },
  full: { flexBasis: "100%" },
  lineRight: { flexDirection: "row", alignItems: "flex-end", gap: space.sm, flexGrow: 0 },
  percent: { width: 92 },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  step: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, paddingVertical: space.sm, alignItems: "flex-end" },
  stepKind: { flexGrow: 1, flexShrink: 1, flexBasis: 180, minWidth: 0 },
  stepRight: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", gap: space.sm, flexShrink: 1, maxWidth: "100%" },
  minutes: { width: 110 },
  stepButtons: { flexDirection: "row", gap: space.xs, paddingBottom: 2 },
  icon: {
    width: layout.minTouch,
    height: layout.minTouch,
    borderRadius: radii.pill,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
    marginBottom: 2,
  },
  iconPressed: { backgroundColor: colors.crustSoft },
  iconDisabled: { borderColor: colors.border, backgroundColor: colors.page },
  figures: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  warning: { flexDirection: "row", gap: space.xs, alignItems: "flex-start", backgroundColor: colors.amberSoft, borderRadius: radii.md, padding: space.sm, marginTop: space.xs },
  warningIcon: { marginTop: 2 },
  warningText: { flex: 1 },
  figure: { flexGrow: 1, flexBasis: 130, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: 1 },
  figureValue: { fontFamily: fonts.extrabold, fontSize: 24, lineHeight: 30, fontVariant: ["tabular-nums"] },
});
