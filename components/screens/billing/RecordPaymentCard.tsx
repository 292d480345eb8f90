import React, { useEffect, useMemo, useRef, useState } from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { DateField } from "../../ui/DateField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { FormActions } from "../../ui/FormActions";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { PAYMENT_METHODS, useRecordPaymentMutation, type InvoiceDetailDto, type ManualPaymentMethod } from "../../api/invoices";
import { useBakeryQuery } from "../../api/bakery";
import { useZodForm } from "../../forms/useZodForm";
import { toDecimal } from "../../../shared/money";
import { METHOD_LABELS, money } from "./parts";
import { PAYMENT_FIELDS, paymentInput, paymentSchema, type PaymentValues } from "./paymentForm";
import { space } from "../../theme";

const CLOSED: PaymentValues = { amount: "", method: null, reference: "", receivedOn: "" };

/** The office records money that came in another way than by card: a transfer, a check, cash. */
export function RecordPaymentCard({ detail }: { detail: InvoiceDetailDto }) {
  const inv = detail.invoice;
  const today = useBakeryQuery().data?.today ?? "";
  const mutation = useRecordPaymentMutation(inv.id);
  const schema = useMemo(() => paymentSchema(inv.amountDueCents, inv.currency), [inv.amountDueCents, inv.currency]);
  const form = useZodForm({ schema, initial: CLOSED, toInput: paymentInput, fields: PAYMENT_FIELDS, manyMessage: null });
  const [open, setOpen] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);
  const { values, errors } = form;
  // The bakery's today may arrive after the form opened: fill it in once.
  const { setValue } = form;
  const date = useRef(values.receivedOn);
  date.current = values.receivedOn;
  useEffect(() => {
    if (today && !date.current) setValue("receivedOn", today);
  }, [today, setValue]);

  const start = () => {
    setSaved(null);
    form.reset({ amount: toDecimal(inv.amountDueCents, inv.currency), method: null, reference: "", receivedOn: today });
    setOpen(true);
  };

  const submit = () =>
    void form.submit(async (input) => {
      const p = await mutation.mutateAsync(input);
      setOpen(false);
      setSaved(`${METHOD_LABELS[p.method]} of ${money(p.amountCents, inv.currency)} recorded.`);
    });

  return (
    <Card title="Record a payment" testID="record-payment-card">
      {saved ? <Notice message={saved} testID="payment-saved" /> : null}
      {!open ? (
        <>
          <AppText color="muted">A bank transfer, check or cash that reached the bakery. Card payments are recorded on their own.</AppText>
          <Button label="Record a payment" icon="plus" variant="secondary" onPress={start} testID="record-payment-open" />
        </>
      ) : (
        <View style={styles.form}>
          <FormError message={form.formError} testID="payment-error" />
          <TextField
            label={`Amount (${inv.currency})`}
            hint={`Still owed: ${money(inv.amountDueCents, inv.currency)}`}
            {...form.text("amount")}
            error={errors.amountCents}
            testID="payment-amount"
            inputMode="decimal"
            keyboardType="decimal-pad"
          />
          <ChoiceGroup<ManualPaymentMethod>
            label="Paid by"
            value={values.method}
            onChange={form.set("method")}
            error={errors.method}
            testID="payment-method"
            choices={PAYMENT_METHODS.map((m) => ({ value: m, label: METHOD_LABELS[m] }))}
          />
          <TextField label="Reference" hint="The transfer reference or check number." {...form.text("reference")} testID="payment-reference" maxLength={120} autoCorrect={false} />
          <DateField label="Received on" {...form.text("receivedOn")} testID="payment-received-on" />
          <FormActions submitLabel="Save payment" busy={form.submitting} onSubmit={submit} submitTestID="payment-submit" onCancel={() => setOpen(false)} cancelTestID="payment-cancel" />
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
});
