import React from "react";
import { StyleSheet, View } from "react-native";
import { fonts, space } from "../theme";
import { AppText } from "./Text";

export interface FieldFrameProps {
  label: string;
  /** Hide the visible label (rows of a table where the column says it); the input keeps it for screen readers. */
  hideLabel?: boolean;
  hint?: string;
  error?: string | null;
  optional?: boolean;
  /** The input's testID: the error is "<testID>-error", the label "<testID>-label". */
  testID?: string;
  /** The label is read by screen readers from the input itself (text inputs); groups announce it from here. */
  labelForInput?: boolean;
  children: React.ReactNode;
}

/**
 * The one frame under every input: its label (with "(optional)"), a hint, the input, and the error right
 * below it. Text fields, choice groups, pickers and multi-choices all sit in it, so errors and hints look and
 * read the same everywhere.
 */
export function FieldFrame({ label, hideLabel, hint, error, optional, testID, labelForInput, children }: FieldFrameProps) {
  return (
    <View style={styles.wrap}>
      {hideLabel ? null : (
        <AppText
          variant="label"
          nativeID={testID ? `${testID}-label` : undefined}
          {...(labelForInput ? { accessibilityElementsHidden: true, importantForAccessibility: "no" as const } : {})}
        >
          {label}
          {optional ? <AppText variant="small" color="muted">{"  (optional)"}</AppText> : null}
        </AppText>
      )}
      {hint ? (
        <AppText variant="small" color="muted">
          {hint}
        </AppText>
      ) : null}
      {children}
      {error ? (
        <AppText variant="small" color="dangerInk" testID={testID ? `${testID}-error` : undefined} accessibilityLiveRegion="polite" style={styles.error}>
          {error}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  error: { fontFamily: fonts.semibold },
});
