import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, layout, radii, space } from "../theme";
import { AppText } from "./Text";
import { FieldFrame } from "./Field";

export interface MultiChoiceOption<T extends string | number> {
  value: T;
  label: string;
}

export interface MultiChoiceProps<T extends string | number> {
  label: string;
  hint?: string;
  options: MultiChoiceOption<T>[];
  value: readonly T[];
  onChange: (value: T[]) => void;
  error?: string | null;
  disabled?: boolean;
  /** Group testID; each option is "<testID>-<value>". */
  testID?: string;
  /**
   * What a screen reader calls each option, where the same option is offered by two groups on one screen
   * ("Wheat" under Contains and under May contain): e.g. "Wheat (may contain)". The visible label stays short.
   */
  optionName?: (option: MultiChoiceOption<T>) => string;
}

/** A multiple-choice control (checkboxes) as wrapping chips; the order of `options` is kept. */
export function MultiChoice<T extends string | number>({ label, hint, options, value, onChange, error, disabled, testID, optionName }: MultiChoiceProps<T>) {
  const toggle = (v: T) => {
    const on = value.includes(v);
    const next = options.map((o) => o.value).filter((o) => (o === v ? !on : value.includes(o)));
    onChange(next);
  };
  return (
    <View testID={testID}>
      <FieldFrame label={label} hint={hint} error={error} testID={testID}>
      <View style={styles.chips} role="group" aria-label={label}>
        {options.map((o) => {
          const checked = value.includes(o.value);
          return (
            <Pressable
              key={String(o.value)}
              accessibilityRole="checkbox"
              aria-checked={checked}
              aria-disabled={!!disabled}
              accessibilityLabel={optionName ? optionName(o) : o.label}
              disabled={disabled}
              testID={testID ? `${testID}-${o.value}` : undefined}
              onPress={() => toggle(o.value)}
              style={({ pressed }) => [styles.chip, checked && styles.checked, pressed && !checked && styles.pressed, disabled && styles.disabled]}
            >
              <Feather name={checked ? "check-square" : "square"} size={18} color={checked ? colors.crustInk : colors.inputBorder} />
              <AppText variant="label" color={checked ? "crustInk" : "ink"}>
                {o.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
      </FieldFrame>
    </View>
  );
}

const styles = StyleSheet.create({
  chips: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  chip: {
    minHeight: layout.minTouch,
    flexDirection: "row",
    alignItems: "center",
    gap: space.sm,
    paddingHorizontal: space.md,
    borderRadius: radii.pill,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
  },
  checked: { backgroundColor: colors.crustSoft, borderColor: colors.crust },
  pressed: { backgroundColor: colors.sunken },
  disabled: { opacity: 0.6 },
});
