import React from "react";
import { StyleSheet, View } from "react-native";
import { Button } from "../../ui/Button";
import { Stepper } from "../../ui/Stepper";
import { TextField } from "../../ui/TextField";
import { AppText } from "../../ui/Text";
import type { BoardDto } from "../../api/board";
import type { Short } from "../../ordering/dispatch";
import { quantityText, saleUnitFor } from "../../../shared/quantity";
import { colors, radii, space } from "../../theme";

export interface DispatchLineProps {
  /** "<orderId>-<productId>", the line's testIDs. */
  lineKey: string;
  accountName: string;
  ordered: number;
  product: BoardDto["products"][number] | undefined;
  /** Marked short: what went out and why; undefined when it goes out in full. */
  short: Short | undefined;
  problem: string | undefined;
  onToggle: () => void;
  onChange: (patch: Partial<Short>) => void;
}

/** One line of an order: what was ordered, "Short", and when short how many went out and why. */
export function DispatchLine({ lineKey: key, accountName, ordered, product: p, short: s, problem, onToggle, onChange }: DispatchLineProps) {
  const name = p ? `${p.name} (${saleUnitFor(ordered, p)})` : "Product";
  return (
    <View style={[styles.line, s && styles.lineShort]} testID={`dispatch-line-${key}`}>
      <View style={styles.lineTop}>
        <AppText variant="bodyStrong" style={styles.qty}>
          {String(ordered)}
        </AppText>
        <AppText style={styles.flex}>{name}</AppText>
        <Button
          label={s ? "Short ✓" : "Short"}
          small
          variant={s ? "accent" : "secondary"}
          accessibilityLabel={s ? `${name} for ${accountName} is marked short; press to deliver it in full` : `Mark ${name} for ${accountName} as short`}
          aria-pressed={!!s}
          onPress={onToggle}
          testID={`dispatch-short-${key}`}
        />
      </View>
      {s ? (
        <View style={styles.shortForm}>
          <View style={styles.stepperWrap}>
            <AppText variant="label">Delivered</AppText>
            <Stepper value={s.delivered} onChange={(t) => onChange({ delivered: t })} min={0} max={Math.max(0, ordered - 1)} label={`${name} delivered to ${accountName}`} invalid={!!problem} testID={`dispatch-qty-${key}`} />
            <AppText variant="small" color="muted">{`of ${p ? quantityText(ordered, p) : ordered}`}</AppText>
          </View>
          <TextField label="Why" optional placeholder="Burnt batch, ran out, damaged…" value={s.reason} onChangeText={(t) => onChange({ reason: t })} testID={`dispatch-reason-${key}`} maxLength={200} />
          {problem ? (
            <AppText variant="small" color="dangerInk" testID={`dispatch-problem-${key}`}>
              {problem}
            </AppText>
          ) : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  line: { gap: space.sm, paddingVertical: space.sm, paddingHorizontal: space.sm, borderRadius: radii.md, borderWidth: 1, borderColor: colors.border },
  lineShort: { backgroundColor: colors.page, borderColor: colors.inputBorder },
  lineTop: { flexDirection: "row", alignItems: "center", gap: space.sm },
  qty: { minWidth: 32, textAlign: "right" },
  shortForm: { gap: space.sm, paddingLeft: space.xl },
  stepperWrap: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.sm },
});
