import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "../../../ui/Text";
import type { FormulaValues } from "../../../production/formulaForm";
import type { DraftChange } from "../../../production/formulaDraft";
import type { FieldErrors } from "../../../../shared/errors";
import { colors, radii, space } from "../../../theme";

/** What every card of the formula editor gets: the draft, the messages to show and the way to change it. */
export interface EditorCardProps {
  v: FormulaValues;
  fields: FieldErrors;
  update: (change: DraftChange) => void;
}

/** The row whose picker is open takes the full width, so its options have room. */
export interface OpenRow {
  openRow: string | null;
  opened: (key: string) => (open: boolean) => void;
}

/** A field that can be saved but probably should not be: amber, beside the field, read out when it appears. */
export function FieldWarning({ text, testID }: { text: string; testID?: string }) {
  return (
    <View style={styles.warning} testID={testID} accessibilityLiveRegion="polite">
      <Feather name="alert-triangle" size={15} color={colors.amberInk} style={styles.warningIcon} />
      <AppText variant="small" color="amberInk" style={styles.warningText}>
        {text}
      </AppText>
    </View>
  );
}

/** Layout the editor's cards share. */
export const editorStyles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 220 },
  cellSmall: { flexGrow: 1, flexBasis: 150 },
  full: { flexBasis: "100%" },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});

const styles = StyleSheet.create({
  warning: { flexDirection: "row", gap: space.xs, alignItems: "flex-start", backgroundColor: colors.amberSoft, borderRadius: radii.md, padding: space.sm, marginTop: space.xs },
  warningIcon: { marginTop: 2 },
  warningText: { flex: 1 },
});
