import React, { useEffect, useState } from "react";
import { View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { Button } from "../../ui/Button";
import { DetailList } from "../../ui/DetailList";
import { FormError, Notice } from "../../ui/FormError";
import { ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useBillingSettingsQuery, useSaveBillingSettingsMutation, type BillingSettingsDto } from "../../api/billingSettings";
import { splitError } from "../../forms/errors";
import { parseMoney } from "../../../shared/money";
import type { FieldErrors } from "../../../shared/errors";
import { BackLink, billingStyles, percent } from "./parts";
import { space } from "../../theme";

export interface BillingSettingsValues {
  taxPercent: string;
  invoicePrefix: string;
  creditHoldDays: string;
  paymentInstructions: string;
}

/** "8.75" (percent, up to two decimals) → 875 basis points. */
export function percentToBp(text: string): number | null {
  const t = text.trim().replace(/\s*%$/, "");
  if (!/^\d{1,3}(\.\d{1,2})?$/.test(t)) return null;
  return parseMoney(t, "USD");
}

export function bpToPercentText(bp: number): string {
  return percent(bp).replace(" %", "");
}

export function checkBillingSettings(v: BillingSettingsValues): { ok: true; input: BillingSettingsDto } | { ok: false; fields: FieldErrors } {
  const fields: FieldErrors = {};
  const bp = percentToBp(v.taxPercent);
  if (bp === null) fields.salesTaxRateBp = "Enter a percentage like 8.75 (two decimals at most).";
  else if (bp > 3000) fields.salesTaxRateBp = "At most 30 %.";
  const prefix = v.invoicePrefix.trim();
  if (!/^[A-Z]{1,6}$/.test(prefix)) fields.invoicePrefix = "1 to 6 capital letters, e.g. HB.";
  const days = /^\d+$/.test(v.creditHoldDays.trim()) ? Number(v.creditHoldDays.trim()) : Number.NaN;
  if (!Number.isInteger(days) || days < 1) fields.creditHoldDays = "At least 1 day.";
  else if (days > 180) fields.creditHoldDays = "At most 180 days.";
  if (v.paymentInstructions.trim().length > 600) fields.paymentInstructions = "At most 600 characters.";
  if (Object.keys(fields).length || bp === null) return { ok: false, fields };
  return { ok: true, input: { salesTaxRateBp: bp, invoicePrefix: prefix, creditHoldDays: days, paymentInstructions: v.paymentInstructions.trim() } };
}

const FIELDS = ["salesTaxRateBp", "invoicePrefix", "creditHoldDays", "paymentInstructions"] as const;

/** Sales tax, invoice numbering, the credit-hold rule and the transfer details printed on statements (the owner edits). */
export function BillingSettingsScreen() {
  const user = useSignedInUser();
  const settings = useBillingSettingsQuery();
  const isOwner = user.role === "owner";
  return (
    <Screen narrow testID="billing-settings-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Billing settings" subtitle="How invoices are numbered and taxed, and when late payers go on credit hold." testID="billing-settings-title" />
      {settings.isPending ? (
        <LoadingState label="Loading billing settings…" testID="billing-settings-loading" />
      ) : settings.isError ? (
        <ErrorState error={settings.error} title="Billing settings didn't load" onRetry={() => settings.refetch()} retrying={settings.isFetching} testID="billing-settings-error" />
      ) : isOwner ? (
        <SettingsForm settings={settings.data} />
      ) : (
        <Card title="Current settings" testID="billing-settings-readonly">
          <DetailList
            items={[
              { label: "Sales tax", value: percent(settings.data.salesTaxRateBp) },
              { label: "Invoice prefix", value: settings.data.invoicePrefix },
              { label: "Credit hold after", value: `${settings.data.creditHoldDays} days overdue` },
              { label: "Payment instructions", value: settings.data.paymentInstructions },
            ]}
          />
          <AppText variant="small" color="muted">
            Only the owner can change these.
          </AppText>
        </Card>
      )}
    </Screen>
  );
}

function SettingsForm({ settings }: { settings: BillingSettingsDto }) {
  const save = useSaveBillingSettingsMutation();
  const from = (s: BillingSettingsDto): BillingSettingsValues => ({ taxPercent: bpToPercentText(s.salesTaxRateBp), invoicePrefix: s.invoicePrefix, creditHoldDays: String(s.creditHoldDays), paymentInstructions: s.paymentInstructions });
  const [values, setValues] = useState<BillingSettingsValues>(() => from(settings));
  const [fields, setFields] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const set = (patch: Partial<BillingSettingsValues>) => {
    setSaved(false);
    setValues((v) => ({ ...v, ...patch }));
  };
  useEffect(() => setValues(from(settings)), [settings]);

  const submit = () => {
    if (save.isPending) return;
    setFormError(null);
    setSaved(false);
    const checked = checkBillingSettings(values);
    if (!checked.ok) {
      setFields(checked.fields);
      return;
    }
    setFields({});
    save.mutate(checked.input, {
      onSuccess: () => setSaved(true),
      onError: (err) => {
        const split = splitError(err, FIELDS);
        setFields(split.fields);
        setFormError(split.formError);
      },
    });
  };

  return (
    <Card testID="billing-settings-form">
      {saved ? <Notice message="Billing settings saved. New invoices use them." testID="billing-settings-saved" /> : null}
      <FormError message={formError} testID="billing-settings-form-error" />
      <View style={{ gap: space.lg }}>
        <TextField label="Sales tax (%)" hint="Charged on each invoice's subtotal, unless the account holds an approved exemption certificate." value={values.taxPercent} onChangeText={(t) => set({ taxPercent: t })} error={fields.salesTaxRateBp} testID="settings-tax" inputMode="decimal" maxLength={6} />
        <TextField label="Invoice prefix" hint="Numbers read PREFIX-YEAR-00001; credit notes PREFIX-CN-YEAR-00001." value={values.invoicePrefix} onChangeText={(t) => set({ invoicePrefix: t.toUpperCase() })} error={fields.invoicePrefix} testID="settings-prefix" autoCapitalize="characters" maxLength={6} autoCorrect={false} />
        <TextField label="Credit hold after (days overdue)" hint="An account with an invoice this many days past due goes on credit hold until it is paid." value={values.creditHoldDays} onChangeText={(t) => set({ creditHoldDays: t })} error={fields.creditHoldDays} testID="settings-hold-days" inputMode="numeric" maxLength={3} />
        <TextField label="Payment instructions" optional hint="Printed on statements and invoice e-mails: bank details, who checks are payable to." value={values.paymentInstructions} onChangeText={(t) => set({ paymentInstructions: t })} error={fields.paymentInstructions} testID="settings-instructions" multiline maxLength={600} />
      </View>
      <View style={billingStyles.buttons}>
        <Button label="Save settings" icon="check" busy={save.isPending} onPress={submit} testID="settings-save" />
      </View>
    </Card>
  );
}
