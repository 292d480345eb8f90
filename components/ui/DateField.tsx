import React, { useState } from "react";
import { Platform } from "react-native";
import { colors, fonts, layout, radii, space } from "../theme";
import { FieldFrame } from "./Field";
import { TextField } from "./TextField";

export interface DateFieldProps {
  label: string;
  /** The date as YYYY-MM-DD, or "" when none is chosen. */
  value: string;
  onChangeText: (value: string) => void;
  error?: string | null;
  hint?: string;
  optional?: boolean;
  /** Earliest and latest dates offered (YYYY-MM-DD): the picker greys out the rest. */
  min?: string;
  max?: string;
  /** Enter in the field (desktop), e.g. "Add" or "Go". */
  onSubmitEditing?: () => void;
  disabled?: boolean;
  testID?: string;
}

/**
 * A calendar date. On the web: the browser's own date input (HTML Living Standard, input type=date), which opens
 * the phone's date wheel or the desktop's calendar, still takes typing on a desktop (day, month and year in the
 * reader's own locale order), and always hands over YYYY-MM-DD — or "" while the date is incomplete. Elsewhere
 * (native, Jest): a text field for YYYY-MM-DD with the digits keyboard.
 */
export function DateField({ label, value, onChangeText, error, hint, optional, min, max, onSubmitEditing, disabled, testID }: DateFieldProps) {
  const [focused, setFocused] = useState(false);
  if (Platform.OS !== "web") {
    return (
      <TextField
        label={label}
        value={value}
        onChangeText={onChangeText}
        error={error}
        hint={hint}
        optional={optional}
        placeholder="YYYY-MM-DD"
        autoCapitalize="none"
        autoCorrect={false}
        inputMode="numeric"
        maxLength={10}
        editable={!disabled}
        onSubmitEditing={onSubmitEditing}
        testID={testID}
      />
    );
  }
  const style: React.CSSProperties = { ...webInput, ...(focused ? webFocused : null), ...(error ? webInvalid : null), ...(disabled ? { opacity: 0.6 } : null) };
  return (
    <FieldFrame label={label} hint={hint} error={error} optional={optional} testID={testID} labelForInput>
      <input
        type="date"
        value={value}
        min={min}
        max={max}
        disabled={disabled}
        aria-label={label}
        aria-invalid={!!error}
        data-testid={testID}
        onChange={(e) => onChangeText(e.currentTarget.value)}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        onKeyDown={(e) => {
          if (e.key === "Enter" && onSubmitEditing) {
            e.preventDefault();
            onSubmitEditing();
          }
        }}
        style={style}
      />
    </FieldFrame>
  );
}

/** The same look as TextField's input (components/ui/TextField.tsx), as DOM styles. */
const webInput: React.CSSProperties = {
  boxSizing: "border-box",
  width: "100%",
  minHeight: layout.minTouch + 4,
  border: `1.5px solid ${colors.inputBorder}`,
  borderRadius: radii.md,
  backgroundColor: colors.surface,
  padding: `${space.sm}px ${space.md}px`,
  fontFamily: fonts.regular,
  fontSize: 16,
  color: colors.ink,
};
const webFocused: React.CSSProperties = { border: `2px solid ${colors.focus}`, outline: "none" };
const webInvalid: React.CSSProperties = { border: `2px solid ${colors.danger}` };
