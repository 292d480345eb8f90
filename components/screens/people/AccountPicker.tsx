import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { TextField } from "../../ui/TextField";
import { ErrorState, LoadingState } from "../../ui/States";
import { AppText } from "../../ui/Text";
import { useAccountsQuery } from "../../api/accounts";
import { space } from "../../theme";
import { accountStatusLabel } from "../../../shared/schemas/accounts";

export interface AccountPickerProps {
  value: number | null;
  onChange: (id: number) => void;
  error?: string | null;
  testID?: string;
}

/** Choose the customer account a buyer orders for (closed accounts can't take buyers). */
export function AccountPicker({ value, onChange, error, testID = "account-picker" }: AccountPickerProps) {
  const accounts = useAccountsQuery({});
  const [filter, setFilter] = useState("");

  if (accounts.isPending) return <LoadingState label="Loading accounts…" />;
  if (accounts.isError) return <ErrorState error={accounts.error} title="Accounts didn't load" onRetry={() => accounts.refetch()} retrying={accounts.isFetching} />;

  const open = accounts.data.filter((a) => a.status !== "closed");
  if (open.length === 0) {
    return (
      <View style={styles.wrap} testID={testID}>
        <AppText variant="label">Customer account</AppText>
        <AppText color="muted">There are no open customer accounts yet. Add the account first, then invite its buyer.</AppText>
        {error ? (
          <AppText variant="small" color="dangerInk" testID={`${testID}-error`}>
            {error}
          </AppText>
        ) : null}
      </View>
    );
  }
  const f = filter.trim().toLowerCase();
  const shown = f ? open.filter((a) => a.businessName.toLowerCase().includes(f) || a.id === value) : open;

  return (
    <View style={styles.wrap}>
      {open.length > 6 ? <TextField label="Find an account" value={filter} onChangeText={setFilter} testID={`${testID}-filter`} autoCapitalize="none" /> : null}
      <ChoiceGroup<string>
        label="Customer account"
        layout="list"
        testID={testID}
        value={value ? String(value) : null}
        onChange={(v) => onChange(Number(v))}
        error={error}
        choices={shown.map((a) => ({
          value: String(a.id),
          label: a.businessName,
          hint: a.status === "active" ? a.deliveryAddress : `${accountStatusLabel(a)} · ${a.deliveryAddress}`,
        }))}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
});
