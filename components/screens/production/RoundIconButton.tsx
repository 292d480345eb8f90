import React from "react";
import { Pressable, StyleSheet } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, layout, radii } from "../../theme";

export interface RoundIconButtonProps {
  icon: React.ComponentProps<typeof Feather>["name"];
  /** What a screen reader says: the button has no visible words. */
  label: string;
  onPress: () => void;
  disabled?: boolean;
  testID?: string;
  /** The day and week arrows (52 px, a bigger glyph); otherwise a row's 44 px tool (move, remove). */
  large?: boolean;
}

/** A round button with only an icon: the bake day's and purchasing's arrows, the formula rows' tools. */
export function RoundIconButton({ icon, label, onPress, disabled, testID, large }: RoundIconButtonProps) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={disabled ? { disabled: true } : large ? undefined : { disabled: false }}
      disabled={disabled}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [styles.round, large ? styles.large : styles.tool, pressed && (large ? styles.largePressed : styles.toolPressed), disabled && styles.disabled]}
    >
      <Feather name={icon} size={large ? 26 : 18} color={disabled ? colors.muted : large ? colors.ink : colors.crustInk} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  round: { borderRadius: radii.pill, borderWidth: 1.5, borderColor: colors.inputBorder, backgroundColor: colors.surface, alignItems: "center", justifyContent: "center" },
  large: { width: 52, height: 52 },
  largePressed: { backgroundColor: colors.sunken },
  tool: { width: layout.minTouch, height: layout.minTouch, marginBottom: 2 },
  toolPressed: { backgroundColor: colors.crustSoft },
  disabled: { borderColor: colors.border, backgroundColor: colors.page },
});
