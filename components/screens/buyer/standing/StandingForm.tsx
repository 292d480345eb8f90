import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Screen } from "../../../ui/Screen";
import { PageHeader } from "../../../ui/PageHeader";
import { Button } from "../../../ui/Button";
import { FormError, Notice } from "../../../ui/FormError";
import { EmptyState } from "../../../ui/States";
import { AppText, Heading } from "../../../ui/Text";
import { useSaveStandingOrderMutation } from "../../../api/standing";
import { ApiError } from "../../../api/client";
import { useZodForm } from "../../../forms/useZodForm";
import { useIsWide } from "../../../shell/useIsWide";
import { useMoney } from "../../../ordering/useMoney";
import {
  STANDING_FIELDS,
  cellErrorsFrom,
  cellProblems,
  chosenWeekdays,
  droppedLines,
  periodText,
  savedMessage,
  scheduleSummary,
  standingPayload,
  standingValues,
  toggledSkip,
  weekTotalCents,
  withSkip,
  withSkipDatesField,
  type StandingValues,
} from "../../../ordering/standing";
import { WEEKDAY_SHORT, type Weekday } from "../../../../shared/calendar";
import { standingOrderSchema, type StandingOrderDto } from "../../../../shared/schemas/orders";
import type { ProductDto } from "../../../../shared/schemas/catalog";
import { colors, radii, space } from "../../../theme";
import { ProductRow } from "./ProductRow";
import { ScheduleCard } from "./ScheduleCard";
import { SkipDatesCard } from "./SkipDatesCard";
import { UpcomingDates } from "./UpcomingDates";

export interface StandingFormProps {
  standing: StandingOrderDto | null;
  products: ProductDto[];
  weekdays: Weekday[];
  today: string;
  horizonDays: number;
}

const QUANTITIES_MESSAGE = "Some quantities need attention: see the boxes marked in red.";

/** The grid of quantities, how often, the dates to skip, saving, and the dates it makes. */
export function StandingForm({ standing, products, weekdays, today, horizonDays }: StandingFormProps) {
  const money = useMoney();
  const wide = useIsWide();
  const save = useSaveStandingOrderMutation();
  const form = useZodForm<StandingValues, typeof standingOrderSchema>({
    schema: standingOrderSchema,
    initial: () => standingValues(standing, today),
    toInput: (v) => standingPayload({ products, weekdays, ...v }),
    fields: STANDING_FIELDS,
    manyMessage: null,
  });
  const [cellErrors, setCellErrors] = useState<Record<string, string>>({});
  const [savedText, setSavedText] = useState<string | null>(null);
  const { values } = form;

  const problems = cellProblems(products, weekdays, values.cells);
  const dropped = droppedLines(standing, weekdays, products);
  const chosenDays = chosenWeekdays(products, weekdays, values.cells);

  const setCell = (k: string, text: string) => {
    form.setValue("cells", { ...values.cells, [k]: text });
    setCellErrors((e) => {
      if (!e[k]) return e;
      const { [k]: _gone, ...rest } = e;
      return rest;
    });
  };
  const toggleSkip = (d: string) => form.setValue("skipDates", toggledSkip(values.skipDates, d));

  const submit = async () => {
    if (Object.keys(problems).length) {
      form.setFormError(QUANTITIES_MESSAGE);
      return;
    }
    const payload = standingPayload({ products, weekdays, ...values });
    await form.submit(async () => {
      setCellErrors({});
      try {
        setSavedText(savedMessage(await save.mutateAsync(payload), horizonDays));
      } catch (err) {
        if (!(err instanceof ApiError) || !err.fields) throw err;
        // Line errors go on the cells they name; the form puts the rest beside its fields or on top.
        setCellErrors(cellErrorsFrom(err.fields, payload.lines));
        throw new ApiError(err.status, err.code, err.message, withSkipDatesField(err.fields), err.details);
      }
    });
  };

  return (
    <Screen testID="standing-screen">
      <PageHeader
        overline="Wholesale ordering"
        title="Standing order"
        subtitle="Your usual quantities for each delivery day. The bakery places them as orders by themselves; you can still change any single date."
        testID="standing-title"
      />
      {!standing ? <Notice tone="info" message="You don't have a standing order yet. Set quantities below and save to start one." testID="standing-none" /> : null}
      {weekdays.length === 0 ? (
        <EmptyState icon="calendar" title="No delivery days for you" message="The bakery hasn't set any delivery days for your account yet. Call them to set your delivery days." testID="standing-no-days" />
      ) : (
        <>
          <View style={styles.summary} testID="standing-summary">
            <Feather name="repeat" size={18} color={colors.crustInk} />
            <View style={styles.flex}>
              <AppText variant="bodyStrong" color="ink">
                {scheduleSummary(chosenDays, values)}
              </AppText>
              {chosenDays.length ? (
                <AppText variant="small" color="muted" testID="standing-week-total">{`About ${money(weekTotalCents(products, weekdays, values.cells))} ${periodText(values.intervalWeeks)} at today's prices.`}</AppText>
              ) : null}
            </View>
          </View>
          {dropped.length ? (
            <Notice
              tone="info"
              testID="standing-dropped"
              message={`Some quantities are for days or products you can no longer get and will be removed when you save (${dropped
                .map((l) => `${WEEKDAY_SHORT[l.weekday]}: ${l.quantity}`)
                .join(", ")}).`}
            />
          ) : null}

          <Heading level={2}>Quantities per delivery day</Heading>
          <View style={[styles.cards, wide && styles.cardsWide]}>
            {products.map((p) => (
              <ProductRow key={p.id} wide={wide} intervalWeeks={values.intervalWeeks} product={p} weekdays={weekdays} cells={values.cells} problems={problems} cellErrors={cellErrors} onChange={setCell} disabled={save.isPending} />
            ))}
          </View>

          <ScheduleCard form={form} />
          <SkipDatesCard
            skipDates={values.skipDates}
            today={today}
            pattern={{ startDate: values.startDate, endDate: values.endDate, intervalWeeks: values.intervalWeeks, weekdays: chosenDays }}
            error={form.errors.skipDates}
            onAdd={(d) => form.setValue("skipDates", withSkip(values.skipDates, d))}
            onRemove={toggleSkip}
          />

          <FormError message={form.formError} testID="standing-error-message" />
          {form.saved && savedText ? <Notice message={savedText} testID="standing-saved" /> : null}
          <Button label="Save standing order" icon="check" onPress={() => void submit()} busy={save.isPending} testID="standing-save" block />

          {standing ? <UpcomingDates standing={standing} skipDates={values.skipDates} onToggleSkip={toggleSkip} /> : null}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  summary: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", backgroundColor: colors.surface, borderRadius: radii.md, padding: space.md, borderWidth: 2, borderColor: colors.crust },
  cards: { gap: space.md },
  cardsWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-start" },
});
