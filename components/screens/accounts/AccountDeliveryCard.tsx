import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { MultiChoice } from "../../ui/MultiChoice";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { DetailList } from "../../ui/DetailList";
import { FormError, Notice } from "../../ui/FormError";
import { ErrorState, LoadingState } from "../../ui/States";
import { useAccountDeliveryQuery, useSaveAccountDeliveryMutation, type AccountDeliveryDto } from "../../api/delivery";
import { useCalendarSettingsQuery } from "../../api/calendar";
import { usePriceListsQuery } from "../../api/priceLists";
import { useZodForm } from "../../forms/useZodForm";
import { DELIVERY_FIELDS, deliveryInput, deliverySchema, deliveryValues } from "./deliveryForm";
import { useMoney } from "../ordering/parts";
import { describePriceList } from "../pricing/priceListForm";
import { listWeekdays } from "../buyer/StandingOrderScreen";
import { WEEKDAY_SHORT, type Weekday } from "../../../shared/calendar";
import type { PriceListDto } from "../../../shared/schemas/catalog";
import { space } from "../../theme";

/** An account's route days, minimum order and price list: the owner edits, the bookkeeper reads. */
export function AccountDeliveryCard({ accountId, editable }: { accountId: number; editable: boolean }) {
  const delivery = useAccountDeliveryQuery(accountId);
  const settings = useCalendarSettingsQuery();
  const lists = usePriceListsQuery({ enabled: editable });
  const failed = delivery.isError ? delivery : settings.isError ? settings : editable && lists.isError ? lists : null;
  return (
    <Card title="Delivery and prices" testID="account-delivery">
      {failed ? (
        <ErrorState error={failed.error} title="Delivery terms didn't load" onRetry={() => failed.refetch()} retrying={failed.isFetching} testID="account-delivery-error" />
      ) : !delivery.data || !settings.data || (editable && !lists.data) ? (
        <LoadingState label="Loading delivery terms…" />
      ) : editable ? (
        <DeliveryForm key={JSON.stringify(delivery.data)} accountId={accountId} initial={delivery.data} bakeryDays={settings.data.deliveryWeekdays} lists={lists.data ?? []} />
      ) : (
        <DeliveryFacts delivery={delivery.data} bakeryDays={settings.data.deliveryWeekdays} />
      )}
    </Card>
  );
}

function DeliveryFacts({ delivery, bakeryDays }: { delivery: AccountDeliveryDto; bakeryDays: Weekday[] }) {
  const money = useMoney();
  return (
    <DetailList
      items={[
        { label: "Delivery days", value: delivery.routeWeekdays === null ? `Every delivery day (${listWeekdays(bakeryDays)})` : listWeekdays(delivery.routeWeekdays) || "None", testID: "delivery-days" },
        { label: "Minimum order", value: delivery.minimumOrderCents ? money(delivery.minimumOrderCents) : "No minimum", testID: "delivery-minimum" },
        { label: "Prices", value: delivery.priceListId ? "Its own price list" : "List prices", testID: "delivery-price-list" },
      ]}
    />
  );
}

function DeliveryForm({ accountId, initial, bakeryDays, lists }: { accountId: number; initial: AccountDeliveryDto; bakeryDays: Weekday[]; lists: PriceListDto[] }) {
  const save = useSaveAccountDeliveryMutation(accountId);
  const form = useZodForm({ schema: deliverySchema, initial: () => deliveryValues(initial, bakeryDays), toInput: deliveryInput, fields: DELIVERY_FIELDS, manyMessage: null });
  const { values, errors } = form;

  const submit = () => void form.submit((input) => save.mutateAsync(input as AccountDeliveryDto));

  return (
    <View style={styles.form}>
      <FormError message={form.formError} testID="delivery-form-error" />
      <ChoiceGroup<"all" | "some">
        label="Delivery days"
        value={values.everyDay ? "all" : "some"}
        onChange={(v) => form.setValue("everyDay", v === "all")}
        testID="delivery-route"
        choices={[
          { value: "all", label: "Every delivery day" },
          { value: "some", label: "Only some days" },
        ]}
      />
      {!values.everyDay ? (
        <MultiChoice<Weekday>
          label="Days on this account's route"
          options={bakeryDays.map((d) => ({ value: d, label: WEEKDAY_SHORT[d] }))}
          value={values.days.filter((d) => bakeryDays.includes(d))}
          onChange={form.set("days")}
          error={errors.routeWeekdays}
          testID="delivery-days"
        />
      ) : null}
      <TextField
        label="Minimum order"
        optional
        value={values.minimum}
        onChangeText={form.set("minimum")}
        error={errors.minimumOrderCents}
        placeholder="0.00"
        hint="In dollars per delivery. Empty for no minimum."
        inputMode="decimal"
        keyboardType="decimal-pad"
        testID="delivery-minimum"
      />
      <ChoiceGroup<string>
        label="Prices"
        layout="list"
        value={values.priceListId}
        onChange={form.set("priceListId")}
        error={errors.priceListId}
        testID="delivery-price-list"
        choices={[{ value: "none", label: "List prices", hint: "The prices on the product list." }, ...lists.map((l) => ({ value: String(l.id), label: l.name, hint: describePriceList(l) }))]}
      />
      {form.saved ? <Notice message="Delivery terms saved." testID="delivery-saved" /> : null}
      <Button label="Save delivery terms" icon="check" busy={form.submitting} onPress={submit} testID="delivery-save" />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
});
