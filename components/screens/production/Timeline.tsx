import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { AppText, Heading } from "../../ui/Text";
import { Badge } from "../../ui/Badge";
import { TickBox } from "../../ui/TickBox";
import { EmptyState } from "../../ui/States";
import { CautionTag } from "./Cautions";
import type { PlanView } from "../../api/production";
import type { Units } from "../../production/units";
import {
  clockIn, groupTimeline, hourTicks, isCurrent, localTime, resourceLanes, timeRangeOn, timelineSpan,
  type TimelineEntry, type TimelineGroup,
} from "../../production/plan";
import { colors, fonts, radii, space, type ColorName } from "../../theme";

export interface TimelineProps {
  plan: PlanView;
  units: Units;
  /** The clock (server-corrected), to mark the step under way. */
  now: number;
  wide: boolean;
  /** Oven loads ticked baked (the progress stores them as "waves"). */
  bakedWaves: number[];
  busyWave: number | null;
  onBaked: (load: number, baked: boolean) => void;
}

/** What kind of work a step is, for the bar's colour (and the legend). */
const KIND_GROUPS: { label: string; color: ColorName; steps: string[] }[] = [
  { label: "Paste and mixing", color: "crust", steps: ["paste", "mix", "knead"] },
  { label: "Resting, proofing, retarding", color: "sage", steps: ["rest", "bulk", "bench", "proof", "retard"] },
  { label: "Dividing, shaping, washing", color: "focus", steps: ["divide", "shape", "wash"] },
  { label: "Oven loads and temperature changes", color: "danger", steps: ["bake", "heat"] },
  { label: "Cooling", color: "inputBorder", steps: ["cool"] },
];
const barColor = (step: string) => colors[KIND_GROUPS.find((g) => g.steps.includes(step))?.color ?? "inputBorder"];

const pansText = (n: number) => (n === 1 ? "1 pan" : `${n} pans`);

/**
 * The day's one schedule: the conflicts with the shift first (and the earlier start that fits), then, from
 * 1024 px, a lane per mixer, the crew and each oven on one time scale; and on every width the blocks of the day
 * in time order: each mix (paste to dividing) and each oven load (shaping to cooling), every step labelled with
 * the mixer, oven or crew it takes.
 */
export function Timeline(props: TimelineProps) {
  const { plan, units, wide } = props;
  const groups = groupTimeline(plan);
  const schedule = plan.schedule;
  return (
    <Card
      title="Timeline"
      testID="timeline"
      action={
        <AppText variant="bodyStrong" color="muted" testID="timeline-dispatch">
          {`Dispatch ${localTime(plan.inputs.dispatchAt)}`}
        </AppText>
      }
    >
      {schedule && schedule.conflicts.length ? <Conflicts plan={plan} /> : null}
      {groups.length === 0 ? (
        <EmptyState icon="clock" title="No timeline yet" message="Steps show here once a product with a formula is ordered for this day." testID="timeline-empty" />
      ) : (
        <>
          {wide && schedule ? <ResourceLanes {...props} /> : null}
          <View style={[styles.groups, wide && styles.groupsWide]}>
            {groups.map((g) => (
              <GroupBlock key={g.key} {...props} group={g} />
            ))}
          </View>
        </>
      )}
      <AppText variant="small" color="muted" testID="timeline-packing">
        {plan.inputs.packFrom
          ? `Pack and load from ${localTime(plan.inputs.packFrom)} (${plan.inputs.packingMinutes} min before dispatch): every step ends by then.${plan.inputs.shiftStartAt ? ` The shift starts at ${localTime(plan.inputs.shiftStartAt)}.` : ""} Times are the bakery's local time; temperatures in ${units.tempUnit}.`
          : `Times are the bakery's local time; temperatures in ${units.tempUnit}.`}
      </AppText>
    </Card>
  );
}

/** What does not fit, and the start that would. */
function Conflicts({ plan }: { plan: PlanView }) {
  const s = plan.schedule!;
  return (
    <View style={styles.conflicts} accessibilityRole="alert" testID="timeline-conflicts">
      <View style={styles.conflictHead}>
        <Feather name="alert-octagon" size={20} color={colors.danger} />
        <AppText variant="bodyStrong" color="danger" style={styles.flex}>
          {s.earlierStart ? "The day does not fit the shift" : "Part of the day cannot be scheduled"}
        </AppText>
      </View>
      {s.earlierStart ? (
        <AppText style={styles.earlier} testID="timeline-earlier-start">
          {s.earlierStart.text}
        </AppText>
      ) : null}
      {s.conflicts.map((c, i) => (
        <AppText key={`${c.kind}-${i}`} variant="small" testID={`timeline-conflict-${i}`}>
          {c.message}
        </AppText>
      ))}
    </View>
  );
}

function doughName(plan: PlanView, formulaId: number | null): string {
  return plan.doughs.find((d) => d.formulaId === formulaId)?.name ?? "";
}

