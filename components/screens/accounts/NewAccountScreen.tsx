import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { useCreateAccountMutation } from "../../api/accounts";
import { AccountForm, EMPTY_ACCOUNT } from "./AccountForm";

/** New account (owner). */
export function NewAccountScreen() {
  const mutation = useCreateAccountMutation();
  const router = useRouter();
  return (
    <Screen narrow testID="account-new">
      <TextLink href="/office/accounts" label="‹ All accounts" />
      <PageHeader title="New account" subtitle="A café, restaurant or shop that orders from the bakery." />
      <AccountForm
        initial={EMPTY_ACCOUNT}
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
