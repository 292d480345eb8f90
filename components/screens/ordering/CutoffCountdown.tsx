import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "../../ui/Text";
import { formatCountdown, isUrgent, msUntil } from "../../ordering/countdown";
import { formatCutoff } from "../../ordering/dates";
import { colors, radii, space } from "../../theme";

export interface CutoffCountdownProps {
  cutoffAt: string;
  now: number;
  timeZone?: string;
  testID?: string;
  /** One line ("Closes in 3 h 12 min") without the cut-off time below. */
  compact?: boolean;
}

/** "Closes in 3 h 12 min" (urgent under an hour), and the cut-off in the bakery's time zone. */
export function CutoffCountdown({ cutoffAt, now, timeZone, testID = "countdown", compact }: CutoffCountdownProps) {
  const ms = msUntil(cutoffAt, now);
  const urgent = isUrgent(ms);
  const closed = ms <= 0;
  const text = formatCountdown(ms);
  const label = text.charAt(0).toUpperCase() + text.slice(1);
  const when = formatCutoff(cutoffAt, timeZone);
  return (
    <View style={styles.countdown}>
      <View
        style={[styles.pill, urgent ? styles.pillUrgent : closed ? styles.pillClosed : styles.pillCalm]}
        accessibilityLiveRegion={urgent ? "polite" : "none"}
        testID={testID}
      >
        <Feather name={urgent ? "alert-triangle" : closed ? "lock" : "clock"} size={15} color={urgent ? colors.dangerInk : closed ? colors.neutralInk : colors.crustInk} />
        <AppText variant="label" color={urgent ? "dangerInk" : closed ? "neutralInk" : "crustInk"} testID={`${testID}-text`}>
          {label}
        </AppText>
      </View>
      {!compact && when ? (
        <AppText variant="small" color="muted" testID={`${testID}-at`}>
          {closed ? `Cut-off was ${when}` : `Cut-off ${when}`}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  countdown: { gap: space.xxs, alignItems: "flex-start" },
  pill: { flexDirection: "row", alignItems: "center", gap: space.xs, borderRadius: radii.pill, paddingHorizontal: space.sm + 2, paddingVertical: space.xxs + 1 },
  pillCalm: { backgroundColor: colors.crustSoft },
  pillUrgent: { backgroundColor: colors.dangerSoft },
  pillClosed: { backgroundColor: colors.neutralSoft },
});
