import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { ProgressBar } from "../../../ui/ProgressBar";
import { FormError, Notice } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import { messageOf } from "../../../api/client";
import type { PlanView } from "../../../api/production";
import { formatCutoff } from "../../../ordering/dates";
import { localDayTime, progressText, type ProgressCount } from "../../../production/plan";
import { colors, radii, space } from "../../../theme";

export interface StatusCardProps {
  plan: PlanView;
  timeZone?: string;
  now: number;
  progress: ProgressCount;
  recalculating: boolean;
  recalcError: unknown;
  onRecalculate: () => void;
  /** What the last deliberate recalculation or input change moved (null before any). */
  lastChanges: { what: string; changes: string[] } | null;
  /** Only the banner (a day with nothing to bake). */
  bannerOnly?: boolean;
}

/** Final or not, set at the cut-off or live, how far the day has got; recalculate on purpose; the production sheet. */
export function StatusCard({ plan, timeZone, now, progress, recalculating, recalcError, onRecalculate, lastChanges, bannerOnly }: StatusCardProps) {
  const [confirming, setConfirming] = useState(false);
  const cutoff = formatCutoff(plan.cutoffAt, timeZone) || localDayTime(plan.cutoffAt);
  const pastCutoff = now >= Date.parse(plan.cutoffAt);
  const headline = plan.final
    ? "Final — orders are locked for this day."
    : pastCutoff
      ? `Not final — the cut-off (${cutoff}) has passed, but some orders are still open.`
      : `Not final — orders can change until the cut-off at ${cutoff}.`;
  const stored = plan.frozen && plan.frozenAt ? `Plan set at the cut-off and kept; worked out ${formatCutoff(plan.frozenAt, timeZone) || localDayTime(plan.frozenAt)}.` : `Worked out from the orders as they are now (${formatCutoff(plan.computedAt, timeZone) || localDayTime(plan.computedAt)}).`;
  const total = progress.mixes + progress.waves;
  return (
    <Card testID="plan-status-card">
      <View style={[styles.banner, plan.final ? styles.bannerFinal : styles.bannerOpen]} testID="plan-status" accessibilityRole="summary">
        <Feather name={plan.final ? "lock" : "clock"} size={22} color={plan.final ? colors.sageInk : colors.amberInk} style={styles.bannerIcon} />
        <View style={styles.flex}>
          <AppText variant="bodyStrong" color={plan.final ? "sageInk" : "amberInk"} style={styles.bannerText} testID="plan-status-text">
            {headline}
          </AppText>
          <AppText variant="small" color={plan.final ? "sageInk" : "amberInk"} testID="plan-frozen-at">
            {stored}
          </AppText>
        </View>
      </View>

      {bannerOnly ? null : (
        <>
      {plan.changes.length ? (
        <View style={styles.pending} testID="plan-pending-changes">
          <AppText variant="bodyStrong" color="amberInk">
            Since this plan was set at the cut-off, a fresh calculation would differ:
          </AppText>
          {plan.changes.map((c) => (
            <AppText key={c} variant="small" color="amberInk">{`•  ${c}`}</AppText>
          ))}
          <AppText variant="small" color="amberInk">
            The cards below still show the plan set at the cut-off. Recalculate to use the changes.
          </AppText>
        </View>
      ) : null}

      <View style={styles.progress} testID="plan-progress">
        <AppText variant="bodyStrong" testID="plan-progress-text">
          {progressText(progress)}
        </AppText>
        <ProgressBar value={total ? (progress.mixesDone + progress.wavesBaked) / total : 0} label={progressText(progress)} />
      </View>

      {lastChanges ? (
        lastChanges.changes.length ? (
          <View style={styles.changes} testID="plan-changes" accessibilityLiveRegion="polite">
            <AppText variant="bodyStrong" color="sageInk">{`${lastChanges.what} What changed:`}</AppText>
            {lastChanges.changes.map((c) => (
              <AppText key={c} variant="small" color="sageInk">{`•  ${c}`}</AppText>
            ))}
          </View>
        ) : (
          <Notice message={`${lastChanges.what} Nothing changed.`} testID="plan-changes" />
        )
      ) : null}
      <FormError message={recalcError ? messageOf(recalcError) : null} testID="recalculate-error" />

      {confirming ? (
        <View style={styles.confirm} testID="recalculate-panel">
          <AppText variant="bodyStrong">Recalculate from the current orders, formulas and settings?</AppText>
          <AppText variant="small" color="muted">
            Pans, weigh-out cards and times can change. Ticks already made stay.
          </AppText>
          <View style={styles.buttons}>
            <Button
              label="Yes, recalculate"
              icon="refresh-cw"
              busy={recalculating}
              onPress={() => {
                onRecalculate();
                setConfirming(false);
              }}
              testID="recalculate-confirm"
            />
            <Button label="Keep this plan" variant="secondary" onPress={() => setConfirming(false)} testID="recalculate-cancel" />
          </View>
        </View>
      ) : (
        <View style={styles.buttons}>
          <Button label="Recalculate" icon="refresh-cw" variant="secondary" busy={recalculating} onPress={() => setConfirming(true)} testID="recalculate" />
        </View>
      )}
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  banner: { flexDirection: "row", gap: space.md, alignItems: "flex-start", borderRadius: radii.md, padding: space.md },
  bannerIcon: { marginTop: 2 },
  bannerText: { fontSize: 18, lineHeight: 25 },
  bannerFinal: { backgroundColor: colors.sageSoft },
  bannerOpen: { backgroundColor: colors.amberSoft },
  pending: { gap: space.xs, backgroundColor: colors.amberSoft, borderRadius: radii.md, padding: space.md },
  progress: { gap: space.xs },
  changes: { gap: space.xs, backgroundColor: colors.sageSoft, borderRadius: radii.md, padding: space.md },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.sunken },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
