import React from "react";
import { StyleSheet, View } from "react-native";
import { useRouter, type Href } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { FormError } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { useAccountQuery, useCreateAccountMutation, useUpdateAccountMutation } from "../../api/accounts";
import { ApiError } from "../../api/client";
import { useZodForm } from "../../forms/useZodForm";
import { accountInputSchema, type AccountDto, type AccountStatus } from "../../../shared/schemas/accounts";
import { space } from "../../theme";

interface Values {
  businessName: string;
  deliveryAddress: string;
  contactName: string;
  contactPhone: string;
  billingEmail: string;
  status: AccountStatus;
  notes: string;
}

const FIELDS = ["businessName", "deliveryAddress", "contactName", "contactPhone", "billingEmail", "status", "notes"] as const;

const EMPTY: Values = { businessName: "", deliveryAddress: "", contactName: "", contactPhone: "", billingEmail: "", status: "active", notes: "" };

function valuesOf(a: AccountDto): Values {
  return {
    businessName: a.businessName,
    deliveryAddress: a.deliveryAddress,
    contactName: a.contactName,
    contactPhone: a.contactPhone,
    billingEmail: a.billingEmail,
    status: a.status,
    notes: a.notes,
  };
}

/** New account (owner). */
export function NewAccountScreen() {
  const mutation = useCreateAccountMutation();
  const router = useRouter();
  return (
    <Screen narrow testID="account-new">
      <TextLink href="/office/accounts" label="‹ All accounts" />
      <PageHeader title="New account" subtitle="A café, restaurant or shop that orders from the bakery." />
      <AccountForm
        initial={EMPTY}
        withStatus
        submitLabel="Add account"
        onSubmit={async (input) => {
          const saved = await mutation.mutateAsync(input);
          router.replace(`/office/accounts/${saved.id}`);
        }}
        cancelHref="/office/accounts"
      />
    </Screen>
  );
}

/** Edit an account's details (owner). Status changes live on the account's page. */
export function EditAccountScreen({ id }: { id: number }) {
  const valid = Number.isInteger(id) && id > 0;
  const account = useAccountQuery(valid ? id : null);
  const mutation = useUpdateAccountMutation(id);
  const router = useRouter();

  if (!valid || (account.error instanceof ApiError && account.error.status === 404)) {
    return (
      <Screen narrow testID="account-edit">
        <EmptyState icon="help-circle" title="There's no such account" testID="account-not-found" />
        <TextLink href="/office/accounts" label="All accounts" />
      </Screen>
    );
  }
  return (
    <Screen narrow testID="account-edit">
      <TextLink href={`/office/accounts/${id}`} label="‹ Back to the account" />
      {account.isPending ? (
        <LoadingState label="Loading the account…" />
      ) : account.isError ? (
        <ErrorState error={account.error} onRetry={() => account.refetch()} retrying={account.isFetching} />
      ) : (
        <>
          <PageHeader overline="Edit account" title={account.data.businessName} />
          <AccountForm
            key={account.data.id}
            initial={valuesOf(account.data)}
            submitLabel="Save changes"
            onSubmit={async (input) => {
              const { status: _status, ...patch } = input;
              const saved = await mutation.mutateAsync(patch);
              router.replace(`/office/accounts/${saved.id}`);
            }}
            cancelHref={`/office/accounts/${id}`}
          />
        </>
      )}
    </Screen>
  );
}

interface AccountFormProps {
  initial: Values;
  withStatus?: boolean;
  submitLabel: string;
  /** Sends the checked input; a rejection shows its errors on the form. */
  onSubmit: (input: Values) => Promise<unknown>;
  cancelHref: Href;
}

function AccountForm({ initial, withStatus, submitLabel, onSubmit, cancelHref }: AccountFormProps) {
  const form = useZodForm({ schema: accountInputSchema, initial, fields: FIELDS });
  const { values, errors: fields } = form;
  const submit = () => void form.submit((input) => onSubmit(input as Values));

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
        keyboardType="email-address"
        inputMode="email"
        autoCapitalize="none"
        autoCorrect={false}
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
