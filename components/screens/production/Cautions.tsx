import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { AppText } from "../../ui/Text";
import { CAUTION_FOOTNOTE, PRODUCTION_CAUTIONS } from "../../../shared/cautions";
import { STEP_LABELS, type StepKind } from "../../../shared/production";
import { cautionFor } from "../../production/plan";
import { colors, radii, space } from "../../theme";

/** The caution's title as a small tag beside a step ("⚠ Hot paste"). */
export function CautionTag({ step, testID }: { step: string; testID?: string }) {
  const c = cautionFor(step);
  if (!c) return null;
  return (
    <View style={styles.tag} accessible accessibilityLabel={`Caution: ${c.title}. ${c.text}`} testID={testID}>
      <Feather name="alert-triangle" size={13} color={colors.amberInk} />
      <AppText variant="caption" color="amberInk" style={styles.tagText}>
        {c.title}
      </AppText>
    </View>
  );
}

/** The caution written out, compact, where the work happens (the paste, the mixer). */
export function CautionNote({ step, testID }: { step: string; testID?: string }) {
  const c = cautionFor(step);
  if (!c) return null;
  return (
    <View style={styles.note} testID={testID}>
      <Feather name="alert-triangle" size={16} color={colors.amberInk} style={styles.icon} />
      <AppText variant="small" color="amberInk" style={styles.flex}>
        <AppText variant="label" color="amberInk">{`${c.title}: `}</AppText>
        {c.text}
      </AppText>
    </View>
  );
}

/** Every caution by its step, and the footnote: a reminder, not the bakery's procedure. */
export function CautionsCard() {
  return (
    <Card title="Safety reminders" testID="cautions">
      <View style={styles.list}>
        {PRODUCTION_CAUTIONS.map((c) => (
          <View key={c.step} style={styles.row} testID={`caution-${c.step}`}>
            <Feather name="alert-triangle" size={16} color={colors.amberInk} style={styles.icon} />
            <View style={styles.flex}>
              <AppText variant="label">{`${c.title} · ${STEP_LABELS[c.step as StepKind]}`}</AppText>
              <AppText variant="small" color="muted">
                {c.text}
              </AppText>
            </View>
          </View>
        ))}
      </View>
      <AppText variant="caption" color="muted" testID="caution-footnote">
        {CAUTION_FOOTNOTE}
      </AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  icon: { marginTop: 2 },
  tag: {
    flexDirection: "row",
    alignItems: "center",
    gap: space.xxs + 1,
    alignSelf: "flex-start",
    flexShrink: 1,
    maxWidth: "100%",
    backgroundColor: colors.amberSoft,
    borderRadius: radii.md,
    paddingHorizontal: space.sm,
    paddingVertical: 1,
  },
  tagText: { flexShrink: 1 },
  note: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", backgroundColor: colors.amberSoft, borderRadius: radii.md, padding: space.sm + 2 },
  list: { gap: space.md },
  row: { flexDirection: "row", gap: space.sm, alignItems: "flex-start" },
});
