import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { Notice } from "../../ui/FormError";
import { StatusBadge } from "../../ui/Badge";
import { LinkButton } from "../../ui/LinkButton";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryQuery } from "../../api/bakery";
import { BakeryContactCard } from "../common/BakeryContactCard";
import { firstName, formatBakeDay } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import type { AccountDto } from "../../../shared/schemas/accounts";
import { space } from "../../theme";

export function accountStatusNote(account: AccountDto): string | null {
  if (account.status === "on_hold") return "This account is on hold. Please contact the bakery before planning new orders.";
  if (account.status === "closed") return "This account is closed. Contact the bakery if you'd like to order again.";
  return null;
}

/** A café buyer's home: their account at a glance and how to reach the bakery. */
export function BuyerHome() {
  const user = useSignedInUser();
  const wide = useIsWide();
  const account = useAccountQuery(user.accountId);
  const bakery = useBakeryQuery();

  if (!user.accountId) {
    return (
      <Screen testID="buyer-home">
        <PageHeader overline="Café ordering" title={`Hello, ${firstName(user.name)}`} testID="buyer-home-title" />
        <EmptyState
          icon="link"
          title="Your sign-in isn't linked to a customer account"
          message="Ask the bakery to link you to your café's account."
          testID="buyer-no-account"
        />
        <BakeryContactCard />
      </Screen>
    );
  }

  if (account.isPending) {
    return (
      <Screen testID="buyer-home">
        <LoadingState label="Loading your account…" />
      </Screen>
    );
  }
  if (account.isError) {
    return (
      <Screen testID="buyer-home">
        <PageHeader overline="Café ordering" title={`Hello, ${firstName(user.name)}`} />
        <ErrorState error={account.error} title="Your account didn't load" onRetry={() => account.refetch()} retrying={account.isFetching} />
      </Screen>
    );
  }

  const a = account.data;
  const note = accountStatusNote(a);
  const subtitle = bakery.data ? `Ordering from ${bakery.data.name} · ${formatBakeDay(bakery.data.today, bakery.data.now, bakery.data.timeZone)}` : `Welcome back, ${firstName(user.name)}`;

  return (
    <Screen testID="buyer-home">
      <PageHeader overline="Café ordering" title={a.businessName} subtitle={subtitle} testID="buyer-home-title" />
      {note ? <Notice tone="info" message={note} testID="buyer-status-note" /> : null}
      <View style={[styles.grid, wide && styles.gridWide]}>
        <Card title="Your account" action={<StatusBadge status={a.status} testID="buyer-account-status" />} style={styles.cell}>
          <DetailList
            items={[
              { label: "Deliver to", value: a.deliveryAddress, testID: "buyer-delivery-address" },
              { label: "Contact", value: [a.contactName, a.contactPhone].filter(Boolean).join(" · ") },
              { label: "Invoices go to", value: a.billingEmail },
            ]}
          />
          <LinkButton href="/buyer/account" label="All account details" variant="secondary" icon="arrow-right" />
        </Card>
        <View style={styles.cell}>
          <BakeryContactCard />
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "flex-start" },
  cell: { flex: 1 },
});
