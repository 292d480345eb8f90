import React from "react";
import { Pressable, StyleSheet, TextInput, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, fonts, layout, radii, space } from "../theme";
import { parseQuantity, stepDown, stepUp } from "../ordering/quantities";

export interface StepperProps {
  /** The typed text (blank = 0). */
  value: string;
  onChange: (text: string) => void;
  min: number;
  max: number;
  /** What is counted, for screen readers: "Milk-bread dinner rolls" gives the input "Quantity of Milk-bread dinner rolls"
   * and the buttons "More Milk-bread dinner rolls" / "Fewer Milk-bread dinner rolls". */
  label: string;
  disabled?: boolean;
  invalid?: boolean;
  /** testID of the input; the buttons get "<testID>-dec" and "<testID>-inc". */
  testID?: string;
  /** "row": − [n] +; "column": + above, − below (for narrow grids). */
  direction?: "row" | "column";
  /** Highlight a non-zero value (standing-order grid). */
  highlight?: boolean;
}

/** A quantity control: − and + buttons (44 px) around a typed number; + jumps from 0 to the minimum. */
export function Stepper({ value, onChange, min, max, label, disabled, invalid, testID, direction = "row", highlight }: StepperProps) {
  const q = parseQuantity(value);
  const current = Number.isNaN(q) ? 0 : q;
  const rule = { minQuantity: min, maxQuantity: max };
  const canDown = !disabled && current > 0;
  const canUp = !disabled && current < max;
  const dec = (
    <StepButton
      icon="minus"
      label={`Fewer ${label}`}
      disabled={!canDown}
      onPress={() => onChange(String(stepDown(current, rule)))}
      testID={testID ? `${testID}-dec` : undefined}
    />
  );
  const inc = (
    <StepButton
      icon="plus"
      label={`More ${label}`}
      disabled={!canUp}
      onPress={() => onChange(String(stepUp(current, rule)))}
      testID={testID ? `${testID}-inc` : undefined}
    />
  );
  const input = (
    <TextInput
      value={value}
      onChangeText={(t) => onChange(t.replace(/\s+/g, ""))}
      editable={!disabled}
      accessibilityLabel={`Quantity of ${label}`}
      aria-invalid={!!invalid}
      aria-disabled={disabled}
      testID={testID}
      inputMode="numeric"
      keyboardType="number-pad"
      maxLength={5}
      selectTextOnFocus
      placeholder="0"
      placeholderTextColor={colors.muted}
      style={[
        styles.input,
        direction === "column" && styles.inputColumn,
        highlight && current > 0 && styles.inputOn,
        invalid && styles.invalid,
        disabled && styles.inputDisabled,
      ]}
    />
  );
  return (
    <View style={direction === "row" ? styles.row : styles.column}>
      {direction === "row" ? (
        <>
          {dec}
          {input}
          {inc}
        </>
      ) : (
        <>
          {inc}
          {input}
          {dec}
        </>
      )}
    </View>
  );
}

function StepButton({ icon, label, disabled, onPress, testID }: { icon: "plus" | "minus"; label: string; disabled: boolean; onPress: () => void; testID?: string }) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ disabled }}
      disabled={disabled}
      onPress={onPress}
      testID={testID}
      hitSlop={2}
      style={({ pressed }) => [styles.button, pressed && styles.pressed, disabled && styles.buttonDisabled]}
    >
      <Feather name={icon} size={20} color={disabled ? colors.muted : colors.crustInk} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: "row", alignItems: "center", gap: space.xs },
  column: { alignItems: "center", gap: space.xs },
  button: {
    width: layout.minTouch,
    height: layout.minTouch,
    borderRadius: radii.pill,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  pressed: { backgroundColor: colors.crustSoft },
  buttonDisabled: { borderColor: colors.border, backgroundColor: colors.page },
  input: {
    width: 64,
    height: layout.minTouch,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    borderRadius: radii.md,
    backgroundColor: colors.surface,
    textAlign: "center",
    fontFamily: fonts.bold,
    fontSize: 18,
    color: colors.ink,
    paddingHorizontal: space.xs,
  },
  inputColumn: { width: layout.minTouch + 4 },
  inputOn: { backgroundColor: colors.crustSoft, borderColor: colors.crust },
  invalid: { borderColor: colors.danger, borderWidth: 2 },
  inputDisabled: { backgroundColor: colors.sunken, borderColor: colors.border },
});