function groupTitle(plan: PlanView, g: TimelineGroup, units: Units): { title: string; detail: string } {
  const names = g.productIds.map((id) => plan.products.find((p) => p.productId === id)?.name).filter(Boolean) as string[];
  if (g.kind === "load") {
    const l = g.ovenLoad;
    const where = l ? ` · ${l.ovenName}` : "";
    const temp = l ? ` · ${units.temp(l.temperatureC)}` : "";
    return { title: `Oven load ${g.load}${where} · ${pansText(g.pans)}${temp}`, detail: names.join(", ") };
  }
  const dough = plan.doughs.find((d) => d.formulaId === g.formulaId);
  const of = dough && dough.mixes.length > 1 ? ` of ${dough.mixes.length}` : "";
  return { title: `${dough?.name ?? "Dough"} · mix ${g.mix ?? 1}${of}`, detail: `Makes ${pansText(g.pans)}${names.length ? `: ${names.join(", ")}` : ""}` };
}

/** "Bake 16 min · oven 177 °C", "Shape and pan · mix 2 · 7 pans". */
function stepText(e: TimelineEntry, g: TimelineGroup, plan: PlanView, units: Units): string {
  const parts = [e.label];
  if (e.temperatureC !== null) parts.push(`oven ${units.temp(e.temperatureC)}`);
  if (g.kind === "load" && e.mix !== null) {
    const dough = doughName(plan, e.formulaId);
    parts.push(`${dough ? `${dough}, ` : ""}mix ${e.mix}`);
    if (e.step === "shape") parts.push(pansText(e.pans));
  }
  return parts.join(" · ");
}

function BakedTick({ load, props }: { load: number; props: TimelineProps }) {
  const baked = props.bakedWaves.includes(load);
  return (
    <TickBox
      label={baked ? "Baked" : "Baked?"}
      accessibilityLabel={`Oven load ${load} baked`}
      checked={baked}
      busy={props.busyWave === load}
      onChange={(v) => props.onBaked(load, v)}
      testID={`load-${load}-baked`}
    />
  );
}

/** One block: a mix or an oven load, its steps in time order with their times and resources. */
function GroupBlock({ group: g, ...props }: TimelineProps & { group: TimelineGroup }) {
  const { plan, units } = props;
  const { title, detail } = groupTitle(plan, g, units);
  const baked = g.load !== null && props.bakedWaves.includes(g.load);
  const testID = g.kind === "load" ? `load-${g.load}` : `mix-group-${g.formulaId}-${g.mix ?? 0}`;
  return (
    <View style={[styles.group, props.wide && styles.groupWide, baked && styles.groupBaked]} testID={testID}>
      <View style={styles.groupHead}>
        <View style={styles.flex}>
          <Heading level={3} variant="heading">
            {title}
          </Heading>
          {detail ? (
            <AppText variant="small" color="muted">
              {detail}
            </AppText>
          ) : null}
          <AppText variant="label" color="muted">{`${timeRangeOn(g, plan.date)}`}</AppText>
        </View>
        {g.load !== null ? <BakedTick load={g.load} props={props} /> : null}
      </View>
      <View>
        {g.entries.map((e) => {
          const now = isCurrent(e, props.now);
          const text = stepText(e, g, plan, units);
          const resource = e.resource?.name ?? null;
          return (
            <View
              key={e.id}
              style={[styles.row, now && styles.rowNow]}
              testID={`step-${e.id}`}
              accessibilityLabel={`${timeRangeOn(e, plan.date)}, ${text}${resource ? `, ${resource}` : ""}${e.dayBefore ? ", the day before" : ""}${now ? ", under way now" : ""}`}
            >
              <AppText style={styles.time}>{timeRangeOn(e, plan.date)}</AppText>
              <View style={styles.label}>
                <AppText variant="bodyStrong">{text}</AppText>
                <View style={styles.tags}>
                  {now ? <Badge label="Now" tone="crust" testID="timeline-now" /> : null}
                  {resource ? <Badge label={resource} tone="neutral" testID={`step-${e.id}-resource`} /> : null}
                  {e.dayBefore ? <Badge label="Day before" tone="sage" /> : null}
                  <CautionTag step={e.step} />
                </View>
                {e.note ? (
                  <AppText variant="small" color="muted" testID={`step-${e.id}-note`}>
                    {e.note}
                  </AppText>
                ) : null}
              </View>
            </View>
          );
        })}
      </View>
    </View>
  );
}

const LANE_LABEL_W = 190;

