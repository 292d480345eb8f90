import React from "react";
import { StyleSheet, View } from "react-native";
import type Feather from "@expo/vector-icons/Feather";
import { Button } from "./Button";
import { space } from "../theme";

export interface FormActionsProps {
  submitLabel: string;
  submitIcon?: React.ComponentProps<typeof Feather>["name"];
  /** The form is sending: the submit button spins and takes no second press. */
  busy?: boolean;
  onSubmit: () => void;
  submitTestID?: string;
  /** A "Cancel" button closing the form; left out, there is none. */
  onCancel?: () => void;
  cancelTestID?: string;
}

/** The end of a form that opens in place: its submit button, and "Cancel" to close it unsent. */
export function FormActions({ submitLabel, submitIcon = "check", busy, onSubmit, submitTestID, onCancel, cancelTestID }: FormActionsProps) {
  return (
    <View style={styles.buttons}>
      <Button label={submitLabel} icon={submitIcon} busy={busy} onPress={onSubmit} testID={submitTestID} />
      {onCancel ? <Button label="Cancel" variant="ghost" onPress={onCancel} testID={cancelTestID} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
});
