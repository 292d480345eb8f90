import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../../ui/Button";
import { DateField } from "../../../ui/DateField";
import { AppText } from "../../../ui/Text";
import { useZodForm } from "../../../forms/useZodForm";
import { checkedSchema } from "../../../forms/checkedSchema";
import { cleanDate, formatDay, relativeDay } from "../../../ordering/dates";
import { RoundIconButton } from "../RoundIconButton";
import { colors, fonts, radii, space } from "../../../theme";

/** "Any date": a calendar date as typed, cleaned to YYYY-MM-DD. */
const anyDate = checkedSchema(({ date }: { date: string }) => {
  const d = cleanDate(date);
  return d ? { ok: true as const, input: d } : { ok: false as const, fields: { date: "Write the date as YYYY-MM-DD (year, month, day)." } };
});
const BLANK = { date: "" };

export interface DateBarProps {
  /** Shown at the end of the row of quick buttons (the units switch). */
  extra?: React.ReactNode;
  date: string;
  today?: string;
  prev: string;
  next: string;
  nextBakeDay?: string;
  upcoming: string[];
  onChange: (date: string) => void;
}

/** Previous / next bake day, back to the next bake day, or any date. */
export function DateBar({ extra, date, today, prev, next, nextBakeDay, upcoming, onChange }: DateBarProps) {
  const [picking, setPicking] = useState(false);
  const form = useZodForm({ schema: anyDate, initial: BLANK });
  const rel = relativeDay(date, today);
  // Typing starts again: the message goes until the next "Open".
  const type = (date: string) => form.reset({ date });
  const go = () =>
    void form.submit((d) => {
      setPicking(false);
      form.reset(BLANK);
      onChange(d);
    });
  return (
    <View style={styles.dateBar} testID="day-switcher">
      <View style={styles.dateRow}>
        <RoundIconButton large icon="chevron-left" label={`Previous bake day, ${formatDay(prev)}`} onPress={() => onChange(prev)} testID="day-prev" />
        <View style={styles.dateText}>
          <AppText style={styles.dateBig} align="center" testID="day-date">
            {formatDay(date)}
          </AppText>
          {rel ? (
            <AppText variant="label" color="crust" align="center">
              {rel}
            </AppText>
          ) : null}
        </View>
        <RoundIconButton large icon="chevron-right" label={`Next bake day, ${formatDay(next)}`} onPress={() => onChange(next)} testID="day-next" />
      </View>
      <View style={styles.quick}>
        {nextBakeDay && nextBakeDay !== date ? <Button label="Next bake day" small variant="secondary" icon="sun" onPress={() => onChange(nextBakeDay)} testID="day-next-bake" /> : null}
        <Button label={picking ? "Close" : "Pick a date"} small variant="ghost" icon={picking ? "x" : "calendar"} onPress={() => setPicking((p) => !p)} testID="day-pick" />
        {extra ? <View style={styles.extra}>{extra}</View> : null}
      </View>
      {picking ? (
        <View style={styles.pick} testID="day-pick-panel">
          <View style={styles.chips}>
            {upcoming.map((d) => (
              <Button key={d} label={formatDay(d)} small variant={d === date ? "accent" : "secondary"} onPress={() => { setPicking(false); onChange(d); }} testID={`day-chip-${d}`} />
            ))}
          </View>
          <View style={styles.pickRow}>
            <View style={styles.flex}>
              <DateField label="Any date" value={form.values.date} onChangeText={type} error={form.errors.date} onSubmitEditing={go} testID="day-pick-input" />
            </View>
            <Button label="Open" onPress={go} testID="day-pick-go" style={styles.pickGo} />
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  dateBar: { gap: space.sm },
  dateRow: { flexDirection: "row", alignItems: "center", gap: space.sm },
  dateText: { flex: 1, alignItems: "center" },
  dateBig: { fontFamily: fonts.extrabold, fontSize: 26, lineHeight: 32 },
  quick: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  extra: { marginLeft: "auto" },
  pick: { gap: space.md, padding: space.md, backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border },
  chips: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  pickRow: { flexDirection: "row", alignItems: "flex-end", gap: space.sm },
  pickGo: { marginBottom: 2 },
});
