import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { Button } from "../../ui/Button";
import { LinkButton } from "../../ui/LinkButton";
import { TextLink } from "../../ui/TextLink";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { StatusBadge } from "../../ui/Badge";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery, useUpdateAccountMutation } from "../../api/accounts";
import { ApiError, messageOf } from "../../api/client";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import { ACCOUNT_STATUS_LABELS, type AccountDto, type AccountStatus } from "../../../shared/schemas/accounts";
import { colors, radii, space } from "../../theme";
import { AccountDeliveryCard } from "./AccountDeliveryCard";
import { CalendarFeedCard } from "../common/CalendarFeedCard";
import { AccountBillingCard } from "../billing/AccountBillingCard";
import { TaxCertificatesCard } from "../billing/TaxCertificates";

/** One customer account. The owner can edit it, pause it, close it (after a confirm step) and reopen it. */
export function AccountDetailScreen({ id }: { id: number }) {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const wide = useIsWide();
  const account = useAccountQuery(Number.isInteger(id) && id > 0 ? id : null);
  const timeZone = useBakeryTimeZone();

  if (!Number.isInteger(id) || id <= 0 || (account.isError && account.error instanceof ApiError && account.error.status === 404)) {
    return (
      <Screen testID="account-detail">
        <EmptyState icon="help-circle" title="There's no such account" message="It may have been typed wrong in the address." testID="account-not-found" />
        <TextLink href="/office/accounts" label="All accounts" />
      </Screen>
    );
  }
  if (account.isPending) {
    return (
      <Screen testID="account-detail">
        <LoadingState label="Loading the account…" />
      </Screen>
    );
  }
  if (account.isError) {
    return (
      <Screen testID="account-detail">
        <ErrorState error={account.error} title="This account didn't load" onRetry={() => account.refetch()} retrying={account.isFetching} />
        <TextLink href="/office/accounts" label="All accounts" />
      </Screen>
    );
  }

  const a = account.data;
  return (
    <Screen testID="account-detail">
      <TextLink href="/office/accounts" label="‹ All accounts" testID="back-to-accounts" />
      <PageHeader
        overline="Customer account"
        title={a.businessName}
        testID="account-title"
        actions={isOwner ? <LinkButton href={`/office/accounts/${a.id}/edit`} label="Edit details" icon="edit-2" variant="secondary" testID="edit-account" /> : null}
      />
      <View style={[styles.grid, wide && styles.gridWide]}>
        <View style={[styles.col, wide && styles.mainCol]}>
          <Card title="Delivery and billing" action={<StatusBadge status={a.status} creditHold={a.creditHold} testID="account-status" />}>
            <DetailList
              items={[
                { label: "Delivery address", value: a.deliveryAddress },
                { label: "Contact name", value: a.contactName },
                { label: "Contact phone", value: a.contactPhone },
                { label: "Billing e-mail", value: a.billingEmail, testID: "account-billing-email" },
                { label: "Buyers", value: a.buyerCount === 1 ? "1 active buyer" : `${a.buyerCount} active buyers` },
                { label: "Added", value: formatDateTime(a.createdAt, timeZone) },
                { label: "Last changed", value: formatDateTime(a.updatedAt, timeZone) },
              ]}
            />
          </Card>
          <Card title="Office notes">
            <AppText color={a.notes ? "ink" : "muted"} selectable>
              {a.notes || "No notes yet."}
            </AppText>
          </Card>
          <AccountDeliveryCard accountId={a.id} editable={isOwner} />
        </View>
        <View style={[styles.col, wide && styles.sideCol]}>
          <AccountBillingCard accountId={a.id} canChangeTerms={isOwner} currentTerms={a.paymentTerms} />
          <TaxCertificatesCard accountId={a.id} canUpload={isOwner} canReview={isOwner} audience="office" />
          {isOwner ? <StatusCard account={a} /> : null}
          {isOwner ? <CalendarFeedCard accountId={a.id} /> : null}
        </View>
      </View>
    </Screen>
  );
}

const STATUS_HELP: Record<AccountStatus, string> = {
  active: "This account is open for orders.",
  on_hold: "Paused: the account stays on file, but the bakery has paused its orders by hand.",
  closed: "Closed: kept for the records only. Buyers can't be invited to it while it's closed.",
};

function StatusCard({ account }: { account: AccountDto }) {
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
      <AppText color="muted">{STATUS_HELP[account.status]}</AppText>
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
                <Button label="Make active" icon="play" variant="accent" busy={mutation.isPending} onPress={() => setStatus("active")} testID="activate-account" />
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
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "flex-start" },
  col: { gap: space.lg },
  mainCol: { flex: 2 },
  sideCol: { flex: 1 },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.dangerSoft },
});
