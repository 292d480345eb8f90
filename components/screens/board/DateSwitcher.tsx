import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Button } from "../../ui/Button";
import { AppText } from "../../ui/Text";
import { addDays, formatDay } from "../../ordering/dates";
import { colors, layout, radii, space } from "../../theme";
import { DateField } from "../../ui/DateField";
import { cleanDate } from "../../ordering/dates";

/** The board's date: a day back, a day on, today or tomorrow at one press, or any date from the picker. */
export function DateSwitcher({ date, today, onChange }: { date: string; today?: string; onChange: (d: string) => void }) {
  const [typed, setTyped] = React.useState(date);
  React.useEffect(() => setTyped(date), [date]);
  const pick = (text: string) => {
    setTyped(text);
    // The web's date input hands over a whole date or ""; typed text (native) goes once it is a whole date.
    const d = cleanDate(text);
    if (d && d !== date) onChange(d);
  };
  return (
    <View style={styles.switcher} testID="board-date-switcher">
      <View style={styles.stepper}>
        <IconButton icon="chevron-left" label={`Previous day, ${formatDay(addDays(date, -1))}`} onPress={() => onChange(addDays(date, -1))} testID="board-prev" />
        <View style={styles.switcherDate}>
          <AppText variant="bodyStrong" align="center" testID="board-date">
            {formatDay(date)}
          </AppText>
        </View>
        <IconButton icon="chevron-right" label={`Next day, ${formatDay(addDays(date, 1))}`} onPress={() => onChange(addDays(date, 1))} testID="board-next" />
      </View>
      {today ? (
        <View style={styles.quick}>
          <Button label="Today" small variant={date === today ? "accent" : "secondary"} onPress={() => onChange(today)} testID="board-today" />
          <Button label="Tomorrow" small variant={date === addDays(today, 1) ? "accent" : "secondary"} onPress={() => onChange(addDays(today, 1))} testID="board-tomorrow" />
        </View>
      ) : null}
      <View style={styles.picker}>
        <DateField label="Go to a date" value={typed} onChangeText={pick} testID="board-date-pick" />
      </View>
    </View>
  );
}

function IconButton({ icon, label, onPress, testID }: { icon: "chevron-left" | "chevron-right"; label: string; onPress: () => void; testID: string }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} testID={testID} style={({ pressed }) => [styles.iconButton, pressed && styles.iconPressed]}>
      <Feather name={icon} size={22} color={colors.ink} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  switcher: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  stepper: { flexDirection: "row", alignItems: "center", gap: space.xs },
  switcherDate: { minWidth: 104, paddingHorizontal: space.xs },
  iconButton: {
    width: layout.minTouch,
    height: layout.minTouch,
    borderRadius: radii.pill,
    borderWidth: 1,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  iconPressed: { backgroundColor: colors.sunken },
  quick: { flexDirection: "row", gap: space.xs },
  picker: { minWidth: 180, flexGrow: 1, maxWidth: 240 },
});
