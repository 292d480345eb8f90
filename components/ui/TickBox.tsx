import React from "react";
import { ActivityIndicator, Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, fonts, radii, space } from "../theme";
import { AppText } from "./Text";

export interface TickBoxProps {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  /** What the tick is about, for screen readers ("Milk bread, mix 1"). */
  accessibilityLabel?: string;
  busy?: boolean;
  disabled?: boolean;
  testID?: string;
  /** Fill the container's width (weigh-out cards). */
  block?: boolean;
}

/**
 * A large checkbox for the kitchen: a 56 px target that reads from a distance, filled sage when ticked.
 */
export function TickBox({ label, checked, onChange, accessibilityLabel, busy, disabled, testID, block }: TickBoxProps) {
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="checkbox"
      aria-checked={checked}
      aria-disabled={!!inactive}
      aria-busy={!!busy}
      accessibilityLabel={accessibilityLabel ?? label}
      disabled={inactive}
      onPress={() => onChange(!checked)}
      testID={testID}
      style={({ pressed }) => [
        styles.box,
        block && styles.block,
        checked ? styles.on : styles.off,
        pressed && (checked ? styles.onPressed : styles.offPressed),
        inactive && styles.inactive,
      ]}
    >
      <View style={[styles.mark, checked ? styles.markOn : styles.markOff]}>
        {busy ? <ActivityIndicator size="small" color={checked ? colors.sage : colors.crust} /> : checked ? <Feather name="check" size={22} color={colors.sage} /> : null}
      </View>
      <AppText variant="bodyStrong" color={checked ? "onPrimary" : "ink"} style={styles.label}>
        {label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  box: {
    minHeight: 56,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    borderRadius: radii.md,
    borderWidth: 2,
    alignSelf: "flex-start",
  },
  block: { alignSelf: "stretch" },
  off: { backgroundColor: colors.surface, borderColor: colors.inputBorder },
  offPressed: { backgroundColor: colors.sunken },
  on: { backgroundColor: colors.sage, borderColor: colors.sage },
  onPressed: { backgroundColor: colors.sagePressed, borderColor: colors.sagePressed },
  inactive: { opacity: 0.7 },
  mark: { width: 30, height: 30, borderRadius: radii.sm, alignItems: "center", justifyContent: "center", borderWidth: 2 },
  markOff: { borderColor: colors.inputBorder, backgroundColor: colors.surface },
  markOn: { borderColor: colors.surface, backgroundColor: colors.surface },
  label: { fontFamily: fonts.bold, fontSize: 17 },
});
