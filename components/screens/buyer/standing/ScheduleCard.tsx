import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { ChoiceGroup } from "../../../ui/ChoiceGroup";
import type { ZodForm } from "../../../forms/useZodForm";
import { cleanDate, formatDay } from "../../../ordering/dates";
import type { StandingValues } from "../../../ordering/standing";
import { space } from "../../../theme";
import { DateField } from "../../../ui/DateField";

/** How often: every week or every other week, from and until when, and on or paused. */
export function ScheduleCard({ form }: { form: ZodForm<StandingValues, unknown> }) {
  const { values, errors } = form;
  return (
    <Card title="How often" testID="standing-schedule">
      <ChoiceGroup<"1" | "2">
        label="Repeat"
        testID="standing-interval"
        value={String(values.intervalWeeks) as "1" | "2"}
        onChange={(v) => form.setValue("intervalWeeks", v === "2" ? 2 : 1)}
        error={errors.intervalWeeks}
        choices={[
          { value: "1", label: "Every week" },
          { value: "2", label: "Every other week" },
        ]}
      />
      <View style={styles.pair}>
        <View style={styles.half}>
          <DateField
            label="Starts on"
            {...form.text("startDate")}
            hint={cleanDate(values.startDate) ? formatDay(values.startDate) : "The first date the standing order delivers from."}
            testID="standing-start"
          />
        </View>
        <View style={styles.half}>
          <DateField
            label="Ends on"
            optional
            {...form.text("endDate")}
            hint={cleanDate(values.endDate) ? formatDay(values.endDate) : "Leave empty to keep going."}
            testID="standing-end"
          />
        </View>
      </View>
      <ChoiceGroup<"on" | "off">
        label="Status"
        testID="standing-active"
        value={values.active ? "on" : "off"}
        onChange={(v) => form.setValue("active", v === "on")}
        choices={[
          { value: "on", label: "On" },
          { value: "off", label: "Paused" },
        ]}
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  pair: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  half: { flexGrow: 1, flexBasis: 200 },
});
