import React, { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { Badge } from "../../ui/Badge";
import { Stepper } from "../../ui/Stepper";
import { TextField } from "../../ui/TextField";
import { ProgressBar } from "../../ui/ProgressBar";
import { FormError, Notice } from "../../ui/FormError";
import { AppText, Heading } from "../../ui/Text";
import { TextLink } from "../../ui/TextLink";
import { DetailList } from "../../ui/DetailList";
import { ErrorState, LoadingState } from "../../ui/States";
import { messageOf } from "../../api/client";
import { downloadPlanPdf, useProductionSettingsQuery, type PlanView } from "../../api/production";
import { splitError } from "../../forms/errors";
import { cleanDate, formatCutoff, formatDay, relativeDay } from "../../ordering/dates";
import { parseQuantity } from "../../ordering/quantities";
import { localDayTime, progressText, type ProgressCount, settingsLines } from "../../production/plan";
import type { Units } from "../../production/units";
import type { KitchenPaths } from "../../production/paths";
import type { FieldErrors } from "../../../shared/errors";
import { formatCount, unitsFor, type UnitSystem } from "../../../shared/units";
import { DEFAULT_MILK_C, DEFAULT_TAP_C } from "../../../shared/production";

const METRIC = unitsFor("metric");
import { colors, fonts, layout, radii, space } from "../../theme";

// ---- date switcher ------------------------------------------------------------------------------

export interface DateBarProps {
  /** Shown at the end of the row of quick buttons (the units switch). */
  extra?: React.ReactNode;
  date: string;
  today?: string;
  prev: string;
  next: string;
  nextBakeDay?: string;
  upcoming: string[];
  onChange: (date: string) => void;
}

/** Previous / next bake day, back to the next bake day, or any date. */
export function DateBar({ extra, date, today, prev, next, nextBakeDay, upcoming, onChange }: DateBarProps) {
  const [picking, setPicking] = useState(false);
  const [typed, setTyped] = useState("");
  const [error, setError] = useState<string | null>(null);
  const rel = relativeDay(date, today);
  const go = () => {
    const d = cleanDate(typed);
    if (!d) return setError("Write the date as YYYY-MM-DD, e.g. 2026-12-24.");
    setError(null);
    setPicking(false);
    setTyped("");
    onChange(d);
  };
  return (
    <View style={styles.dateBar} testID="day-switcher">
      <View style={styles.dateRow}>
        <RoundButton icon="chevron-left" label={`Previous bake day, ${formatDay(prev)}`} onPress={() => onChange(prev)} testID="day-prev" />
        <View style={styles.dateText}>
          <AppText style={styles.dateBig} align="center" testID="day-date">
            {formatDay(date)}
          </AppText>
          {rel ? (
            <AppText variant="label" color="crust" align="center">
              {rel}
            </AppText>
          ) : null}
        </View>
        <RoundButton icon="chevron-right" label={`Next bake day, ${formatDay(next)}`} onPress={() => onChange(next)} testID="day-next" />
      </View>
      <View style={styles.quick}>
        {nextBakeDay && nextBakeDay !== date ? <Button label="Next bake day" small variant="secondary" icon="sun" onPress={() => onChange(nextBakeDay)} testID="day-next-bake" /> : null}
        <Button label={picking ? "Close" : "Pick a date"} small variant="ghost" icon={picking ? "x" : "calendar"} onPress={() => setPicking((p) => !p)} testID="day-pick" />
        {extra ? <View style={styles.extra}>{extra}</View> : null}
      </View>
      {picking ? (
        <View style={styles.pick} testID="day-pick-panel">
          <View style={styles.chips}>
            {upcoming.map((d) => (
              <Button key={d} label={formatDay(d)} small variant={d === date ? "accent" : "secondary"} onPress={() => { setPicking(false); onChange(d); }} testID={`day-chip-${d}`} />
            ))}
          </View>
          <View style={styles.pickRow}>
            <View style={styles.flex}>
              <TextField label="Any date" value={typed} onChangeText={(t) => { setTyped(t); setError(null); }} placeholder="YYYY-MM-DD" error={error} inputMode="numeric" autoCorrect={false} onSubmitEditing={go} testID="day-pick-input" />
            </View>
            <Button label="Open" onPress={go} testID="day-pick-go" style={styles.pickGo} />
          </View>
        </View>
      ) : null}
    </View>
  );
}

export function RoundButton({ icon, label, onPress, testID }: { icon: "chevron-left" | "chevron-right"; label: string; onPress: () => void; testID: string }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} testID={testID} style={({ pressed }) => [styles.round, pressed && styles.roundPressed]}>
      <Feather name={icon} size={26} color={colors.ink} />
    </Pressable>
  );
}

