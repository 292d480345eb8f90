import React, { useEffect } from "react";
import { View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { DetailList } from "../../ui/DetailList";
import { FormError, Notice } from "../../ui/FormError";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useBillingSettingsQuery, useRemindersSwitchMutation, useSaveBillingSettingsMutation, type BillingSettingsDto } from "../../api/billingSettings";
import { TickBox } from "../../ui/TickBox";
import { messageOf } from "../../api/client";
import { REMINDER_SCHEDULE, REMINDER_STAGE_LABELS } from "../../../shared/billing";
import { useZodForm } from "../../forms/useZodForm";
import { BILLING_SETTINGS_FIELDS, billingSettingsInput, billingSettingsSchema, billingSettingsValues } from "./billingSettingsForm";
import { BackLink, billingStyles, percent } from "./parts";
import { space } from "../../theme";

/** Sales tax, invoice numbering, the credit-hold rule and the transfer details printed on statements (the owner edits). */
export function BillingSettingsScreen() {
  const user = useSignedInUser();
  const settings = useBillingSettingsQuery();
  const isOwner = user.role === "owner";
  return (
    <Screen narrow testID="billing-settings-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Billing settings" subtitle="How invoices are numbered and taxed, and when late payers go on credit hold." testID="billing-settings-title" />
      <QueryStates query={settings} testID="billing-settings" loadingLabel="Loading billing settings…" errorTitle="Billing settings didn't load">
        {(data) =>
          isOwner ? (
            <>
              <RemindersCard settings={data} />
              <SettingsForm settings={data} />
            </>
          ) : (
            <>
            <RemindersCard settings={data} />
            <Card title="Current settings" testID="billing-settings-readonly">
              <DetailList
                items={[
                  { label: "Sales tax", value: percent(data.salesTaxRateBp) },
                  { label: "Invoice prefix", value: data.invoicePrefix },
                  { label: "Credit hold after", value: `${data.creditHoldDays} days overdue` },
                  { label: "Payment instructions", value: data.paymentInstructions },
                ]}
              />
              <AppText variant="small" color="muted">
                Only the owner can change these.
              </AppText>
            </Card>
            </>
          )
        }
      </QueryStates>
    </Screen>
  );
}

/** The payment-reminder schedule: the owner or the bookkeeper turns it on; each stage goes out once per unpaid invoice. */
function RemindersCard({ settings }: { settings: BillingSettingsDto }) {
  const toggle = useRemindersSwitchMutation();
  const stages = REMINDER_SCHEDULE.map((s) => REMINDER_STAGE_LABELS[s.stage].toLowerCase()).join(", ");
  return (
    <Card title="Payment reminders" testID="reminders-card">
      <AppText color="muted">{`When this is on, each unpaid invoice gets a reminder e-mail to the account's billing address ${stages.replace(/, ([^,]*)$/, " and $1")} — each once, through the outgoing e-mail. Reminders by hand are on each invoice.`}</AppText>
      <TickBox label="Send payment reminders on this schedule" checked={settings.remindersOn} busy={toggle.isPending} onChange={(on) => toggle.mutate(on)} testID="reminders-on" />
      <FormError message={toggle.isError ? messageOf(toggle.error) : null} testID="reminders-error" />
    </Card>
  );
}

function SettingsForm({ settings }: { settings: BillingSettingsDto }) {
  const save = useSaveBillingSettingsMutation();
  const form = useZodForm({
    schema: billingSettingsSchema,
    initial: () => billingSettingsValues(settings),
    toInput: billingSettingsInput,
    fields: BILLING_SETTINGS_FIELDS,
    manyMessage: null,
  });
  const { errors } = form;
  // A reload (after saving, or from elsewhere) brings the stored values; the "saved" notice stays.
  const { reset } = form;
  useEffect(() => reset(billingSettingsValues(settings), { keepSaved: true }), [settings, reset]);

  const submit = () => void form.submit((input) => save.mutateAsync(input));

  return (
    <Card testID="billing-settings-form">
      {form.saved ? <Notice message="Billing settings saved. New invoices use them." testID="billing-settings-saved" /> : null}
      <FormError message={form.formError} testID="billing-settings-form-error" />
      <View style={{ gap: space.lg }}>
        <TextField label="Sales tax (%)" hint="Charged on each invoice's subtotal, unless the account holds an approved exemption certificate." {...form.text("taxPercent")} error={errors.salesTaxRateBp} testID="settings-tax" inputMode="decimal" maxLength={6} />
        <TextField label="Invoice prefix" hint="Numbers read PREFIX-YEAR-00001; credit notes PREFIX-CN-YEAR-00001." value={form.values.invoicePrefix} onChangeText={(t) => form.setValue("invoicePrefix", t.toUpperCase())} error={errors.invoicePrefix} testID="settings-prefix" autoCapitalize="characters" maxLength={6} autoCorrect={false} />
        <TextField label="Credit hold after (days overdue)" hint="An account with an invoice this many days past due goes on credit hold until it is paid." {...form.text("creditHoldDays")} testID="settings-hold-days" inputMode="numeric" maxLength={3} />
        <TextField label="Payment instructions" optional hint="Printed on statements and invoice e-mails: bank details, who checks are payable to." {...form.text("paymentInstructions")} testID="settings-instructions" multiline maxLength={600} />
      </View>
      <View style={billingStyles.buttons}>
        <Button label="Save settings" icon="check" busy={form.submitting} onPress={submit} testID="settings-save" />
      </View>
    </Card>
  );
}
