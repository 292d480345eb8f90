import React from "react";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { Notice } from "../../ui/FormError";
import { StatusBadge } from "../../ui/Badge";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountQuery } from "../../api/accounts";
import { useBakeryTimeZone } from "../../api/bakery";
import { accountStatusNote } from "./BuyerHome";
import { formatDate } from "../../format";
import { CalendarFeedCard } from "../common/CalendarFeedCard";
import { DeliveryTermsCard } from "./DeliveryTermsCard";
import { TaxCertificatesCard } from "../billing/TaxCertificates";
import { LinkButton } from "../../ui/LinkButton";

/** Everything the bakery has on file for the buyer's account (office notes stay in the office). */
export function BuyerAccountScreen() {
  const user = useSignedInUser();
  const account = useAccountQuery(user.accountId);
  const timeZone = useBakeryTimeZone();

  if (!user.accountId) {
    return (
      <Screen narrow testID="buyer-account">
        <PageHeader title="Account" />
        <EmptyState icon="link" title="No customer account yet" message="Ask the bakery to link your sign-in to your business's account." />
      </Screen>
    );
  }
  return (
    <Screen narrow testID="buyer-account">
      {account.isError ? <PageHeader title="Account" /> : null}
      <QueryStates query={account} loadingLabel="Loading your account…">
        {(a) => (
          <>
            <PageHeader overline="Account" title={a.businessName} />
            {accountStatusNote(a) ? <Notice tone="info" message={accountStatusNote(a) ?? ""} /> : null}
            <Card title="Delivery and billing" action={<StatusBadge status={a.status} creditHold={a.creditHold} />}>
              <DetailList
                items={[
                  { label: "Business", value: a.businessName },
                  { label: "Delivery address", value: a.deliveryAddress },
                  { label: "Contact name", value: a.contactName },
                  { label: "Contact phone", value: a.contactPhone },
                  { label: "Billing e-mail", value: a.billingEmail },
                  { label: "People ordering", value: String(a.buyerCount) },
                  { label: "Customer since", value: formatDate(a.createdAt, timeZone) },
                ]}
              />
            </Card>
            <DeliveryTermsCard accountId={a.id} />
            <TaxCertificatesCard accountId={a.id} canUpload canReview={false} audience="buyer" />
            <CalendarFeedCard />
            <Card title="Profile" testID="buyer-account-you">
              <AppText color="muted">{`Signed in as ${user.name} (${user.email}). Change your password there.`}</AppText>
              <LinkButton href="/buyer/me" label="Your sign-in and password" icon="user" variant="secondary" testID="buyer-account-me" />
            </Card>
            <AppText variant="small" color="muted">
              Something out of date? Tell the bakery and they&apos;ll update it.
            </AppText>
          </>
        )}
      </QueryStates>
    </Screen>
  );
}