/** Grams and °C, or pounds/ounces and °F: a two-way switch that stays put on this device. */
export function UnitsSwitch({ system, onChange }: { system: UnitSystem; onChange: (s: UnitSystem) => void }) {
  const options: { value: UnitSystem; label: string; a11y: string }[] = [
    { value: "metric", label: "g · °C", a11y: "Grams and degrees Celsius" },
    { value: "us", label: "lb, oz · °F", a11y: "Pounds, ounces and degrees Fahrenheit" },
  ];
  return (
    <View style={styles.units} testID="units">
      <AppText variant="label" color="muted">
        Units
      </AppText>
      <View style={styles.segments} accessibilityRole="radiogroup" accessibilityLabel="Units">
        {options.map((o, i) => {
          const on = o.value === system;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              accessibilityState={{ checked: on }}
              accessibilityLabel={o.a11y}
              onPress={() => onChange(o.value)}
              testID={`units-${o.value}`}
              style={({ pressed }) => [styles.segment, i > 0 && styles.segmentNext, on && styles.segmentOn, pressed && !on && styles.segmentPressed]}
            >
              <AppText variant="label" color={on ? "onPrimary" : "ink"}>
                {o.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

// ---- status ---------------------------------------------------------------------------------------

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

/** The production sheet and one weigh-out card per mix, as a PDF, in either unit system. */
export function PdfButtons({ date }: { date: string }) {
  const [busy, setBusy] = useState<UnitSystem | null>(null);
  const [error, setError] = useState<string | null>(null);
  const get = async (units: UnitSystem) => {
    setError(null);
    setBusy(units);
    try {
      await downloadPlanPdf(date, units);
    } catch (err) {
      setError(messageOf(err));
    } finally {
      setBusy(null);
    }
  };
  return (
    <Card title="Print" testID="plan-pdf">
      <AppText variant="small" color="muted">
        The production sheet, then one weigh-out card per mix.
      </AppText>
      <View style={styles.pdfButtons}>
        <Button label="Production sheet (PDF)" icon="printer" block busy={busy === "metric"} onPress={() => get("metric")} testID="pdf-metric" accessibilityLabel="Production sheet (PDF), grams and °C" />
        <Button label="Production sheet, US units (PDF)" icon="printer" variant="secondary" block busy={busy === "us"} onPress={() => get("us")} testID="pdf-us" accessibilityLabel="Production sheet (PDF), pounds, ounces and °F" />
      </View>
      <FormError message={error} testID="pdf-error" />
    </Card>
  );
}

// ---- pans ---------------------------------------------------------------------------------------

export interface PansCardProps {
  plan: PlanView;
  extras: Record<string, string>;
  onExtra: (productId: number, text: string) => void;
  wide: boolean;
  saving: boolean;
  error: string | null;
  formulasHref: KitchenPaths["formulas"];
  /** Piece weights in these units (grams when absent). */
  units?: Units;
}

/** Pans per product, big: what goes in the ovens. Extra pans (for the shop, or spares) are the baker's to add. */
export function PansCard({ plan, extras, onExtra, wide, saving, error, formulasHref, units }: PansCardProps) {
  const totalPans = plan.products.reduce((s, p) => s + p.pans, 0);
  return (
    <Card
      title="Pans to bake"
      testID="pans"
      action={
        <AppText variant="bodyStrong" color="muted" testID="pans-total">
          {`${totalPans} ${totalPans === 1 ? "pan" : "pans"} in all`}
        </AppText>
      }
    >
      {plan.frozen ? (
        <AppText variant="small" color="muted">
          Changing extra pans recalculates the plan set at the cut-off.
        </AppText>
      ) : null}
      <View style={[styles.pans, wide && styles.pansWide]}>
        {plan.products.map((p) => {
          const text = extras[String(p.productId)] ?? String(p.extraPans);
          const q = parseQuantity(text);
          const invalid = Number.isNaN(q) || q > 100;
          return (
            <View key={p.productId} style={[styles.pan, wide && styles.panWide]} testID={`pans-${p.productId}`}>
              <View style={styles.panTop}>
                <View style={styles.panCount} accessible accessibilityLabel={`${p.pans} ${p.pans === 1 ? "pan" : "pans"} of ${p.name}`}>
                  <AppText style={styles.panNumber} testID={`pans-${p.productId}-count`}>
                    {String(p.pans)}
                  </AppText>
                  <AppText variant="overline" color="muted">
                    {p.pans === 1 ? "pan" : "pans"}
                  </AppText>
                </View>
                <View style={styles.flex}>
                  <AppText style={styles.panName} testID={`pans-${p.productId}-name`}>
                    {p.name}
                  </AppText>
                  <AppText variant="bodyStrong" color="crust" testID={`pans-${p.productId}-pan`}>
                    {p.panName}
                  </AppText>
                  <AppText variant="small" color="muted" testID={`pans-${p.productId}-units`}>
                    {`${p.units} ordered${p.extraPans ? ` + ${formatCount(p.extraPans, "extra pan", "extra pans")}` : ""} · ${formatCount(p.pieces, "piece", "pieces")} of ${(units ?? METRIC).piece(p.pieceGrams)} dough`}
                  </AppText>
                  <View style={styles.badges}>
                    {p.openUnits > 0 ? <Badge label={`${p.openUnits} still open`} tone="amber" /> : null}
                    {p.formulaId === null ? <Badge label="No formula" tone="danger" /> : null}
                  </View>
                </View>
              </View>
              <View style={styles.extraRow}>
                <AppText variant="label" style={styles.flex}>
                  Extra pans
                </AppText>
                <Stepper value={text} onChange={(t) => onExtra(p.productId, t)} min={0} max={100} label={`extra pans of ${p.name}`} invalid={invalid} testID={`extra-${p.productId}`} />
              </View>
              {invalid ? (
                <AppText variant="small" color="dangerInk" testID={`extra-${p.productId}-error`}>
                  Enter a whole number of pans, 0 to 100.
                </AppText>
              ) : null}
            </View>
          );
        })}
      </View>
      {plan.products.some((p) => p.formulaId === null) ? <TextLink href={formulasHref} label="Give products a formula" /> : null}
      {saving ? (
        <AppText variant="small" color="muted" testID="bake-day-saving">
          Saving…
        </AppText>
      ) : null}
      <FormError message={error} testID="pans-error" />
    </Card>
  );
}

// ---- temperatures -------------------------------------------------------------------------------

type TempKey = "roomC" | "flourC" | "pasteC" | "tapC" | "milkC";
const TEMP_FIELDS: { key: TempKey; label: string; hint: string; min: number; max: number; testID: string }[] = [
  { key: "roomC", label: "Room", hint: "The bakery, by the mixer.", min: -10, max: 50, testID: "temp-room" },
  { key: "flourC", label: "Flour", hint: "Stick the probe in the bin.", min: -10, max: 50, testID: "temp-flour" },
  { key: "pasteC", label: "Paste", hint: "When it goes into the mix.", min: 0, max: 100, testID: "temp-paste" },
  // Supply temperatures: what the liquid is before it is iced, chilled or warmed (shared/production.ts planLiquid).
  { key: "tapC", label: "Tap water", hint: "As it runs cold from the tap: for the ice.", min: 0, max: 60, testID: "temp-tap" },
  { key: "milkC", label: "Milk", hint: "Straight from the cooler.", min: -1, max: 40, testID: "temp-milk" },
];
/** Supply temperatures a plan frozen before them does not carry (shared/production.ts defaults). */
const SUPPLY_DEFAULTS = { tapC: DEFAULT_TAP_C, milkC: DEFAULT_MILK_C };

export interface TemperaturesCardProps {
  plan: PlanView;
  units: Units;
  busy: boolean;
  serverError: unknown;
  onSave: (temps: { roomC: number; flourC: number; pasteC: number; tapC: number; milkC: number }) => void;
  saved: boolean;
}

/**
 * Room, flour and paste temperatures (the liquid temperatures on the cards are worked out from them), and the tap
 * water and milk as they come (the ice and chilling on the cards are worked out from those).
 */
export function TemperaturesCard({ plan, units, busy, serverError, onSave, saved }: TemperaturesCardProps) {
  const stored: Record<TempKey, number> = {
    roomC: plan.inputs.roomC,
    flourC: plan.inputs.flourC,
    pasteC: plan.inputs.pasteC,
    tapC: plan.inputs.tapC ?? SUPPLY_DEFAULTS.tapC,
    milkC: plan.inputs.milkC ?? SUPPLY_DEFAULTS.milkC,
  };
  const shownAt = Object.fromEntries(TEMP_FIELDS.map((f) => [f.key, units.tempInput(stored[f.key])])) as Record<TempKey, string>;
  const [values, setValues] = useState<Record<TempKey, string>>(shownAt);
  const [fields, setFields] = useState<FieldErrors>({});
  const server = splitError(serverError, ["roomC", "flourC", "pasteC", "tapC", "milkC"]);
  const shown = { ...server.fields, ...fields };
  const submit = () => {
    const errs: FieldErrors = {};
    const out = {} as Record<TempKey, number>;
    for (const f of TEMP_FIELDS) {
      // A field left as shown keeps its stored °C (4 °C shows as 39 °F, which would read back as 3.9 °C).
      const c = values[f.key] === shownAt[f.key] ? stored[f.key] : units.toCelsius(values[f.key]);
      if (Number.isNaN(c)) errs[f.key] = "Enter a temperature, e.g. 22.";
      else if (c < f.min || c > f.max) errs[f.key] = `Enter ${units.temp(f.min)} to ${units.temp(f.max)}.`;
      else out[f.key] = c;
    }
    setFields(errs);
    if (Object.keys(errs).length) return;
    onSave(out);
  };
  return (
    <Card title="Temperatures" testID="temperatures">
      <AppText variant="small" color="muted">
        {`Measure before weighing. The liquid temperature on each card comes from these and the dough's target; the ice for the water, or how cold the milk must be, from the tap water and milk.${plan.frozen ? " Saving recalculates the plan set at the cut-off." : ""}`}
      </AppText>
      <View style={styles.temps}>
        {TEMP_FIELDS.map((f) => (
          <View key={f.key} style={styles.tempCell}>
            <TextField
              label={`${f.label} (${units.tempUnit})`}
              hint={f.hint}
              value={values[f.key]}
              onChangeText={(t) => setValues((v) => ({ ...v, [f.key]: t }))}
              error={shown[f.key]}
              inputMode="decimal"
              keyboardType="numbers-and-punctuation"
              onSubmitEditing={submit}
              testID={f.testID}
            />
          </View>
        ))}
      </View>
      <FormError message={server.formError} testID="temps-error" />
      {saved ? <Notice message="Temperatures saved. Liquid temperatures are updated." testID="temps-saved" /> : null}
      <Button label="Save temperatures" icon="thermometer" onPress={submit} busy={busy} testID="temps-save" />
    </Card>
  );
}

// ---- totals, warnings, settings ----------------------------------------------------------------

export function WarningsCard({ warnings }: { warnings: string[] }) {
  if (warnings.length === 0) return null;
  return (
    <View style={styles.warnings} accessibilityRole="alert" testID="plan-warnings">
      <View style={styles.warningsHead}>
        <Feather name="alert-octagon" size={20} color={colors.dangerInk} />
        <Heading level={2} variant="heading" color="dangerInk">
          {warnings.length === 1 ? "1 thing to check" : `${warnings.length} things to check`}
        </Heading>
      </View>
      {warnings.map((w) => (
        <AppText key={w} color="ink">{`•  ${w}`}</AppText>
      ))}
    </View>
  );
}

/** Everything the day's doughs use, bakery-wide, largest first. */
export function TotalsCard({ plan, units }: { plan: PlanView; units: Units }) {
  const dough = plan.doughs.reduce((s, d) => s + d.doughGrams, 0);
  return (
    <Card title="Ingredients for the day" testID="totals">
      <AppText variant="small" color="muted">{`All doughs together: ${units.mass(dough)} of dough.`}</AppText>
      <View>
        {plan.ingredients.map((i, n) => (
          <View key={i.ingredientId} style={[styles.totalRow, n > 0 && styles.divider]} testID={`total-${i.ingredientId}`}>
            <AppText variant="bodyStrong" style={styles.flex}>
              {i.name}
            </AppText>
            <AppText style={styles.totalAmount}>{units.mass(i.grams)}</AppText>
          </View>
        ))}
      </View>
    </Card>
  );
}

/** The owner's production settings, read-only here (the owner edits them in the office). */
export function SettingsFooter({ units, paths, isOwner }: { units: Units; paths: KitchenPaths; isOwner: boolean }) {
  const settings = useProductionSettingsQuery();
  return (
    <Card title="Production settings" testID="production-settings-summary">
      {settings.isPending ? (
        <LoadingState label="Loading the settings…" testID="settings-loading" />
      ) : settings.isError ? (
        <ErrorState error={settings.error} title="The settings didn't load" onRetry={() => settings.refetch()} retrying={settings.isFetching} testID="settings-error" />
      ) : (
        <DetailList
          items={[
            { label: settings.data.mixers.length === 1 ? "Mixer" : "Mixers", value: settingsLines(settings.data, units).mixers, testID: "setting-mixer" },
            { label: "Dispatch", value: settings.data.dispatchTime, testID: "setting-dispatch" },
            { label: settings.data.ovens.length === 1 ? "Oven" : "Ovens", value: settingsLines(settings.data, units).ovens, testID: "setting-ovens" },
            { label: "Crew", value: settingsLines(settings.data, units).crew, testID: "setting-crew" },
          ]}
        />
      )}
      {isOwner && paths.settings ? (
        <TextLink href={paths.settings} label="Change production settings" testID="open-production-settings" />
      ) : (
        <AppText variant="small" color="muted">
          The owner sets these in the office.
        </AppText>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  dateBar: { gap: space.sm },
  units: { flexDirection: "row", alignItems: "center", gap: space.sm },
  segments: { flexDirection: "row", borderWidth: 1.5, borderColor: colors.inputBorder, borderRadius: radii.pill, overflow: "hidden", backgroundColor: colors.surface },
  segment: { minHeight: layout.minTouch, minWidth: 88, paddingHorizontal: space.md, alignItems: "center", justifyContent: "center" },
  segmentNext: { borderLeftWidth: 1.5, borderLeftColor: colors.inputBorder },
  segmentOn: { backgroundColor: colors.primary },
  segmentPressed: { backgroundColor: colors.sunken },
  dateRow: { flexDirection: "row", alignItems: "center", gap: space.sm },
  dateText: { flex: 1, alignItems: "center" },
  dateBig: { fontFamily: fonts.extrabold, fontSize: 26, lineHeight: 32 },
  round: {
    width: 52,
    height: 52,
    borderRadius: radii.pill,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  roundPressed: { backgroundColor: colors.sunken },
  quick: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  extra: { marginLeft: "auto" },
  pick: { gap: space.md, padding: space.md, backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border },
  chips: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  pickRow: { flexDirection: "row", alignItems: "flex-end", gap: space.sm },
  pickGo: { marginBottom: 2 },
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
  pdfButtons: { gap: space.sm },
  pans: { gap: space.md },
  pansWide: { flexDirection: "row", flexWrap: "wrap" },
  pan: { backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.md },
  panWide: { flexGrow: 1, flexBasis: 300, maxWidth: "100%" },
  panTop: { flexDirection: "row", gap: space.md, alignItems: "flex-start" },
  panCount: { minWidth: 84, alignItems: "center", backgroundColor: colors.surface, borderRadius: radii.md, paddingVertical: space.xs, paddingHorizontal: space.sm, borderWidth: 1, borderColor: colors.border },
  panNumber: { fontFamily: fonts.extrabold, fontSize: 60, lineHeight: 66, color: colors.ink, fontVariant: ["tabular-nums"] },
  panName: { fontFamily: fonts.extrabold, fontSize: 21, lineHeight: 27, color: colors.ink },
  badges: { flexDirection: "row", flexWrap: "wrap", gap: space.xs, marginTop: space.xxs },
  extraRow: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: layout.minTouch },
  temps: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  tempCell: { flexGrow: 1, flexBasis: 150 },
  warnings: { gap: space.sm, backgroundColor: colors.dangerSoft, borderRadius: radii.lg, padding: space.lg },
  warningsHead: { flexDirection: "row", alignItems: "center", gap: space.sm },
  totalRow: { flexDirection: "row", alignItems: "center", gap: space.md, minHeight: 44, paddingVertical: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  totalAmount: { fontFamily: fonts.extrabold, fontSize: 20, lineHeight: 26, color: colors.ink, textAlign: "right", fontVariant: ["tabular-nums"] },
});
