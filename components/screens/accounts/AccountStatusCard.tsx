import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useUpdateAccountMutation } from "../../api/accounts";
import { messageOf } from "../../api/client";
import { ACCOUNT_STATUS_LABELS, type AccountDto, type AccountStatus } from "../../../shared/schemas/accounts";
import { colors, radii, space } from "../../theme";

const STATUS_HELP: Record<AccountStatus, string> = {
  active: "This account is open for orders.",
  on_hold: "Paused (by hand): the bakery has paused this account's orders. It stays paused until someone makes it active again.",
  closed: "Closed: kept for the records only. Buyers can't be invited to it while it's closed.",
};

/** A hold the overdue invoices set: automatic (billing settings' days overdue), lifted by paying — a different state from a pause. */
const CREDIT_HOLD_HELP =
  "Credit hold (automatic): invoices overdue longer than the billing settings allow put the account on hold, and paying them lifts it at once. You can lift it now instead.";

/** The owner pauses, closes (after a confirm step) or reopens an account. */
export function AccountStatusCard({ account }: { account: AccountDto }) {
  const mutation = useUpdateAccountMutation(account.id);
  const [confirmingClose, setConfirmingClose] = useState(false);
  const [done, setDone] = useState<string | null>(null);

  const setStatus = (status: AccountStatus) => {
    setDone(null);
    mutation.mutate(
      { status },
      {
        onSuccess: (saved) => {
          setConfirmingClose(false);
          setDone(`${saved.businessName} is now ${ACCOUNT_STATUS_LABELS[saved.status].toLowerCase()}.`);
        },
      },
    );
  };

  return (
    <Card title="Status" testID="account-status-card">
      <AppText color="muted" testID="account-status-help">
        {account.status === "on_hold" && account.creditHold ? CREDIT_HOLD_HELP : STATUS_HELP[account.status]}
      </AppText>
      {done ? <Notice message={done} testID="account-status-done" /> : null}
      <FormError message={mutation.isError ? messageOf(mutation.error) : null} testID="account-status-error" />
      {confirmingClose ? (
        <View style={styles.confirm} testID="close-confirm">
          <AppText variant="bodyStrong" color="dangerInk">
            {`Close ${account.businessName}?`}
          </AppText>
          <AppText color="ink">The account and its history stay on file. You can reopen it later.</AppText>
          <View style={styles.buttons}>
            <Button label="Yes, close account" variant="danger" busy={mutation.isPending} onPress={() => setStatus("closed")} testID="close-account-confirm" />
            <Button label="Keep it open" variant="secondary" onPress={() => setConfirmingClose(false)} testID="close-account-cancel" />
          </View>
        </View>
      ) : (
        <View style={styles.buttons}>
          {account.status === "closed" ? (
            <Button label="Reopen account" icon="rotate-ccw" variant="accent" busy={mutation.isPending} onPress={() => setStatus("active")} testID="reopen-account" />
          ) : (
            <>
              {account.status === "active" ? (
                <Button label="Pause account" icon="pause" variant="secondary" busy={mutation.isPending} onPress={() => setStatus("on_hold")} testID="hold-account" />
              ) : (
                <Button label={account.creditHold ? "Lift credit hold" : "Make active"} icon="play" variant="accent" busy={mutation.isPending} onPress={() => setStatus("active")} testID="activate-account" />
              )}
              <Button label="Close account" icon="x-circle" variant="ghost" onPress={() => { setDone(null); setConfirmingClose(true); }} testID="close-account" />
            </>
          )}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
});
