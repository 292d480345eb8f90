import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { AppText, Heading } from "../../ui/Text";
import { Badge } from "../../ui/Badge";
import { TickBox } from "../../ui/TickBox";
import { EmptyState } from "../../ui/States";
import { CautionTag } from "./Cautions";
import type { PlanView } from "../../api/production";
import type { Units } from "../../production/units";
import { clockIn, groupByWave, hourTicks, isCurrent, localTime, timeRange, timelineSpan, type TimelineEntry, type WaveGroup } from "../../production/plan";
import { colors, fonts, radii, space, type ColorName } from "../../theme";

export interface TimelineProps {
  plan: PlanView;
  units: Units;
  /** The clock (server-corrected), to mark the step under way. */
  now: number;
  wide: boolean;
  bakedWaves: number[];
  busyWave: number | null;
  onBaked: (wave: number, baked: boolean) => void;
}

/** What kind of work a step is, for the bar's colour (and the legend). */
const KIND_GROUPS: { label: string; color: ColorName; steps: string[] }[] = [
  { label: "Paste and mixing", color: "crust", steps: ["paste", "mix", "knead"] },
  { label: "Resting and proofing", color: "sage", steps: ["rest", "bulk", "bench", "proof"] },
  { label: "Dividing, shaping, washing", color: "focus", steps: ["divide", "shape", "wash"] },
  { label: "Baking", color: "danger", steps: ["bake"] },
  { label: "Cooling", color: "inputBorder", steps: ["cool"] },
];
const barColor = (step: string) => colors[KIND_GROUPS.find((g) => g.steps.includes(step))?.color ?? "inputBorder"];

/** The day's timeline: oven waves, each with its steps back to back from the paste to cooling. */
export function Timeline(props: TimelineProps) {
  const { plan, units, wide } = props;
  const waves = groupByWave(plan.timeline);
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
      {waves.length === 0 ? (
        <EmptyState icon="clock" title="No timeline yet" message="Steps show here once a product with a formula is ordered for this day." testID="timeline-empty" />
      ) : wide ? (
        <TimelineChart {...props} waves={waves} />
      ) : (
        <View style={styles.waves}>
          {waves.map((w) => (
            <WaveList key={w.wave} {...props} group={w} />
          ))}
        </View>
      )}
      <AppText variant="small" color="muted">
        {`Oven room: ${plan.inputs.ovenCapacityPans} pans per wave. Times are the bakery's local time; temperatures in ${units.tempUnit}.`}
      </AppText>
    </Card>
  );
}

function waveTitle(plan: PlanView, w: WaveGroup): { title: string; products: string } {
  const dough = plan.doughs.find((d) => d.formulaId === w.formulaId)?.name ?? "Dough";
  const names = w.productIds.map((id) => plan.products.find((p) => p.productId === id)?.name).filter(Boolean) as string[];
  return { title: `Wave ${w.wave} · ${dough} · ${w.pans === 1 ? "1 pan" : `${w.pans} pans`}`, products: names.join(", ") };
}

function stepText(e: TimelineEntry, units: Units): string {
  return e.temperatureC !== null ? `${e.label} · oven ${units.temp(e.temperatureC)}` : e.label;
}

function BakedTick({ w, props }: { w: WaveGroup; props: TimelineProps }) {
  const baked = props.bakedWaves.includes(w.wave);
  return (
    <TickBox
      label={baked ? "Baked" : "Baked?"}
      accessibilityLabel={`Wave ${w.wave} baked`}
      checked={baked}
      busy={props.busyWave === w.wave}
      onChange={(v) => props.onBaked(w.wave, v)}
      testID={`wave-${w.wave}-baked`}
    />
  );
}

/** On a phone: one block per wave, its steps as a list with start–end times; the step under way stands out. */
function WaveList({ group: w, ...props }: TimelineProps & { group: WaveGroup }) {
  const { title, products } = waveTitle(props.plan, w);
  const baked = props.bakedWaves.includes(w.wave);
  return (
    <View style={[styles.wave, baked && styles.waveBaked]} testID={`wave-${w.wave}`}>
      <View style={styles.waveHead}>
        <Heading level={3} variant="heading">
          {title}
        </Heading>
        {products ? (
          <AppText variant="small" color="muted">
            {products}
          </AppText>
        ) : null}
        <AppText variant="label" color="muted">{`${localTime(w.startsAt)} to ${localTime(w.endsAt)}`}</AppText>
      </View>
      <View>
        {w.entries.map((e) => {
          const now = isCurrent(e, props.now);
          return (
            <View key={`${e.step}-${e.startsAt}`} style={[styles.listRow, now && styles.rowNow]} testID={`step-${w.wave}-${e.step}`} accessibilityLabel={`${timeRange(e)}, ${stepText(e, props.units)}${now ? ", under way now" : ""}`}>
              <AppText style={styles.listTime}>{timeRange(e)}</AppText>
              <View style={styles.listLabel}>
                <AppText variant="bodyStrong">{stepText(e, props.units)}</AppText>
                <View style={styles.tags}>
                  {now ? <Badge label="Now" tone="crust" testID="timeline-now" /> : null}
                  <CautionTag step={e.step} />
                </View>
              </View>
            </View>
          );
        })}
      </View>
      <BakedTick w={w} props={props} />
    </View>
  );
}

const LABEL_W = 340;

