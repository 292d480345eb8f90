import React, { useState } from "react";
import { Platform, StyleSheet, View } from "react-native";
import { Button } from "../../ui/Button";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { LinkButton } from "../../ui/LinkButton";
import { TextLink } from "../../ui/TextLink";
import { FormError } from "../../ui/FormError";
import { Heading } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useBakeryQuery } from "../../api/bakery";
import { useCalendarSettingsQuery } from "../../api/calendar";
import {
  mixKey,
  useNextBakeDayQuery,
  usePlanQuery,
  useProgressMutation,
  useRecalculatePlanMutation,
  type PlanView,
} from "../../api/production";
import { messageOf } from "../../api/client";
import { cleanDate, formatDay } from "../../ordering/dates";
import { useServerNow } from "../../ordering/useServerNow";
import { progressCount, stepBakeDay, upcomingBakeDays } from "../../production/plan";
import { kitchenPaths, type KitchenArea, type KitchenPaths } from "../../production/paths";
import { useUnits, type Units } from "../../production/units";
import { useIsWide, useTwoColumns } from "../../shell/useIsWide";
import { BackToProduction } from "./BackToProduction";
import { CautionsCard } from "./Cautions";
import { InternalTempsCard } from "./InternalTemps";
import { liquidWarnings } from "../../../shared/cautions";
import { MixCard } from "./MixCard";
import { ComponentCards } from "./ComponentCards";
import { Timeline } from "./Timeline";
import { DateBar } from "./bakeday/DateBar";
import { PansCard } from "./bakeday/PansCard";
import { PdfButtons } from "./bakeday/PdfButtons";
import { SettingsFooter } from "./bakeday/SettingsFooter";
import { StatusCard } from "./bakeday/StatusCard";
import { TemperaturesCard } from "./bakeday/TemperaturesCard";
import { TotalsCard } from "./bakeday/TotalsCard";
import { UnitsSwitch } from "./bakeday/UnitsSwitch";
import { WarningsCard } from "./bakeday/WarningsCard";
import { useDayInputs } from "./bakeday/useDayInputs";
import { WEEKDAY_LONG, weekdayOf } from "../../../shared/calendar";
import { space } from "../../theme";

export interface BakeDayScreenProps {
  area: KitchenArea;
  /** YYYY-MM-DD from the address (?date=); the next bake day when absent. */
  date?: string;
  /** The baker's home (/bake): its title carries the home's testID. */
  home?: boolean;
}

/**
 * The bake day: what to bake (pans), what to weigh (one card per mix, paste and final mix apart),
 * when (the timeline back from dispatch), with the day's progress ticked off as it goes.
 */
export function BakeDayScreen({ area, date: asked, home }: BakeDayScreenProps) {
  const router = useRouter();
  const paths = kitchenPaths(area);
  const bakery = useBakeryQuery();
  const calendar = useCalendarSettingsQuery();
  const askedDate = asked ? cleanDate(asked) : null;
  const nextDay = useNextBakeDayQuery();
  const date = askedDate ?? nextDay.data ?? null;
  const plan = usePlanQuery(date);
  const units = useUnits();
  const today = bakery.data?.today;

  const go = (d: string) => router.setParams({ date: d });
  const settings = calendar.data ?? null;

  let body: React.ReactNode;
  if (!date) {
    body = nextDay.isError ? (
      <ErrorState error={nextDay.error} title="The next bake day didn't load" onRetry={() => nextDay.refetch()} retrying={nextDay.isFetching} testID="bake-day-error" />
    ) : (
      <LoadingState label="Finding the next bake day…" testID="bake-day-loading" />
    );
  } else {
    body = (
      <QueryStates query={plan} loadingLabel="Working out the plan…" errorTitle="The plan didn't load" testID="bake-day">
        {(data) => <PlanBody key={date} date={date} plan={data} units={units} paths={paths} />}
      </QueryStates>
    );
  }

  return (
    <Screen testID="bake-day">
      <BackToProduction paths={paths} />
      <PageHeader
        overline={bakery.data?.name ?? "Production"}
        title="Bake day"
        testID={home ? "baker-home-title" : "bake-day-title"}
      />
      {date ? (
        <View style={styles.controls}>
          <DateBar
            date={date}
            today={today}
            prev={stepBakeDay(date, -1, settings)}
            next={stepBakeDay(date, 1, settings)}
            nextBakeDay={nextDay.data}
            upcoming={upcomingBakeDays(nextDay.data ?? today ?? date, 7, settings)}
            onChange={go}
            extra={<UnitsSwitch system={units.system} onChange={units.setSystem} />}
          />
        </View>
      ) : null}
      {body}
    </Screen>
  );
}

