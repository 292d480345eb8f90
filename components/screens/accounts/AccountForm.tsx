import React from "react";
import { StyleSheet, View } from "react-native";
import type { Href } from "expo-router";
import { Card } from "../../ui/Card";
import { EMAIL_INPUT, TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { FormError } from "../../ui/FormError";
import { useZodForm } from "../../forms/useZodForm";
import type { z } from "zod";
import { accountInputSchema, type AccountDto, type AccountStatus } from "../../../shared/schemas/accounts";
import { space } from "../../theme";

/** The form's values: what the shared account schema gives (every field present, status defaulted). */
export type AccountValues = z.output<typeof accountInputSchema>;

const FIELDS = Object.keys(accountInputSchema.shape) as (keyof AccountValues)[];

export const EMPTY_ACCOUNT: AccountValues = { businessName: "", deliveryAddress: "", contactName: "", contactPhone: "", billingEmail: "", status: "active", notes: "" };

export function accountValues(a: AccountDto): AccountValues {
  return Object.fromEntries(FIELDS.map((k) => [k, a[k]])) as AccountValues;
}

export interface AccountFormProps {
  initial: AccountValues;
  withStatus?: boolean;
  submitLabel: string;
  /** Sends the checked input; a rejection shows its errors on the form. */
  onSubmit: (input: AccountValues) => Promise<unknown>;
  cancelHref: Href;
}

/** The account's details: the same form for a new account and an edit. */
export function AccountForm({ initial, withStatus, submitLabel, onSubmit, cancelHref }: AccountFormProps) {
  const form = useZodForm({ schema: accountInputSchema, initial, fields: FIELDS });
  const { values, errors: fields } = form;
  const submit = () => void form.submit((input) => onSubmit(input as AccountValues));

  return (
    <Card testID="account-form">
      <FormError message={form.formError} testID="account-form-error" />
      <TextField label="Business name" testID="account-businessName" {...form.text("businessName")} autoCapitalize="words" />
      <TextField
        label="Delivery address"
        testID="account-deliveryAddress"
        {...form.text("deliveryAddress")}
        multiline
        hint="Where the driver leaves the order, with any door or gate details."
      />
      <View style={styles.pair}>
        <View style={styles.half}>
          <TextField label="Contact name" optional testID="account-contactName" {...form.text("contactName")} autoCapitalize="words" />
        </View>
        <View style={styles.half}>
          <TextField
            label="Contact phone"
            optional
            testID="account-contactPhone"
            {...form.text("contactPhone")}
            keyboardType="phone-pad"
            inputMode="tel"
          />
        </View>
      </View>
      <TextField
        label="Billing e-mail"
        testID="account-billingEmail"
        {...form.text("billingEmail")}
        {...EMAIL_INPUT}
        hint="Invoices and statements go here."
      />
      {withStatus ? (
        <ChoiceGroup<AccountStatus>
          label="Status"
          testID="account-status-choice"
          value={values.status}
          onChange={form.set("status")}
          error={fields.status}
          choices={[
            { value: "active", label: "Active" },
            { value: "on_hold", label: "Paused" },
          ]}
        />
      ) : null}
      <TextField label="Office notes" optional testID="account-notes" {...form.text("notes")} multiline hint="Only office staff see these." />
      <View style={styles.buttons}>
        <Button label={submitLabel} icon="check" onPress={submit} busy={form.submitting} testID="account-submit" />
        <TextLink href={cancelHref} label="Cancel" />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  pair: { flexDirection: "row", flexWrap: "wrap", gap: space.lg },
  half: { flexGrow: 1, flexBasis: 220 },
  buttons: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.lg },
});