/** From 1024 px: a bar chart on one time scale, a row per step, grouped by wave, with hour lines and the clock. */
function TimelineChart({ waves, ...props }: TimelineProps & { waves: WaveGroup[] }) {
  const span = timelineSpan(props.plan.timeline);
  if (!span) return null;
  const ticks = hourTicks(span, props.plan.timeline[0].startsAt);
  const pct = (t: number) => `${((t - span.start) / (span.end - span.start)) * 100}%` as const;
  const nowIn = props.now >= span.start && props.now <= span.end;
  return (
    <View testID="timeline-chart" style={styles.chart}>
      <View style={styles.axis}>
        <View style={{ width: LABEL_W }} />
        <View style={styles.track}>
          {ticks.map((t) => (
            <AppText key={t.at} variant="caption" color="muted" style={[styles.tickLabel, { left: pct(t.at) }]}>
              {t.label}
            </AppText>
          ))}
        </View>
      </View>
      {waves.map((w) => {
        const { title, products } = waveTitle(props.plan, w);
        const baked = props.bakedWaves.includes(w.wave);
        return (
          <View key={w.wave} style={[styles.chartWave, baked && styles.waveBaked]} testID={`wave-${w.wave}`}>
            <View style={styles.chartWaveHead}>
              <View style={styles.flex}>
                <Heading level={3} variant="heading">
                  {title}
                </Heading>
                <AppText variant="small" color="muted">{`${products ? `${products} · ` : ""}${localTime(w.startsAt)} to ${localTime(w.endsAt)}`}</AppText>
              </View>
              <BakedTick w={w} props={props} />
            </View>
            {w.entries.map((e) => {
              const now = isCurrent(e, props.now);
              const start = Date.parse(e.startsAt);
              const end = Date.parse(e.endsAt);
              return (
                <View key={`${e.step}-${e.startsAt}`} style={[styles.chartRow, now && styles.rowNow]} testID={`step-${w.wave}-${e.step}`}>
                  <View style={[styles.chartLabel, { width: LABEL_W }]}>
                    <AppText style={styles.chartTime} numberOfLines={1}>
                      {timeRange(e)}
                    </AppText>
                    <View style={styles.chartStep}>
                      <AppText variant="bodyStrong">{stepText(e, props.units)}</AppText>
                      {now ? <Badge label="Now" tone="crust" testID="timeline-now" /> : <CautionTag step={e.step} />}
                    </View>
                  </View>
                  <View style={styles.track} accessible accessibilityLabel={`Wave ${w.wave}: ${e.label} from ${localTime(e.startsAt)} to ${localTime(e.endsAt)}`}>
                    {ticks.map((t) => (
                      <View key={t.at} style={[styles.gridLine, { left: pct(t.at) }]} />
                    ))}
                    <View
                      style={[
                        styles.bar,
                        { left: pct(start), width: `${Math.max(0.6, ((end - start) / (span.end - span.start)) * 100)}%`, backgroundColor: barColor(e.step) },
                        now && styles.barNow,
                      ]}
                    />
                    {nowIn ? <View style={[styles.nowLine, { left: pct(props.now) }]} /> : null}
                  </View>
                </View>
              );
            })}
          </View>
        );
      })}
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
            <AppText variant="small" color="muted">{`Now, ${clockIn(props.now, props.plan.timeline[0].startsAt)}`}</AppText>
          </View>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  waves: { gap: space.md },
  wave: { borderWidth: 1, borderColor: colors.border, borderRadius: radii.md, padding: space.md, gap: space.sm, backgroundColor: colors.surface },
  waveBaked: { borderColor: colors.sage, borderWidth: 2 },
  waveHead: { gap: space.xxs },
  listRow: { flexDirection: "row", gap: space.md, paddingVertical: space.sm, paddingHorizontal: space.xs, borderTopWidth: 1, borderTopColor: colors.border, minHeight: 44 },
  rowNow: { backgroundColor: colors.crustSoft, borderRadius: radii.sm },
  listTime: { width: 104, fontFamily: fonts.extrabold, fontSize: 17, lineHeight: 24, fontVariant: ["tabular-nums"] },
  listLabel: { flex: 1, gap: space.xxs },
  tags: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  chart: { gap: space.sm },
  axis: { flexDirection: "row", height: 20, paddingHorizontal: space.sm + 1 },
  track: { flex: 1, position: "relative", minHeight: 20, alignSelf: "stretch" },
  tickLabel: { position: "absolute", top: 0, marginLeft: -18, width: 36, textAlign: "center" },
  chartWave: { borderWidth: 1, borderColor: colors.border, borderRadius: radii.md, paddingVertical: space.sm, paddingHorizontal: space.sm },
  chartWaveHead: { flexDirection: "row", alignItems: "center", gap: space.md, paddingHorizontal: space.xs, paddingBottom: space.xs },
  chartRow: { flexDirection: "row", alignItems: "stretch", minHeight: 36 },
  chartLabel: { flexDirection: "row", alignItems: "flex-start", gap: space.sm, paddingHorizontal: space.xs, paddingVertical: space.xs },
  chartTime: { width: 108, fontFamily: fonts.bold, fontSize: 16, lineHeight: 24, fontVariant: ["tabular-nums"] },
  chartStep: { flex: 1, gap: 2, alignItems: "flex-start" },
  gridLine: { position: "absolute", top: 0, bottom: 0, width: 1, backgroundColor: colors.border },
  bar: { position: "absolute", top: 8, height: 22, borderRadius: radii.sm, minWidth: 4 },
  barNow: { top: 5, height: 28, borderWidth: 2, borderColor: colors.ink },
  nowLine: { position: "absolute", top: 0, bottom: 0, width: 2, marginLeft: -1, backgroundColor: colors.ink },
  legend: { flexDirection: "row", flexWrap: "wrap", gap: space.md, paddingTop: space.xs },
  legendItem: { flexDirection: "row", alignItems: "center", gap: space.xs },
  swatch: { width: 18, height: 10, borderRadius: 3 },
  swatchNow: { width: 2, height: 14, backgroundColor: colors.ink },
});