interface PlanBodyProps {
  date: string;
  plan: PlanView;
  units: Units;
  paths: KitchenPaths;
}

function PlanBody({ date, plan, units, paths }: PlanBodyProps) {
  const wide = useIsWide();
  const columns = useTwoColumns();
  const calendar = useCalendarSettingsQuery().data;
  const user = useSignedInUser();
  const bakery = useBakeryQuery();
  const now = useServerNow(30_000);
  const recalc = useRecalculatePlanMutation(date);
  const progressMutation = useProgressMutation(date);
  const [lastChanges, setLastChanges] = useState<{ what: string; changes: string[] } | null>(null);
  const inputs = useDayInputs(date, plan, setLastChanges);
  const [progressError, setProgressError] = useState<string | null>(null);

  const onRecalculate = () => {
    setLastChanges(null);
    recalc.mutate(undefined, {
      onSuccess: (p) => {
        setLastChanges({ what: "Plan recalculated.", changes: p.changes });
        inputs.resetExtras(p);
      },
    });
  };

  const busyKey = progressMutation.isPending ? progressMutation.variables : undefined;
  const tick = (kind: "mix" | "wave", key: string, done: boolean) => {
    setProgressError(null);
    progressMutation.mutate({ kind, key, done }, { onError: (err) => setProgressError(messageOf(err)) });
  };

  const progress = progressCount(plan);

  if (plan.products.length === 0) {
    const closure = calendar?.closures.find((c) => c.date === date);
    const why = closure
      ? `The bakery is closed on ${formatDay(date)}${closure.note ? ` (${closure.note})` : ""}.`
      : calendar && !calendar.deliveryWeekdays.includes(weekdayOf(date))
        ? `${WEEKDAY_LONG[weekdayOf(date)]} is not a delivery day.`
        : "No orders for this day yet. Pans, weigh-out cards and the timeline show here as orders come in.";
    return (
      <>
        <StatusCard plan={plan} timeZone={bakery.data?.timeZone} now={now} progress={progress} recalculating={recalc.isPending} recalcError={recalc.error} onRecalculate={onRecalculate} lastChanges={lastChanges} bannerOnly />
        <EmptyState
          icon="sun"
          title={`Nothing to bake for ${formatDay(date)}`}
          message={why}
          action={<LinkButton href={paths.orders(date)} label="Orders for this day" icon="clipboard" variant="secondary" />}
          testID="bake-day-empty"
        />
        <SettingsFooter units={units} paths={paths} isOwner={user.role === "owner"} />
      </>
    );
  }

  const status = <StatusCard plan={plan} timeZone={bakery.data?.timeZone} now={now} progress={progress} recalculating={recalc.isPending} recalcError={recalc.error} onRecalculate={onRecalculate} lastChanges={lastChanges} />;
  const temps = (
    <TemperaturesCard
      key={`${units.system}-${plan.inputs.roomC}-${plan.inputs.flourC}-${plan.inputs.pasteC}-${plan.inputs.tapC}-${plan.inputs.milkC}`}
      plan={plan}
      units={units}
      busy={inputs.savingTemps}
      onSave={inputs.onTemps}
      saved={inputs.tempsSaved}
    />
  );
  const mixes = plan.doughs.flatMap((d) =>
    d.mixes.map((m) => {
      const key = mixKey(d.formulaId, m.index);
      return (
        <View key={key} style={columns ? styles.mixWide : undefined}>
          <MixCard
            dough={d}
            mix={m}
            units={units}
            done={plan.progress.mixes.includes(key)}
            busy={busyKey?.kind === "mix" && busyKey.key === key}
            onDone={(done) => tick("mix", key, done)}
          />
        </View>
      );
    }),
  );

  return (
    <>
      {wide ? (
        <View style={[styles.row, styles.rowWide]}>
          <View style={styles.col2}>{status}</View>
          <View style={styles.col1}>
            <PdfButtons date={date} />
          </View>
        </View>
      ) : (
        status
      )}
      {wide ? null : <JumpLinks />}
      <WarningsCard warnings={[...plan.warnings, ...liquidWarnings(plan, units)]} />
      <View nativeID="bake-pans" />
      <PansCard plan={plan} extras={inputs.extras} onExtra={inputs.onExtra} wide={wide} saving={inputs.savingPans} error={inputs.pansError} formulasHref={paths.formulas} units={units} />
      {temps}
      {wide ? null : <PdfButtons date={date} />}

      <View style={styles.section} nativeID="bake-mixes">
        <Heading level={2} testID="mixes-title">
          Weigh-out cards
        </Heading>
        <FormError message={progressError} testID="progress-error" />
        {mixes.length ? (
          <View style={[styles.mixes, columns && styles.mixesWide]} testID="mixes">
            {mixes}
          </View>
        ) : (
          <EmptyState icon="box" title="No doughs to mix" message="The ordered products have no formula yet." testID="mixes-empty" />
        )}
      </View>
      <ComponentCards cards={plan.components} units={units} wide={wide} />

      <View nativeID="bake-timeline" />
      <Timeline
        plan={plan}
        units={units}
        now={now}
        wide={wide}
        bakedWaves={plan.progress.waves}
        busyWave={busyKey?.kind === "wave" ? Number(busyKey.key) : null}
        onBaked={(wave, baked) => tick("wave", String(wave), baked)}
      />

      <InternalTempsCard plan={plan} units={units} />

      <View style={[styles.row, columns && styles.rowWide]} nativeID="bake-totals">
        <View style={columns ? styles.col1 : undefined}>
          <TotalsCard plan={plan} units={units} />
        </View>
        <View style={columns ? styles.col1 : undefined}>
          <CautionsCard plan={plan} units={units} />
        </View>
      </View>
      <SettingsFooter units={units} paths={paths} isOwner={user.role === "owner"} />
      <View style={styles.links}>
        <TextLink href={paths.orders(date)} label="Orders for this day" testID="open-day-orders" />
        <TextLink href={paths.forecast()} label="Purchasing" testID="open-forecast" />
        <TextLink href={paths.formulas} label="Formulas" testID="open-formulas" />
      </View>
    </>
  );
}

