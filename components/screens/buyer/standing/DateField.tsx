import React from "react";
import { TextField, type TextFieldProps } from "../../../ui/TextField";

/** A calendar date typed as YYYY-MM-DD: no capitals, no autocorrect, the digits keyboard. */
export function DateField(props: Omit<TextFieldProps, "placeholder" | "autoCapitalize" | "autoCorrect" | "inputMode">) {
  return <TextField placeholder="YYYY-MM-DD" autoCapitalize="none" autoCorrect={false} inputMode="numeric" {...props} />;
}
