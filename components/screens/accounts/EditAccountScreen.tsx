import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { TextLink } from "../../ui/TextLink";
import { NotFoundState, isNotFound } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { useAccountQuery, useUpdateAccountMutation } from "../../api/accounts";
import { AccountForm, accountValues } from "./AccountForm";

/** Edit an account's details (owner). Status changes live on the account's page. */
export function EditAccountScreen({ id }: { id: number }) {
  const valid = Number.isInteger(id) && id > 0;
  const account = useAccountQuery(valid ? id : null);
  const mutation = useUpdateAccountMutation(id);
  const router = useRouter();

  if (!valid || isNotFound(account.error)) {
    return (
      <Screen narrow testID="account-edit">
        <NotFoundState title="There's no such account" back={{ href: "/office/accounts", label: "All accounts" }} testID="account-not-found" />
      </Screen>
    );
  }
  return (
    <Screen narrow testID="account-edit">
      <TextLink href={`/office/accounts/${id}`} label="‹ Back to the account" />
      <QueryStates query={account} loadingTestID="loading" errorTestID="error" loadingLabel="Loading the account…">
        {(data) => (
          <>
            <PageHeader overline="Edit account" title={data.businessName} />
            <AccountForm
              key={data.id}
              initial={accountValues(data)}
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
      </QueryStates>
    </Screen>
  );
}
