import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { TextField } from "../../ui/TextField";
import { FieldFrame } from "../../ui/Field";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { useAccountsQuery } from "../../api/accounts";
import { space } from "../../theme";
import { accountStatusLabel, type AccountDto } from "../../../shared/schemas/accounts";

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

  return (
    <QueryStates query={accounts} loadingTestID="loading" errorTestID="error" loadingLabel="Loading accounts…" errorTitle="Accounts didn't load">
      {(all) => {
        const open = all.filter((a) => a.status !== "closed");
        if (open.length === 0) {
          return (
            <View testID={testID}>
              <FieldFrame label="Customer account" error={error} testID={testID}>
                <AppText color="muted">There are no open customer accounts yet. Add the account first, then invite its buyer.</AppText>
              </FieldFrame>
            </View>
          );
        }
        return <AccountChoices open={open} value={value} onChange={onChange} error={error} testID={testID} filter={filter} onFilter={setFilter} />;
      }}
    </QueryStates>
  );
}

interface AccountChoicesProps extends AccountPickerProps {
  testID: string;
  /** The accounts that can take a buyer. */
  open: AccountDto[];
  filter: string;
  onFilter: (text: string) => void;
}

/** The open accounts to choose from, with a filter when there are many. */
function AccountChoices({ open, value, onChange, error, testID, filter, onFilter }: AccountChoicesProps) {
  const f = filter.trim().toLowerCase();
  const shown = f ? open.filter((a) => a.businessName.toLowerCase().includes(f) || a.id === value) : open;

  return (
    <View style={styles.wrap}>
      {open.length > 6 ? <TextField label="Find an account" value={filter} onChangeText={onFilter} testID={`${testID}-filter`} autoCapitalize="none" /> : null}
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
