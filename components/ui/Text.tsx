import React from "react";
import { Text as RNText, type TextProps, type TextStyle } from "react-native";
import { colors, type, type ColorName, type TypeVariant } from "../theme";

export interface AppTextProps extends TextProps {
  variant?: TypeVariant;
  color?: ColorName;
  align?: TextStyle["textAlign"];
}

/** Text in the theme's type scale. Use `Heading` for headings so screen readers see them. */
export function AppText({ variant = "body", color = "ink", align, style, ...rest }: AppTextProps) {
  return <RNText {...rest} style={[type[variant], { color: colors[color] }, align ? { textAlign: align } : null, style]} />;
}

export interface HeadingProps extends AppTextProps {
  level?: 1 | 2 | 3;
}

const levelVariant: Record<1 | 2 | 3, TypeVariant> = { 1: "title", 2: "heading", 3: "bodyStrong" };

export function Heading({ level = 1, variant, ...rest }: HeadingProps) {
  return <AppText accessibilityRole="header" aria-level={level} variant={variant ?? levelVariant[level]} {...rest} />;
}
