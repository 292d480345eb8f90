import React, { useMemo } from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { DateField } from "../../ui/DateField";
import { Button } from "../../ui/Button";
import { AppText } from "../../ui/Text";
import { useZodForm } from "../../forms/useZodForm";
import { formatDay } from "../../ordering/dates";
import { closureSchema, withClosure, type Closure } from "./closureForm";
import { colors, layout, space } from "../../theme";

export interface ClosuresCardProps {
  closures: Closure[];
  onChange: (closures: Closure[]) => void;
  today: string | undefined;
  /** The settings form's message for the closures (from the server). */
  error?: string;
}

/** The bakery's closed dates: the ones coming up (each removable), and adding one. */
export function ClosuresCard({ closures, onChange, today, error }: ClosuresCardProps) {
  const schema = useMemo(() => closureSchema(closures), [closures]);
  const form = useZodForm({ schema, initial: { date: "", note: "" }, manyMessage: null });
  const upcoming = today ? closures.filter((c) => c.date >= today) : closures;
  const past = closures.length - upcoming.length;

  const add = () =>
    void form.submit((closure) => {
      onChange(withClosure(closures, closure));
      form.reset({ date: "", note: "" });
    });

  return (
    <Card title="Closed dates" testID="calendar-closures">
      <AppText color="muted">No deliveries on these dates; buyers see the note.</AppText>
      {upcoming.length === 0 ? (
        <AppText color="muted" testID="closures-empty">
          No closures coming up.
        </AppText>
      ) : (
        <View>
          {upcoming.map((c, i) => (
            <View key={c.date} style={[styles.closure, i > 0 && styles.divider]} testID={`closure-${c.date}`}>
              <View style={styles.flex}>
                <AppText variant="bodyStrong">{formatDay(c.date)}</AppText>
                {c.note ? <AppText variant="small" color="muted">{c.note}</AppText> : null}
              </View>
              <Button
                label="Remove"
                small
                variant="ghost"
                icon="x"
                accessibilityLabel={`Remove the closure on ${formatDay(c.date)}`}
                onPress={() => onChange(closures.filter((x) => x.date !== c.date))}
                testID={`closure-${c.date}-remove`}
              />
            </View>
          ))}
        </View>
      )}
      {past > 0 ? <AppText variant="small" color="muted">{past === 1 ? "1 past closure is kept on file." : `${past} past closures are kept on file.`}</AppText> : null}
      <View style={styles.addRow}>
        <View style={styles.cell}>
          <DateField
            label="Date"
            value={form.values.date}
            onChangeText={(t) => {
              form.setValue("date", t);
              form.setErrors({});
            }}
            error={form.errors.date ?? error}
            onSubmitEditing={add}
            testID="closure-date"
          />
        </View>
        <View style={styles.cellWide}>
          <TextField label="Note" optional {...form.text("note")} placeholder="e.g. Christmas Day" maxLength={120} testID="closure-note" />
        </View>
      </View>
      <Button label="Add closed date" icon="plus" variant="secondary" onPress={add} testID="closure-add" />
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  cell: { flexGrow: 1, flexBasis: 140 },
  cellWide: { flexGrow: 2, flexBasis: 200 },
  closure: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: layout.minTouch + 8, paddingVertical: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  addRow: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
});
