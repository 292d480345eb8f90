import React from "react";
import { StyleSheet, View, type ViewProps } from "react-native";
import { colors, radii, shadow, space } from "../theme";
import { Heading } from "./Text";

export interface CardProps extends ViewProps {
  title?: string;
  /** Right-aligned content in the card's title row (a button or a badge). */
  action?: React.ReactNode;
  padded?: boolean;
}

export function Card({ title, action, padded = true, style, children, ...rest }: CardProps) {
  return (
    <View style={[styles.card, padded && styles.padded, style]} {...rest}>
      {title || action ? (
        <View style={styles.titleRow}>
          {title ? (
            <Heading level={2} style={styles.title}>
              {title}
            </Heading>
          ) : (
            <View />
          )}
          {action}
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
    gap: space.md,
    ...shadow.card,
  },
  padded: { padding: space.lg },
  titleRow: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", gap: space.md, flexWrap: "wrap" },
  title: { flexShrink: 1 },
});
