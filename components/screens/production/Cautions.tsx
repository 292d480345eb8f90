import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { AppText } from "../../ui/Text";
import { dayCautions, pasteCautionText, type CautionDay } from "../../../shared/cautions";
import { STEP_LABELS, type StepKind } from "../../../shared/production";
import { cautionFor } from "../../production/plan";
import { useUnits, type Units } from "../../production/units";
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

/**
 * The caution written out, compact, where the work happens (the paste, the mixer). The paste's caution carries
 * the formula's own cook-to temperature, in the units chosen.
 */
export function CautionNote({ step, cookToC, testID }: { step: string; cookToC?: number; testID?: string }) {
  const units = useUnits();
  const generic = cautionFor(step);
  const c = step === "paste" && cookToC !== undefined ? { title: "Hot paste", text: pasteCautionText(cookToC, units) } : generic;
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

/**
 * The day's safety reminders, worked out from what it bakes (shared/cautions.ts dayCautions): the allergens of
 * its products by name, each paste's cook-to temperature, steam, lifting, flour dust, a paste made ahead, raw egg
 * wash, the internal temperature to record; the last line is always the deferral to local code and practice.
 */
export function CautionsCard({ plan, units }: { plan: CautionDay; units: Units }) {
  const cautions = dayCautions(plan, units);
  const deferral = cautions[cautions.length - 1];
  return (
    <Card title="Cautions" testID="cautions">
      <View style={styles.list}>
        {cautions.slice(0, -1).map((c) => (
          <View key={c.key} style={styles.row} testID={`caution-${c.key}`}>
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
        {deferral.text}
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