/** The bake day's sections, for a phone where the page is long: a tap scrolls to one (the web: scrollIntoView). */
const SECTIONS = [
  { id: "bake-pans", label: "Pans" },
  { id: "bake-mixes", label: "Weigh-out" },
  { id: "bake-timeline", label: "Timeline" },
  { id: "bake-totals", label: "Ingredients" },
] as const;

function JumpLinks() {
  if (Platform.OS !== "web") return null;
  return (
    <View style={styles.jump} accessibilityRole="toolbar" aria-label="Jump to a section" testID="bake-jump">
      {SECTIONS.map((s) => (
        <Button
          key={s.id}
          label={s.label}
          small
          variant="secondary"
          onPress={() => document.getElementById(s.id)?.scrollIntoView({ behavior: "smooth", block: "start" })}
          testID={`jump-${s.id}`}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  controls: { maxWidth: 720 },
  row: { gap: space.lg },
  rowWide: { flexDirection: "row", alignItems: "flex-start" },
  col1: { flex: 1, minWidth: 0 },
  col2: { flex: 2, minWidth: 0 },
  section: { gap: space.md },
  mixes: { gap: space.lg },
  mixesWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-start" },
  mixWide: { flexGrow: 1, flexBasis: 340, maxWidth: "100%" },
  jump: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  links: { flexDirection: "row", flexWrap: "wrap", gap: space.lg },
});
