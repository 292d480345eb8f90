import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../../ui/Button";
import { Card } from "../../../ui/Card";
import { AppText } from "../../../ui/Text";
import { formatDay } from "../../../ordering/dates";
import { skipDateCheck, type StandingPattern } from "../../../ordering/standing";
import { layout, space } from "../../../theme";
import { DateField } from "../../../ui/DateField";

export interface SkipDatesCardProps {
  skipDates: string[];
  today: string;
  /** Which dates the standing order delivers on, as the form holds it now: only those can be skipped. */
  pattern?: StandingPattern;
  /** The server's (or the schema's) message for the skipped dates. */
  error?: string;
  onAdd: (date: string) => void;
  onRemove: (date: string) => void;
}

/** The dates no order is made on, and a field to add one (checked as it is added). */
export function SkipDatesCard({ skipDates, today, pattern, error, onAdd, onRemove }: SkipDatesCardProps) {
  const [typed, setTyped] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const add = () => {
    const checked = skipDateCheck(typed, today, pattern);
    if ("error" in checked) return setProblem(checked.error);
    setProblem(null);
    onAdd(checked.date);
    setTyped("");
  };
  return (
    <Card title="Dates to skip" testID="standing-skips">
      <AppText color="muted">No order is made on these dates (holidays, closures of your own).</AppText>
      {skipDates.length === 0 ? (
        <AppText color="muted" testID="standing-skips-empty">
          No dates skipped.
        </AppText>
      ) : (
        <View style={styles.skipList}>
          {skipDates.map((d) => (
            <View key={d} style={styles.skipRow} testID={`standing-skip-${d}`}>
              <AppText variant="bodyStrong" style={styles.flex}>
                {formatDay(d)}
              </AppText>
              <Button label="Remove" small variant="ghost" icon="x" onPress={() => onRemove(d)} accessibilityLabel={`Stop skipping ${formatDay(d)}`} testID={`standing-skip-${d}-remove`} />
            </View>
          ))}
        </View>
      )}
      <View style={styles.addSkip}>
        <View style={styles.flex}>
          <DateField
            label="Skip a date"
            value={typed}
            onChangeText={(t) => {
              setTyped(t);
              setProblem(null);
            }}
            onSubmitEditing={add}
            error={problem ?? error}
            testID="standing-skip-date"
          />
        </View>
        <Button label="Add" icon="plus" variant="secondary" onPress={add} testID="standing-skip-add" style={styles.addButton} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  skipList: { gap: space.xs },
  skipRow: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: layout.minTouch },
  addSkip: { flexDirection: "row", alignItems: "flex-end", gap: space.sm },
  addButton: { marginBottom: 2 },
});
