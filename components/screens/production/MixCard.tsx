import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText, Heading } from "../../ui/Text";
import { Badge } from "../../ui/Badge";
import { TickBox } from "../../ui/TickBox";
import { CautionNote } from "./Cautions";
import { mixLiquidAdvice } from "../../../shared/cautions";
import { liquidNeedsAttention } from "../../../shared/production";
import type { PlanView } from "../../api/production";
import type { Units } from "../../production/units";
import { colors, fonts, radii, space } from "../../theme";
import { formatAtOwnOffset } from "../../../shared/format";
import { currentLocale } from "../../format";

export type Dough = PlanView["doughs"][number];
export type Mix = Dough["mixes"][number];

export interface MixCardProps {
  dough: Dough;
  mix: Mix;
  units: Units;
  done: boolean;
  busy: boolean;
  onDone: (done: boolean) => void;
}

/**
 * One weigh-out card: what goes into one mixer load, and when and on which mixer it is mixed (its mix step on
 * the timeline). The paste (cooked first) and the final mix are weighed separately; the liquid temperature is
 * what makes the dough come out at its target.
 */
export function MixCard({ dough, mix, units, done, busy, onDone }: MixCardProps) {
  const id = `mix-${dough.formulaId}-${mix.index}`;
  const names = new Map(dough.ingredients.map((i) => [i.ingredientId, i.name]));
  const paste = mix.ingredients.filter((i) => i.pasteGrams > 0);
  const pasteTotal = paste.reduce((s, i) => s + i.pasteGrams, 0);
  const final = mix.ingredients.filter((i) => i.finalMixGrams > 0);
  const of = dough.mixes.length;
  // The liquid's ice, chilling or warming, worded in the chosen units; flagged when the liquid cannot be reached.
  const flagged = mix.liquid ? liquidNeedsAttention(mix.liquid) : !!mix.liquidTempAdvice;
  const advice = mix.liquid ? mixLiquidAdvice(dough, mix, units) : mix.liquidTempAdvice;
  const ice = mix.liquid && mix.liquid.iceGrams > 0 ? mix.liquid : null;
  return (
    <View style={[styles.card, done && styles.cardDone]} testID={id}>
      <View style={styles.head}>
        <View style={styles.flex}>
          <AppText variant="overline" color="crust">
            {of > 1 ? `Mix ${mix.index} of ${of}` : "Mix 1 of 1"}
          </AppText>
          <Heading level={3} variant="title" testID={`${id}-name`}>
            {dough.name}
          </Heading>
          <AppText variant="small" color="muted">{`Formula version ${dough.formulaVersion}${dough.targetInternalC ? ` · bake to ${units.temp(dough.targetInternalC)} inside` : ""}`}</AppText>
          {mix.scheduled ? (
            <AppText variant="bodyStrong" color="crust" testID={`${id}-time`}>
              {mixTimeText(mix.scheduled, !!(dough.paste && paste.length))}
            </AppText>
          ) : null}
        </View>
        {done ? <Badge label="Mixed" tone="sage" testID={`${id}-done-badge`} /> : null}
      </View>

      <View style={styles.figures}>
        <View style={styles.figure}>
          <AppText variant="caption" color="muted">
            Dough weight
          </AppText>
          <AppText style={styles.figureValue} testID={`${id}-dough`}>
            {units.mass(mix.doughGrams)}
          </AppText>
        </View>
        {mix.liquidTempC !== null ? (
          <View style={[styles.figure, flagged && styles.figureFlagged]} testID={`${id}-liquid-box`}>
            <AppText variant="caption" color={flagged ? "amberInk" : "muted"}>
              Liquid temperature
            </AppText>
            <AppText style={styles.liquidValue} color={flagged ? "amberInk" : "ink"} testID={`${id}-liquid`}>
              {units.temp(mix.liquidTempC)}
            </AppText>
          </View>
        ) : null}
      </View>
      {advice ? (
        <View style={[styles.advice, !flagged && styles.adviceCalm]} accessibilityRole={flagged ? "alert" : undefined} testID={`${id}-advice`}>
          <Feather name="thermometer" size={18} color={flagged ? colors.amberInk : colors.ink} />
          <AppText variant="bodyStrong" color={flagged ? "amberInk" : "ink"} style={styles.flex}>
            {advice}
          </AppText>
        </View>
      ) : null}

      {dough.paste && paste.length ? (
        <View style={styles.section} testID={`${id}-paste`}>
          <SectionHead title="Paste" detail={`Cook to ${units.temp(dough.paste.cookToC)}, then cool`} step="1" />
          {paste.map((i) => (
            <WeighRow key={i.ingredientId} name={names.get(i.ingredientId) ?? "Ingredient"} amount={units.mass(i.pasteGrams)} testID={`${id}-paste-${i.ingredientId}`} />
          ))}
          <CautionNote step="paste" cookToC={dough.paste.cookToC} testID={`${id}-paste-caution`} />
        </View>
      ) : null}

      <View style={styles.section} testID={`${id}-final`}>
        <SectionHead title="Final mix" detail={mix.liquidTempC !== null ? `Liquid at ${units.temp(mix.liquidTempC)}` : undefined} step={dough.paste && paste.length ? "2" : undefined} />
        {dough.paste && paste.length ? <WeighRow name="Cooled paste (all of it)" amount={units.mass(pasteTotal)} muted testID={`${id}-final-paste`} /> : null}
        {final.map((i) =>
          ice && ice.waterIngredientId === i.ingredientId ? (
            <React.Fragment key={i.ingredientId}>
              <WeighRow name={`${names.get(i.ingredientId) ?? "Water"} (tap)`} amount={units.mass(Math.max(0, i.finalMixGrams - ice.iceGrams))} testID={`${id}-final-${i.ingredientId}`} />
              <WeighRow name={`Crushed ice, for the ${(names.get(i.ingredientId) ?? "water").toLowerCase()}`} amount={units.mass(ice.iceGrams)} testID={`${id}-ice`} />
            </React.Fragment>
          ) : (
            <WeighRow key={i.ingredientId} name={names.get(i.ingredientId) ?? "Ingredient"} amount={units.mass(i.finalMixGrams)} testID={`${id}-final-${i.ingredientId}`} />
          ),
        )}
        <CautionNote step="mix" testID={`${id}-mix-caution`} />
      </View>

      <TickBox
        block
        label={done ? "Weighed and mixed" : "Weighed and mixed?"}
        accessibilityLabel={`Weighed and mixed: ${dough.name}, mix ${mix.index} of ${of}`}
        checked={done}
        busy={busy}
        onChange={onDone}
        testID={`${id}-done`}
      />
    </View>
  );
}

