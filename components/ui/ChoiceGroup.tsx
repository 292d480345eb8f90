import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, layout, radii, space } from "../theme";
import { AppText } from "./Text";
import { FieldFrame } from "./Field";

export interface Choice<T extends string> {
  value: T;
  label: string;
  hint?: string;
}

export interface ChoiceGroupProps<T extends string> {
  label: string;
  choices: Choice<T>[];
  value: T | null;
  onChange: (value: T) => void;
  error?: string | null;
  testID?: string;
  /** "chips" sit in a wrapping row; "list" stacks full-width options with hints. */
  layout?: "chips" | "list";
}

/** A single-choice control (radio group) built from large pressable options. */
export function ChoiceGroup<T extends string>({ label, choices, value, onChange, error, testID, layout: shape = "chips" }: ChoiceGroupProps<T>) {
  return (
    <View testID={testID}>
      <FieldFrame label={label} error={error} testID={testID}>
      <View accessibilityRole="radiogroup" accessibilityLabel={label} style={shape === "chips" ? styles.chips : styles.list}>
        {choices.map((c) => {
          const selected = c.value === value;
          return (
            <Pressable
              key={c.value}
              accessibilityRole="radio"
              aria-checked={selected}
              accessibilityLabel={c.label}
              testID={testID ? `${testID}-${c.value}` : undefined}
              onPress={() => onChange(c.value)}
              style={({ pressed }) => [
                shape === "chips" ? styles.chip : styles.row,
                selected && styles.selected,
                pressed && !selected && styles.pressed,
              ]}
            >
              {shape === "list" ? (
                <Feather name={selected ? "check-circle" : "circle"} size={20} color={selected ? colors.crustInk : colors.inputBorder} />
              ) : null}
              <View style={shape === "list" ? styles.rowText : undefined}>
                <AppText variant="label" color={selected ? "crustInk" : "ink"}>
                  {c.label}
                </AppText>
                {shape === "list" && c.hint ? (
                  <AppText variant="small" color={selected ? "crustInk" : "muted"}>
                    {c.hint}
                  </AppText>
                ) : null}
              </View>
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
  list: { gap: space.sm },
  chip: {
    minHeight: layout.minTouch,
    paddingHorizontal: space.lg,
    borderRadius: radii.pill,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    justifyContent: "center",
  },
  row: {
    minHeight: layout.minTouch + 8,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
  },
  rowText: { flex: 1, gap: space.xxs },
  selected: { backgroundColor: colors.crustSoft, borderColor: colors.crust },
  pressed: { backgroundColor: colors.sunken },
});
