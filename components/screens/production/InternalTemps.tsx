import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { AppText } from "../../ui/Text";
import { useProgressMutation, type PlanView } from "../../api/production";
import { useZodForm } from "../../forms/useZodForm";
import { checkedSchema } from "../../forms/checkedSchema";
import { localTime } from "../../production/plan";
import { checkReading } from "../../production/temperatures";
import type { Units } from "../../production/units";
import { colors, radii, space } from "../../theme";

/**
 * The internal temperature reached in each oven load, probed in the center of one piece and recorded here (with
 * the time, by the server's clock), beside the target of the load's dough. A reading below the target says so.
 */
export function InternalTempsCard({ plan, units }: { plan: PlanView; units: Units }) {
  const loads = plan.schedule?.ovenLoads ?? [];
  if (loads.length === 0) return null;
  const targets = new Map(plan.doughs.map((d) => [d.formulaId, { name: d.name, c: d.targetInternalC }]));
  return (
    <Card title="Internal temperatures" testID="internal-temps">
      <AppText variant="small" color="muted">
        Probe the center of one piece from every oven load and record what it reached.
      </AppText>
      <View style={styles.list}>
        {loads.map((l) => {
          const doughs = [...new Set(l.items.map((i) => i.formulaId))].map((id) => targets.get(id)).filter((x): x is { name: string; c: number | null } => !!x);
          const withTarget = doughs.filter((d) => d.c !== null) as { name: string; c: number }[];
          const target = withTarget.length ? Math.max(...withTarget.map((d) => d.c)) : null;
          return <LoadReading key={l.load} date={plan.date} load={l.load} title={`Oven load ${l.load} · ${l.ovenName} · out at ${localTime(l.bakeEndsAt)}`} doughs={doughs.map((d) => d.name).join(", ")} targetC={target} recorded={plan.progress.internal?.[String(l.load)] ?? null} units={units} />;
        })}
      </View>
    </Card>
  );
}

const BLANK = { valueC: "" };

interface LoadReadingProps {
  date: string;
  load: number;
  title: string;
  doughs: string;
  targetC: number | null;
  recorded: { c: number; at: string } | null;
  units: Units;
}

function LoadReading({ date, load, title, doughs, targetC, recorded, units }: LoadReadingProps) {
  const save = useProgressMutation(date);
  const form = useZodForm({ schema: checkedSchema(({ valueC }: { valueC: string }) => checkReading(valueC, units)), initial: BLANK });
  const id = `internal-${load}`;
  // Typing starts again: the message goes until the next "Record".
  const type = (valueC: string) => form.reset({ valueC });
  const submit = () =>
    void form.submit(async (valueC) => {
      await save.mutateAsync({ kind: "internal", key: String(load), valueC });
      form.reset(BLANK);
    });
  const low = recorded && targetC !== null && recorded.c < targetC;
  return (
    <View style={styles.row} testID={id}>
      <AppText variant="bodyStrong">{title}</AppText>
      <AppText variant="small" color="muted">{`${doughs}${targetC !== null ? ` · done at ${units.temp(targetC)} or above` : ""}`}</AppText>
      {recorded ? (
        <View style={[styles.recorded, low && styles.low]} testID={`${id}-recorded`} accessibilityRole={low ? "alert" : undefined}>
          <AppText variant="bodyStrong" color={low ? "amberInk" : "sageInk"}>
            {`Reached ${units.temp(recorded.c)} at ${localTime(recorded.at) || recorded.at.slice(11, 16)}${low ? `: below ${units.temp(targetC!)}, back in the oven and probe again.` : ""}`}
          </AppText>
        </View>
      ) : null}
      <View style={styles.entry}>
        <View style={styles.flex}>
          <TextField
            label={`Reached (${units.tempUnit})`}
            accessibilityLabel={`Internal temperature reached, oven load ${load} (${units.tempUnit})`}
            value={form.values.valueC}
            onChangeText={type}
            error={form.errors.valueC ?? form.formError}
            inputMode="decimal"
            keyboardType="numbers-and-punctuation"
            onSubmitEditing={submit}
            testID={`${id}-input`}
          />
        </View>
        <Button label="Record" icon="thermometer" small busy={form.submitting} onPress={submit} testID={`${id}-save`} style={styles.save} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  list: { gap: space.md },
  row: { gap: space.xs, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.border },
  recorded: { backgroundColor: colors.sageSoft, borderRadius: radii.md, padding: space.sm },
  low: { backgroundColor: colors.amberSoft },
  entry: { flexDirection: "row", alignItems: "flex-end", gap: space.sm },
  save: { marginBottom: 2 },
});
