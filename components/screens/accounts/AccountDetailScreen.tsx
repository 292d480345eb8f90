import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { LinkButton } from "../../ui/LinkButton";
import { TextLink } from "../../ui/TextLink";
import { NotFoundState, isNotFound } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { StatusBadge } from "../../ui/Badge";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import { type AccountDto } from "../../../shared/schemas/accounts";
import { space } from "../../theme";
import { AccountStatusCard } from "./AccountStatusCard";
import { AccountDeliveryCard } from "./AccountDeliveryCard";
import { CalendarFeedCard } from "../common/CalendarFeedCard";
import { AccountBillingCard } from "../billing/AccountBillingCard";
import { TaxCertificatesCard } from "../billing/TaxCertificates";
import { ContactLink } from "../../ui/ContactLink";
import { useAccountBuyersQuery } from "../../api/accounts";

/** One customer account. The owner can edit it, pause it, close it (after a confirm step) and reopen it. */
export function AccountDetailScreen({ id }: { id: number }) {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const wide = useIsWide();
  const account = useAccountQuery(Number.isInteger(id) && id > 0 ? id : null);
  const timeZone = useBakeryTimeZone();

  if (!Number.isInteger(id) || id <= 0 || (account.isError && isNotFound(account.error))) {
    return (
      <Screen testID="account-detail">
        <NotFoundState title="There's no such account" message="It may have been typed wrong in the address." back={{ href: "/office/accounts", label: "All accounts" }} testID="account-not-found" />
      </Screen>
    );
  }
  return (
    <Screen testID="account-detail">
      <QueryStates query={account} loadingTestID="loading" errorTestID="error" loadingLabel="Loading the account…" errorTitle="This account didn't load">
        {(a) => <AccountBody account={a} isOwner={isOwner} wide={wide} timeZone={timeZone} />}
      </QueryStates>
      {account.isError ? <TextLink href="/office/accounts" label="All accounts" /> : null}
    </Screen>
  );
}

/** Who orders for the account: each buyer by name (an e-mail link), a turned-off sign-in marked as such. */
function BuyerNames({ accountId, count }: { accountId: number; count: number }) {
  const buyers = useAccountBuyersQuery(accountId);
  if (!buyers.data) return <AppText color="muted">{count === 1 ? "1 active buyer" : `${count} active buyers`}</AppText>;
  if (buyers.data.length === 0) return <AppText color="muted" testID="account-buyers">No buyers yet: invite one from People.</AppText>;
  return (
    <View testID="account-buyers">
      {buyers.data.map((b) => (
        <View key={b.id} style={styles.buyer} testID={`account-buyer-${b.id}`}>
          <AppText variant="bodyStrong">{b.disabled ? `${b.name} (sign-in turned off)` : b.name}</AppText>
          <ContactLink kind="email" value={b.email} />
        </View>
      ))}
    </View>
  );
}

function AccountBody({ account: a, isOwner, wide, timeZone }: { account: AccountDto; isOwner: boolean; wide: boolean; timeZone: string | undefined }) {
  return (
    <>
      <TextLink href="/office/accounts" label="‹ All accounts" testID="back-to-accounts" />
      <PageHeader
        overline="Customer account"
        title={a.businessName}
        testID="account-title"
        actions={
          <>
            {a.status === "active" ? <LinkButton href={`/office/accounts/${a.id}/order`} label="Order by phone" icon="phone" variant="accent" testID="phone-order-link" /> : null}
            {isOwner ? <LinkButton href={`/office/accounts/${a.id}/edit`} label="Edit details" icon="edit-2" variant="secondary" testID="edit-account" /> : null}
          </>
        }
      />
      <View style={[styles.grid, wide && styles.gridWide]}>
        <View style={[styles.col, wide && styles.mainCol]}>
          <Card title="Delivery and billing" action={<StatusBadge status={a.status} creditHold={a.creditHold} testID="account-status" />}>
            <DetailList
              items={[
                { label: "Delivery address", value: a.deliveryAddress },
                { label: "Contact name", value: a.contactName },
                { label: "Contact phone", value: <ContactLink kind="phone" value={a.contactPhone} testID="account-contact-phone" /> },
                { label: "Billing e-mail", value: <ContactLink kind="email" value={a.billingEmail} testID="account-billing-email" /> },
                { label: "Buyers", value: <BuyerNames accountId={a.id} count={a.buyerCount} /> },
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
          {isOwner ? <AccountStatusCard account={a} /> : null}
          {isOwner ? <CalendarFeedCard accountId={a.id} /> : null}
        </View>
      </View>
    </>
  );
}

const styles = StyleSheet.create({
  buyer: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", columnGap: space.sm },
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "flex-start" },
  col: { gap: space.lg },
  mainCol: { flex: 2 },
  sideCol: { flex: 1 },
});
