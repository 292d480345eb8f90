import React, { forwardRef, useState } from "react";
import { StyleSheet, TextInput, View, type TextInputProps } from "react-native";
import { colors, fonts, layout, radii, space } from "../theme";
import { AppText } from "./Text";

export interface TextFieldProps extends Omit<TextInputProps, "style"> {
  label: string;
  error?: string | null;
  hint?: string;
  /** Id used for testID of the input ("<testID>") and its error ("<testID>-error"). */
  testID?: string;
  optional?: boolean;
}

/** A labelled input with its hint and its error message right below it. */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, error, hint, testID, optional, multiline, onFocus, onBlur, accessibilityLabel, ...rest },
  ref,
) {
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.wrap}>
      <AppText variant="label" accessibilityElementsHidden importantForAccessibility="no">
        {label}
        {optional ? <AppText variant="small" color="muted">{"  (optional)"}</AppText> : null}
      </AppText>
      {hint ? (
        <AppText variant="small" color="muted">
          {hint}
        </AppText>
      ) : null}
      <TextInput
        ref={ref}
        accessibilityLabel={accessibilityLabel ?? label}
        aria-invalid={!!error}
        testID={testID}
        placeholderTextColor={colors.muted}
        multiline={multiline}
        onFocus={(e) => {
          setFocused(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          onBlur?.(e);
        }}
        style={[
          styles.input,
          multiline && styles.multiline,
          focused && styles.focused,
          error ? styles.invalid : null,
        ]}
        {...rest}
      />
      {error ? (
        <AppText variant="small" color="dangerInk" testID={testID ? `${testID}-error` : undefined} accessibilityLiveRegion="polite" style={styles.error}>
          {error}
        </AppText>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  input: {
    minHeight: layout.minTouch + 4,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    borderRadius: radii.md,
    backgroundColor: colors.surface,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    fontFamily: fonts.regular,
    fontSize: 16,
    color: colors.ink,
  },
  multiline: { minHeight: 96, textAlignVertical: "top" },
  focused: { borderColor: colors.focus, borderWidth: 2 },
  invalid: { borderColor: colors.danger, borderWidth: 2 },
  error: { fontFamily: fonts.semibold },
});
