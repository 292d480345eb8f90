import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { MultiChoice } from "../../ui/MultiChoice";
import { Button } from "../../ui/Button";
import { DetailList } from "../../ui/DetailList";
import { FormError, Notice } from "../../ui/FormError";
import { ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { TextLink } from "../../ui/TextLink";
import { useCalendarSettingsQuery, useSaveCalendarSettingsMutation } from "../../api/calendar";
import { useBakeryQuery } from "../../api/bakery";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { DEFAULT_LOCALE, LOCALE_NAMES, SUPPORTED_LOCALES, formatCalendarDate, formatTimeOfDay, isSupportedLocale, type SupportedLocale } from "../../../shared/format";
import { formatMoney } from "../../../shared/money";
import { splitError, validate } from "../../forms/errors";
import { addDays, cleanDate, formatDay } from "../../ordering/dates";
import { cutoffRule } from "../buyer/DeliveryTermsCard";
import { WEEKDAYS, WEEKDAY_LONG, WEEKDAY_SHORT, cutoffFor, formatLocal, weekdayOf, type Weekday } from "../../../shared/calendar";
import { calendarSettingsSchema, type CalendarSettingsDto } from "../../../shared/schemas/calendar";
import type { FieldErrors } from "../../../shared/errors";
import { colors, layout, radii, space } from "../../theme";

/** How a locale writes a day, a time and an amount: "Tue, Jun 9 · 2:00 PM · $1,234.50" (en-US). */
export function localeSample(locale: string, currency = "USD"): string {
  return `${formatCalendarDate("2026-06-09", "dayShort", locale)} · ${formatTimeOfDay("14:00", locale)} · ${formatMoney(123450, currency, locale)}`;
}

/** "A Tuesday delivery closes Mon 1 Dec, 14:00 CST": the rule worked through for the next delivery day. */
export function cutoffExample(today: string, s: Pick<CalendarSettingsDto, "timeZone" | "deliveryWeekdays" | "cutoffTime" | "leadDays">): string | null {
  if (!/^([01]\d|2[0-3]):[0-5]\d$/.test(s.cutoffTime) || s.deliveryWeekdays.length === 0) return null;
  for (let i = 1; i <= 7 + s.leadDays; i++) {
    const d = addDays(today, i + s.leadDays);
    if (s.deliveryWeekdays.includes(weekdayOf(d))) {
      return `For example, the ${formatDay(d)} delivery closes ${formatLocal(cutoffFor(d, s), s.timeZone)}.`;
    }
  }
  return null;
}

/** The owner's delivery days: delivery weekdays, cut-off, how far ahead, and closure dates. */
export function CalendarSettingsScreen() {
  const settings = useCalendarSettingsQuery();
  return (
    <Screen narrow testID="calendar-settings">
      <PageHeader title="Delivery days" subtitle="When the bakery delivers and when ordering closes. Changes apply to every account at once." testID="calendar-settings-title" />
      {settings.isPending ? (
        <LoadingState label="Loading the delivery days…" />
      ) : settings.isError ? (
        <ErrorState error={settings.error} onRetry={() => settings.refetch()} retrying={settings.isFetching} testID="calendar-settings-error" />
      ) : (
        <SettingsForm initial={settings.data} />
      )}
    </Screen>
  );
}

function SettingsForm({ initial }: { initial: CalendarSettingsDto }) {
  const save = useSaveCalendarSettingsMutation();
  const bakery = useBakeryQuery();
  const [weekdays, setWeekdays] = useState<Weekday[]>(initial.deliveryWeekdays);
  const [locale, setLocale] = useState<SupportedLocale>(isSupportedLocale(initial.locale) ? initial.locale : DEFAULT_LOCALE);
  const [cutoffTime, setCutoffTime] = useState(initial.cutoffTime);
  const [leadDays, setLeadDays] = useState(String(initial.leadDays));
  const [horizonDays, setHorizonDays] = useState(String(initial.horizonDays));
  const [closures, setClosures] = useState(initial.closures);
  const [newDate, setNewDate] = useState("");
  const [newNote, setNewNote] = useState("");
  const [closureError, setClosureError] = useState<string | null>(null);
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const today = bakery.data?.today;

  const addClosure = () => {
    const d = cleanDate(newDate);
    if (!d) return setClosureError("Write the date as YYYY-MM-DD, e.g. 2025-12-25.");
    if (closures.some((c) => c.date === d)) return setClosureError("That date is already on the list.");
    setClosureError(null);
    setClosures((c) => [...c, { date: d, note: newNote.trim() }].sort((a, b) => a.date.localeCompare(b.date)));
    setNewDate("");
    setNewNote("");
    setSaved(false);
  };

  const submit = () => {
    setSaved(false);
    setFormError(null);
    const body = { timeZone: initial.timeZone, locale, deliveryWeekdays: weekdays, cutoffTime: cutoffTime.trim(), leadDays, horizonDays, closures };
    const checked = validate(calendarSettingsSchema, body);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    save.mutate(checked.data, {
      onSuccess: () => setSaved(true),
      onError: (err) => {
        const split = splitError(err, ["locale", "deliveryWeekdays", "cutoffTime", "leadDays", "horizonDays", "closures"]);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  const lead = Number(leadDays);
  const example = today && Number.isInteger(lead) ? cutoffExample(today, { timeZone: initial.timeZone, deliveryWeekdays: weekdays, cutoffTime, leadDays: lead }) : null;
  const upcoming = today ? closures.filter((c) => c.date >= today) : closures;
  const past = closures.length - upcoming.length;

  return (
    <>
      <Card title="Ordering rules" testID="calendar-rules">
        <DetailList items={[{ label: "Time zone", value: initial.timeZone.replace(/_/g, " "), testID: "calendar-timezone" }]} />
        <ChoiceGroup<SupportedLocale>
          label="Dates, times and amounts"
          choices={SUPPORTED_LOCALES.map((l) => ({ value: l, label: LOCALE_NAMES[l], hint: localeSample(l, bakery.data?.currency) }))}
          value={locale}
          onChange={(v) => {
            setLocale(v);
            setSaved(false);
          }}
          error={fields.locale}
          layout="list"
          testID="calendar-locale"
        />
        <MultiChoice<Weekday>
          label="Delivery days"
          hint="Each account can be narrowed to some of these on its own page."
          options={WEEKDAYS.map((d) => ({ value: d, label: WEEKDAY_SHORT[d] }))}
          value={weekdays}
          onChange={(v) => {
            setWeekdays(v);
            setSaved(false);
          }}
          error={fields.deliveryWeekdays}
          testID="calendar-weekdays"
        />
        <View style={styles.grid}>
          <View style={styles.cell}>
            <TextField label="Cut-off time" value={cutoffTime} onChangeText={(t) => { setCutoffTime(t); setSaved(false); }} error={fields.cutoffTime} hint="24-hour clock, e.g. 14:00." placeholder="14:00" testID="calendar-cutoff" autoCorrect={false} />
          </View>
          <View style={styles.cell}>
            <TextField label="Days before delivery" value={leadDays} onChangeText={(t) => { setLeadDays(t); setSaved(false); }} error={fields.leadDays} hint="1 = the day before." inputMode="numeric" keyboardType="number-pad" testID="calendar-lead" />
          </View>
          <View style={styles.cell}>
            <TextField label="Order ahead (days)" value={horizonDays} onChangeText={(t) => { setHorizonDays(t); setSaved(false); }} error={fields.horizonDays} hint="How far ahead buyers may order." inputMode="numeric" keyboardType="number-pad" testID="calendar-horizon" />
          </View>
        </View>
        <View style={styles.rule} testID="calendar-rule">
          <AppText variant="bodyStrong">
            {Number.isInteger(lead) && lead >= 0 ? `Orders close at ${cutoffRule(cutoffTime, lead)}.` : "Orders close at the cut-off."}
          </AppText>
          {example ? <AppText color="muted">{example}</AppText> : null}
          {weekdays.length ? <AppText color="muted">{`Deliveries on ${weekdays.map((d) => WEEKDAY_LONG[d]).join(", ")}.`}</AppText> : null}
        </View>
      </Card>

      <Card title="Closed dates" testID="calendar-closures">
        <AppText color="muted">No deliveries on these dates; buyers see the note.</AppText>
        {upcoming.length === 0 ? (
          <AppText color="muted" testID="closures-empty">
            No closures coming up.
          </AppText>
        ) : (
          <View>
            {upcoming.map((c, i) => (
              <View key={c.date} style={[styles.closure, i > 0 && styles.divider]} testID={`closure-${c.date}`}>
                <View style={styles.flex}>
                  <AppText variant="bodyStrong">{formatDay(c.date)}</AppText>
                  {c.note ? <AppText variant="small" color="muted">{c.note}</AppText> : null}
                </View>
                <Button
                  label="Remove"
                  small
                  variant="ghost"
                  icon="x"
                  accessibilityLabel={`Remove the closure on ${formatDay(c.date)}`}
                  onPress={() => {
                    setClosures((all) => all.filter((x) => x.date !== c.date));
                    setSaved(false);
                  }}
                  testID={`closure-${c.date}-remove`}
                />
              </View>
            ))}
          </View>
        )}
        {past > 0 ? <AppText variant="small" color="muted">{past === 1 ? "1 past closure is kept on file." : `${past} past closures are kept on file.`}</AppText> : null}
        <View style={styles.addRow}>
          <View style={styles.cell}>
            <TextField label="Date" value={newDate} onChangeText={(t) => { setNewDate(t); setClosureError(null); }} placeholder="YYYY-MM-DD" error={closureError ?? fields.closures} inputMode="numeric" autoCorrect={false} testID="closure-date" />
          </View>
          <View style={styles.cellWide}>
            <TextField label="Note" optional value={newNote} onChangeText={setNewNote} placeholder="e.g. Christmas Day" maxLength={120} testID="closure-note" />
          </View>
        </View>
        <Button label="Add closed date" icon="plus" variant="secondary" onPress={addClosure} testID="closure-add" />
      </Card>

      <FormError message={formError} testID="calendar-form-error" />
      {saved ? <Notice message="Delivery days saved. Buyers see the new dates now." testID="calendar-saved" /> : null}
      <Button label="Save delivery days" icon="check" onPress={submit} busy={save.isPending} testID="calendar-save" block />
      <TextLink href="/office/production/settings" label="Production settings: mixer, dispatch time, ovens" testID="open-production-settings" />
    </>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 140 },
  cellWide: { flexGrow: 2, flexBasis: 200 },
  rule: { gap: space.xxs, padding: space.md, backgroundColor: colors.sunken, borderRadius: radii.md },
  closure: { flexDirection: "row", alignItems: "center", gap: space.sm, minHeight: layout.minTouch + 8, paddingVertical: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  addRow: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
});