/** "Mix 1:40 AM–1:55 AM on the Spiral mixer · paste on at 1:00 AM" (en-US; with the weekday when it is the day before). */
export function mixTimeText(s: NonNullable<Mix["scheduled"]>, withPaste: boolean): string {
  const at = (iso: string) => formatAtOwnOffset(iso, s.dayBefore ? "weekdayTime" : "time", currentLocale());
  const paste = withPaste && s.pasteStartsAt ? ` · paste on at ${at(s.pasteStartsAt)}` : "";
  const retard = s.dayBefore ? " · the day before: this dough is retarded overnight" : "";
  return `Mix ${at(s.startsAt)}–${formatAtOwnOffset(s.endsAt, "time", currentLocale())} on ${s.mixerName}${paste}${retard}`;
}

function SectionHead({ title, detail, step }: { title: string; detail?: string; step?: string }) {
  return (
    <View style={styles.sectionHead}>
      {step ? (
        <View style={styles.stepDot}>
          <AppText variant="label" color="onPrimary">
            {step}
          </AppText>
        </View>
      ) : null}
      <Heading level={3} variant="heading">
        {title}
      </Heading>
      {detail ? (
        <AppText variant="bodyStrong" color="crust" style={styles.sectionDetail}>
          {detail}
        </AppText>
      ) : null}
    </View>
  );
}

/** An ingredient and its weight, the weight large and right-aligned so columns of numbers line up. */
function WeighRow({ name, amount, muted, testID }: { name: string; amount: string; muted?: boolean; testID?: string }) {
  return (
    <View style={styles.row} testID={testID} accessible accessibilityLabel={`${name}: ${amount}`}>
      <AppText style={[styles.rowName, muted && styles.rowNameMuted]} color={muted ? "muted" : "ink"}>
        {name}
      </AppText>
      <AppText style={styles.rowAmount}>{amount}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  card: {
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 2,
    borderColor: colors.border,
    padding: space.lg,
    gap: space.md,
  },
  cardDone: { borderColor: colors.sage },
  head: { flexDirection: "row", alignItems: "flex-start", gap: space.sm },
  figures: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  figure: { flexGrow: 1, flexBasis: 180, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  figureFlagged: { backgroundColor: colors.amberSoft },
  figureValue: { fontFamily: fonts.extrabold, fontSize: 30, lineHeight: 36, fontVariant: ["tabular-nums"] },
  liquidValue: { fontFamily: fonts.extrabold, fontSize: 44, lineHeight: 50, fontVariant: ["tabular-nums"] },
  advice: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", backgroundColor: colors.amberSoft, borderRadius: radii.md, padding: space.md },
  adviceCalm: { backgroundColor: colors.sunken },
  section: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.md },
  sectionHead: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.sm, marginBottom: space.xs },
  sectionDetail: { marginLeft: "auto" },
  stepDot: { width: 26, height: 26, borderRadius: 13, backgroundColor: colors.primary, alignItems: "center", justifyContent: "center" },
  row: {
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    minHeight: 44,
    paddingVertical: space.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  rowName: { flex: 1, fontFamily: fonts.semibold, fontSize: 18, lineHeight: 24 },
  rowNameMuted: { fontFamily: fonts.regular },
  rowAmount: { fontFamily: fonts.extrabold, fontSize: 24, lineHeight: 30, textAlign: "right", fontVariant: ["tabular-nums"] },
});
