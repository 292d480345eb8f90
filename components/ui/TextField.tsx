import React, { forwardRef, useState } from "react";
import { StyleSheet, TextInput, type TextInputProps } from "react-native";
import { colors, fonts, layout, radii, space } from "../theme";
import { FieldFrame } from "./Field";

export interface TextFieldProps extends Omit<TextInputProps, "style"> {
  label: string;
  error?: string | null;
  hint?: string;
  /** Id used for testID of the input ("<testID>") and its error ("<testID>-error"). */
  testID?: string;
  optional?: boolean;
}

/** The keyboard and corrections for an e-mail address (spread into a TextField). */
export const EMAIL_INPUT = { keyboardType: "email-address", inputMode: "email", autoCapitalize: "none", autoCorrect: false } as const satisfies Partial<TextInputProps>;

/** A search box: no capitals or corrections, and the keyboard's key says "search". */
export const SEARCH_INPUT = { autoCapitalize: "none", autoCorrect: false, returnKeyType: "search" } as const satisfies Partial<TextInputProps>;

/** A labelled text input in the one field frame (components/ui/Field.tsx): label, hint, input, error. */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, error, hint, testID, optional, multiline, onFocus, onBlur, accessibilityLabel, ...rest },
  ref,
) {
  const [focused, setFocused] = useState(false);
  return (
    <FieldFrame label={label} hint={hint} error={error} optional={optional} testID={testID} labelForInput>
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
    </FieldFrame>
  );
});

const styles = StyleSheet.create({
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
});