/** From 1024 px: one lane per mixer, the crew and each oven, bars on one time scale, the clock as a line. */
function ResourceLanes(props: TimelineProps) {
  const { plan } = props;
  const lanes = resourceLanes(plan);
  const span = timelineSpan(plan.timeline);
  if (!span || lanes.length === 0) return null;
  const ticks = hourTicks(span, plan.timeline[0].startsAt);
  const pct = (t: number) => `${((t - span.start) / (span.end - span.start)) * 100}%` as const;
  const nowIn = props.now >= span.start && props.now <= span.end;
  return (
    <View testID="timeline-lanes" style={styles.chart}>
      <View style={styles.axis}>
        <View style={{ width: LANE_LABEL_W }} />
        <View style={styles.track}>
          {ticks.map((t) => (
            <AppText key={t.at} variant="caption" color="muted" style={[styles.tickLabel, { left: pct(t.at) }]}>
              {t.label}
            </AppText>
          ))}
        </View>
      </View>
      {lanes.map((lane) => (
        <View key={`${lane.kind}-${lane.id}`} style={styles.lane} testID={`lane-${lane.kind}-${lane.id}`}>
          <View style={[styles.laneLabel, { width: LANE_LABEL_W }]}>
            <AppText variant="bodyStrong" numberOfLines={2}>
              {lane.name}
            </AppText>
            <AppText variant="caption" color="muted">
              {lane.kind === "oven" ? "Oven" : lane.kind === "mixer" ? "Mixer" : "Dividing and shaping"}
            </AppText>
          </View>
          <View style={styles.track}>
            {ticks.map((t) => (
              <View key={t.at} style={[styles.gridLine, { left: pct(t.at) }]} />
            ))}
            {lane.bars.map((b) => {
              const start = Date.parse(b.startsAt);
              const end = Date.parse(b.endsAt);
              const now = props.now >= start && props.now < end;
              return (
                <View
                  key={b.key}
                  accessible
                  role="img"
                  accessibilityLabel={`${lane.name}: ${b.label} from ${localTime(b.startsAt)} to ${localTime(b.endsAt)}`}
                  style={[styles.bar, { left: pct(start), width: `${Math.max(0.4, ((end - start) / (span.end - span.start)) * 100)}%`, backgroundColor: barColor(b.step) }, now && styles.barNow]}
                />
              );
            })}
            {nowIn ? <View style={[styles.nowLine, { left: pct(props.now) }]} /> : null}
          </View>
        </View>
      ))}
      <View style={styles.legend}>
        {KIND_GROUPS.map((g) => (
          <View key={g.label} style={styles.legendItem}>
            <View style={[styles.swatch, { backgroundColor: colors[g.color] }]} />
            <AppText variant="small" color="muted">
              {g.label}
            </AppText>
          </View>
        ))}
        {nowIn ? (
          <View style={styles.legendItem}>
            <View style={styles.swatchNow} />
            <AppText variant="small" color="muted">{`Now, ${clockIn(props.now, plan.timeline[0].startsAt)}`}</AppText>
          </View>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  conflicts: { gap: space.xs, padding: space.md, borderRadius: radii.md, borderWidth: 2, borderColor: colors.danger, backgroundColor: colors.surface },
  conflictHead: { flexDirection: "row", alignItems: "center", gap: space.sm },
  earlier: { fontFamily: fonts.extrabold, fontSize: 20, lineHeight: 26 },
  groups: { gap: space.md },
  groupsWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-start" },
  group: { borderWidth: 1, borderColor: colors.border, borderRadius: radii.md, padding: space.md, gap: space.sm, backgroundColor: colors.surface },
  groupWide: { flexGrow: 1, flexBasis: 420, maxWidth: "100%" },
  groupBaked: { borderColor: colors.sage, borderWidth: 2 },
  groupHead: { flexDirection: "row", alignItems: "flex-start", gap: space.sm },
  row: { flexDirection: "row", gap: space.md, paddingVertical: space.sm, paddingHorizontal: space.xs, borderTopWidth: 1, borderTopColor: colors.border, minHeight: 44 },
  rowNow: { backgroundColor: colors.crustSoft, borderRadius: radii.sm },
  time: { width: 112, fontFamily: fonts.extrabold, fontSize: 17, lineHeight: 24, fontVariant: ["tabular-nums"] },
  label: { flex: 1, gap: space.xxs },
  tags: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  chart: { gap: space.xs },
  axis: { flexDirection: "row", height: 20 },
  track: { flex: 1, position: "relative", minHeight: 20, alignSelf: "stretch" },
  tickLabel: { position: "absolute", top: 0, marginLeft: -20, width: 40, textAlign: "center" }, // "12 AM" in the caption size
  lane: { flexDirection: "row", alignItems: "stretch", minHeight: 44, borderTopWidth: 1, borderTopColor: colors.border },
  laneLabel: { paddingVertical: space.xs, paddingRight: space.sm, justifyContent: "center" },
  gridLine: { position: "absolute", top: 0, bottom: 0, width: 1, backgroundColor: colors.border },
  bar: { position: "absolute", top: 11, height: 22, borderRadius: radii.sm, minWidth: 3 },
  barNow: { top: 8, height: 28, borderWidth: 2, borderColor: colors.ink },
  nowLine: { position: "absolute", top: 0, bottom: 0, width: 2, marginLeft: -1, backgroundColor: colors.ink },
  legend: { flexDirection: "row", flexWrap: "wrap", gap: space.md, paddingTop: space.xs },
  legendItem: { flexDirection: "row", alignItems: "center", gap: space.xs },
  swatch: { width: 18, height: 10, borderRadius: 3 },
  swatchNow: { width: 2, height: 14, backgroundColor: colors.ink },
});
