import React from "react";
import { ActivityIndicator, Pressable, StyleSheet, View, type PressableProps, type ViewStyle } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, layout, radii, space, type ColorName } from "../theme";
import { AppText } from "./Text";

export type ButtonVariant = "primary" | "secondary" | "accent" | "danger" | "ghost";

export interface ButtonProps extends Omit<PressableProps, "children" | "style"> {
  label: string;
  variant?: ButtonVariant;
  icon?: React.ComponentProps<typeof Feather>["name"];
  busy?: boolean;
  /** Stretch to the container's width. */
  block?: boolean;
  small?: boolean;
  style?: ViewStyle;
}

const look: Record<ButtonVariant, { bg: string; pressed: string; fg: ColorName; border?: string }> = {
  primary: { bg: colors.primary, pressed: colors.primaryPressed, fg: "onPrimary" },
  accent: { bg: colors.sage, pressed: colors.sagePressed, fg: "onPrimary" },
  danger: { bg: colors.danger, pressed: colors.dangerPressed, fg: "onPrimary" },
  secondary: { bg: colors.surface, pressed: colors.sunken, fg: "ink", border: colors.inputBorder },
  ghost: { bg: "transparent", pressed: colors.sunken, fg: "crust" },
};

export function Button({ label, variant = "primary", icon, busy, block, small, disabled, style, accessibilityLabel, ...rest }: ButtonProps) {
  const l = look[variant];
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel}
      aria-disabled={!!inactive}
      aria-busy={!!busy}
      disabled={inactive}
      style={({ pressed }) => [
        styles.base,
        small && styles.small,
        block && styles.block,
        { backgroundColor: pressed ? l.pressed : l.bg },
        l.border ? { borderWidth: 1, borderColor: l.border } : null,
        inactive && styles.inactive,
        style,
      ]}
      {...rest}
    >
      <View style={styles.row}>
        {busy ? (
          <ActivityIndicator size="small" color={colors[l.fg]} />
        ) : icon ? (
          <Feather name={icon} size={18} color={colors[l.fg]} accessibilityElementsHidden importantForAccessibility="no" />
        ) : null}
        <AppText variant="label" color={l.fg} style={styles.label}>
          {label}
        </AppText>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: layout.minTouch,
    minWidth: layout.minTouch,
    paddingHorizontal: space.lg,
    borderRadius: radii.pill,
    alignItems: "center",
    justifyContent: "center",
    alignSelf: "flex-start",
  },
  small: { paddingHorizontal: space.md },
  block: { alignSelf: "stretch" },
  inactive: { opacity: 0.6 },
  row: { flexDirection: "row", alignItems: "center", gap: space.sm },
  label: { fontSize: 15 },
});
