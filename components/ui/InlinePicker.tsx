import React, { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, fonts, layout, radii, space } from "../theme";
import { AppText } from "./Text";
import { FieldFrame } from "./Field";

export interface PickerOption<T extends string | number> {
  value: T;
  label: string;
  /** A short second line (the ingredient's kind). */
  hint?: string;
}

export interface InlinePickerProps<T extends string | number> {
  label: string;
  /** Hide the visible label (rows of a table where the column says it); screen readers still get it. */
  hideLabel?: boolean;
  value: T | null;
  options: PickerOption<T>[];
  onChange: (value: T) => void;
  placeholder?: string;
  error?: string | null;
  disabled?: boolean;
  /** The field is "<testID>", each option "<testID>-option-<value>", the error "<testID>-error". */
  testID?: string;
  /** Told when the options open or close (a row can make room for them). */
  onOpenChange?: (open: boolean) => void;
}

/**
 * A select that opens in place: the field shows the choice; pressing it lists the options below as
 * large chips (no overlay to lose behind the keyboard).
 */
export function InlinePicker<T extends string | number>({ label, hideLabel, value, options, onChange, placeholder = "Choose…", error, disabled, testID, onOpenChange }: InlinePickerProps<T>) {
  const [open, setOpenState] = useState(false);
  const setOpen = (next: boolean) => {
    setOpenState(next);
    if (next !== open) onOpenChange?.(next);
  };
  const chosen = options.find((o) => o.value === value);
  return (
    <FieldFrame label={label} hideLabel={hideLabel} error={error} testID={testID} labelForInput>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={`${label}: ${chosen ? chosen.label : `${placeholder} (none chosen)`}`}
        aria-expanded={open}
        aria-disabled={!!disabled}
        aria-invalid={!!error}
        disabled={disabled}
        onPress={() => setOpen(!open)}
        testID={testID}
        style={({ pressed }) => [styles.field, open && styles.fieldOpen, error ? styles.invalid : null, pressed && styles.pressed, disabled && styles.disabled]}
      >
        <AppText style={styles.value} color={chosen ? "ink" : "muted"} numberOfLines={1}>
          {chosen ? chosen.label : placeholder}
        </AppText>
        <Feather name={open ? "chevron-up" : "chevron-down"} size={20} color={colors.ink} />
      </Pressable>
      {open ? (
        <View style={styles.options} accessibilityRole="radiogroup" accessibilityLabel={label}>
          {options.length === 0 ? (
            <AppText variant="small" color="muted">
              Nothing to choose from yet.
            </AppText>
          ) : (
            options.map((o) => {
              const selected = o.value === value;
              return (
                <Pressable
                  key={String(o.value)}
                  accessibilityRole="radio"
                  aria-checked={selected}
                  accessibilityLabel={o.hint ? `${o.label}, ${o.hint}` : o.label}
                  onPress={() => {
                    onChange(o.value);
                    setOpen(false);
                  }}
                  testID={testID ? `${testID}-option-${o.value}` : undefined}
                  style={({ pressed }) => [styles.option, selected && styles.optionOn, pressed && !selected && styles.pressed]}
                >
                  <AppText variant="label" color={selected ? "crustInk" : "ink"}>
                    {o.label}
                  </AppText>
                  {o.hint ? (
                    <AppText variant="caption" color={selected ? "crustInk" : "muted"}>
                      {o.hint}
                    </AppText>
                  ) : null}
                </Pressable>
              );
            })
          )}
        </View>
      ) : null}
    </FieldFrame>
  );
}

const styles = StyleSheet.create({
  field: {
    minHeight: layout.minTouch + 4,
    flexDirection: "row",
    alignItems: "center",
    gap: space.sm,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    borderRadius: radii.md,
    backgroundColor: colors.surface,
    paddingHorizontal: space.md,
  },
  fieldOpen: { borderColor: colors.focus, borderWidth: 2 },
  invalid: { borderColor: colors.danger, borderWidth: 2 },
  pressed: { backgroundColor: colors.sunken },
  disabled: { opacity: 0.6 },
  value: { flex: 1, fontFamily: fonts.semibold, fontSize: 16 },
  options: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, padding: space.sm, borderRadius: radii.md, backgroundColor: colors.sunken },
  option: {
    minHeight: layout.minTouch,
    justifyContent: "center",
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderRadius: radii.md,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
  },
  optionOn: { backgroundColor: colors.crustSoft, borderColor: colors.crust },
});
