import React, { useState } from "react";
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
import { splitError, validate } from "../../forms/errors";
import { useMoney } from "../ordering/parts";
import { describePriceList } from "../pricing/PriceListsScreen";
import { listWeekdays } from "../buyer/StandingOrderScreen";
import { WEEKDAY_SHORT, type Weekday } from "../../../shared/calendar";
import { accountDeliverySchema } from "../../../shared/schemas/calendar";
import { parseMoney, toDecimal } from "../../../shared/money";
import type { PriceListDto } from "../../../shared/schemas/catalog";
import type { FieldErrors } from "../../../shared/errors";
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
  const [everyDay, setEveryDay] = useState(initial.routeWeekdays === null);
  const [days, setDays] = useState<Weekday[]>(initial.routeWeekdays ?? bakeryDays);
  const [minimum, setMinimum] = useState(initial.minimumOrderCents ? toDecimal(initial.minimumOrderCents) : "");
  const [priceListId, setPriceListId] = useState<string>(initial.priceListId ? String(initial.priceListId) : "none");
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);

  const submit = () => {
    setDone(false);
    setFormError(null);
    const cents = minimum.trim() === "" ? 0 : parseMoney(minimum);
    if (cents === null) {
      setFields({ minimumOrderCents: "Write it in dollars and cents, like 50.00 (empty for no minimum)." });
      return;
    }
    const body = { routeWeekdays: everyDay ? null : days, minimumOrderCents: cents, priceListId: priceListId === "none" ? null : Number(priceListId) };
    const checked = validate(accountDeliverySchema, body);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    if (!everyDay && days.length === 0) {
      setFields({ routeWeekdays: "Choose at least one day, or deliver on every delivery day." });
      return;
    }
    setFields({});
    save.mutate(checked.data as AccountDeliveryDto, {
      onSuccess: () => setDone(true),
      onError: (err) => {
        const split = splitError(err, ["routeWeekdays", "minimumOrderCents", "priceListId"]);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  return (
    <View style={styles.form}>
      <FormError message={formError} testID="delivery-form-error" />
      <ChoiceGroup<"all" | "some">
        label="Delivery days"
        value={everyDay ? "all" : "some"}
        onChange={(v) => setEveryDay(v === "all")}
        testID="delivery-route"
        choices={[
          { value: "all", label: "Every delivery day" },
          { value: "some", label: "Only some days" },
        ]}
      />
      {!everyDay ? (
        <MultiChoice<Weekday>
          label="Days on this account's route"
          options={bakeryDays.map((d) => ({ value: d, label: WEEKDAY_SHORT[d] }))}
          value={days.filter((d) => bakeryDays.includes(d))}
          onChange={setDays}
          error={fields.routeWeekdays}
          testID="delivery-days"
        />
      ) : null}
      <TextField
        label="Minimum order"
        optional
        value={minimum}
        onChangeText={setMinimum}
        error={fields.minimumOrderCents}
        placeholder="0.00"
        hint="In dollars per delivery. Empty for no minimum."
        inputMode="decimal"
        keyboardType="decimal-pad"
        testID="delivery-minimum"
      />
      <ChoiceGroup<string>
        label="Prices"
        layout="list"
        value={priceListId}
        onChange={setPriceListId}
        error={fields.priceListId}
        testID="delivery-price-list"
        choices={[{ value: "none", label: "List prices", hint: "The prices on the product list." }, ...lists.map((l) => ({ value: String(l.id), label: l.name, hint: describePriceList(l) }))]}
      />
      {done ? <Notice message="Delivery terms saved." testID="delivery-saved" /> : null}
      <Button label="Save delivery terms" icon="check" busy={save.isPending} onPress={submit} testID="delivery-save" />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
});
