import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { MultiChoice } from "../../ui/MultiChoice";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { DetailList } from "../../ui/DetailList";
import { FormError, Notice } from "../../ui/FormError";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { TextLink } from "../../ui/TextLink";
import { useCalendarSettingsQuery, useSaveCalendarSettingsMutation } from "../../api/calendar";
import { useBakeryQuery } from "../../api/bakery";
import { useZodForm } from "../../forms/useZodForm";
import { DEFAULT_LOCALE, LOCALE_NAMES, SUPPORTED_LOCALES, isSupportedLocale, type SupportedLocale } from "../../../shared/format";
import { cutoffRule } from "../buyer/DeliveryTermsCard";
import { WEEKDAYS, WEEKDAY_LONG, WEEKDAY_SHORT, type Weekday } from "../../../shared/calendar";
import { calendarSettingsSchema, type CalendarSettingsDto } from "../../../shared/schemas/calendar";
import { cutoffExample, localeSample } from "./calendarText";
import { ClosuresCard } from "./ClosuresCard";
import { colors, radii, space } from "../../theme";

const FIELDS = ["locale", "deliveryWeekdays", "cutoffTime", "leadDays", "horizonDays", "closures"] as const;

/** The owner's delivery days: delivery weekdays, cut-off, how far ahead, and closure dates. */
export function CalendarSettingsScreen() {
  const settings = useCalendarSettingsQuery();
  return (
    <Screen narrow testID="calendar-settings">
      <PageHeader title="Delivery days" subtitle="When the bakery delivers and when ordering closes. Changes apply to every account at once." testID="calendar-settings-title" />
      <QueryStates query={settings} loadingTestID="loading" errorTestID="calendar-settings-error" loadingLabel="Loading the delivery days…">
        {(data) => <SettingsForm initial={data} />}
      </QueryStates>
    </Screen>
  );
}

function SettingsForm({ initial }: { initial: CalendarSettingsDto }) {
  const save = useSaveCalendarSettingsMutation();
  const bakery = useBakeryQuery();
  const form = useZodForm({
    schema: calendarSettingsSchema,
    initial: () => ({
      locale: (isSupportedLocale(initial.locale) ? initial.locale : DEFAULT_LOCALE) as SupportedLocale,
      deliveryWeekdays: initial.deliveryWeekdays,
      cutoffTime: initial.cutoffTime,
      leadDays: String(initial.leadDays),
      horizonDays: String(initial.horizonDays),
      closures: initial.closures,
    }),
    // The same numbers the schema's coercion would make (`Number` of the text), so its messages are the server's.
    toInput: (v) => ({ ...v, timeZone: initial.timeZone, cutoffTime: v.cutoffTime.trim(), leadDays: Number(v.leadDays), horizonDays: Number(v.horizonDays) }),
    fields: FIELDS,
    manyMessage: null,
  });
  const { values, errors } = form;
  const today = bakery.data?.today;

  const submit = () => void form.submit((input) => save.mutateAsync(input));

  const lead = Number(values.leadDays);
  const example = today && Number.isInteger(lead) ? cutoffExample(today, { timeZone: initial.timeZone, deliveryWeekdays: values.deliveryWeekdays, cutoffTime: values.cutoffTime, leadDays: lead }) : null;

  return (
    <>
      <Card title="Ordering rules" testID="calendar-rules">
        <DetailList items={[{ label: "Time zone", value: initial.timeZone.replace(/_/g, " "), testID: "calendar-timezone" }]} />
        <ChoiceGroup<SupportedLocale>
          label="Dates, times and amounts"
          choices={SUPPORTED_LOCALES.map((l) => ({ value: l, label: LOCALE_NAMES[l], hint: localeSample(l, bakery.data?.currency) }))}
          value={values.locale}
          onChange={form.set("locale")}
          error={errors.locale}
          layout="list"
          testID="calendar-locale"
        />
        <MultiChoice<Weekday>
          label="Delivery days"
          hint="Each account can be narrowed to some of these on its own page."
          options={WEEKDAYS.map((d) => ({ value: d, label: WEEKDAY_SHORT[d] }))}
          value={values.deliveryWeekdays}
          onChange={form.set("deliveryWeekdays")}
          error={errors.deliveryWeekdays}
          testID="calendar-weekdays"
        />
        <View style={styles.grid}>
          <View style={styles.cell}>
            <TextField label="Cut-off time" {...form.text("cutoffTime")} hint="24-hour clock, e.g. 14:00." placeholder="14:00" testID="calendar-cutoff" autoCorrect={false} />
          </View>
          <View style={styles.cell}>
            <TextField label="Days before delivery" {...form.text("leadDays")} hint="1 = the day before." inputMode="numeric" keyboardType="number-pad" testID="calendar-lead" />
          </View>
          <View style={styles.cell}>
            <TextField label="Order ahead (days)" {...form.text("horizonDays")} hint="How far ahead buyers may order." inputMode="numeric" keyboardType="number-pad" testID="calendar-horizon" />
          </View>
        </View>
        <View style={styles.rule} testID="calendar-rule">
          <AppText variant="bodyStrong">
            {Number.isInteger(lead) && lead >= 0 ? `Orders close at ${cutoffRule(values.cutoffTime, lead)}.` : "Orders close at the cut-off."}
          </AppText>
          {example ? <AppText color="muted">{example}</AppText> : null}
          {values.deliveryWeekdays.length ? <AppText color="muted">{`Deliveries on ${values.deliveryWeekdays.map((d) => WEEKDAY_LONG[d]).join(", ")}.`}</AppText> : null}
        </View>
      </Card>

      <ClosuresCard closures={values.closures} onChange={form.set("closures")} today={today} error={errors.closures} />

      <FormError message={form.formError} testID="calendar-form-error" />
      {form.saved ? <Notice message="Delivery days saved. Buyers see the new dates now." testID="calendar-saved" /> : null}
      <Button label="Save delivery days" icon="check" onPress={submit} busy={form.submitting} testID="calendar-save" block />
      <TextLink href="/office/production/settings" label="Production settings: mixer, dispatch time, ovens" testID="open-production-settings" />
    </>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 140 },
  rule: { gap: space.xxs, padding: space.md, backgroundColor: colors.sunken, borderRadius: radii.md },
});
