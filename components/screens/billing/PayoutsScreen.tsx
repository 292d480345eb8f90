import React from "react";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Badge } from "../../ui/Badge";
import { TableOrCards } from "../../ui/TableOrCards";
import { ListCardText, ListCardTitle, ListCardTop } from "../../ui/ListCard";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { ApiError } from "../../api/client";
import { usePayoutsQuery, type PayoutDto } from "../../api/payouts";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { payoutStatusLabel } from "../../../shared/billing";
import { BackLink, day, money } from "./parts";
import { arrival } from "./payoutText";

/** The card processor's payouts to the bank, each to check against Panwise's payments and refunds. */
export function PayoutsScreen() {
  const router = useRouter();
  const payouts = usePayoutsQuery();
  const timeZone = useBakeryTimeZone();
  const open = (p: PayoutDto) => router.push(`/office/money/payouts/${p.id}`);
  const unreachable = payouts.error instanceof ApiError && payouts.error.code === "payments_unavailable";

  return (
    <Screen testID="payouts-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Payouts" subtitle="What the card processor sent to the bank. Open one to match it to invoices and mark it reconciled." testID="payouts-title" />
      <QueryStates
        query={payouts}
        testID="payouts"
        loadingLabel="Loading payouts…"
        errorTitle={unreachable ? "The card processor can't be reached" : "Payouts didn't load"}
        empty={{ icon: "dollar-sign", title: "No payouts yet", message: "Card payments are paid out to the bank every few days; each payout shows here." }}
      >
        {(rows) => (
          <TableOrCards
            rows={rows}
            rowKey={(p) => p.id}
            onOpen={open}
            rowLabel={(p) => `Payout of ${money(p.amountCents, p.currency)}, ${arrival(p.status, p.arrivalDate)}, ${p.reconciledAt ? "reconciled" : "to reconcile"}`}
            rowTestID={(p) => `payout-row-${p.id}`}
            tableTestID="payouts-table"
            columns={[
              { key: "arrival", label: "Arrival", flex: 1, render: (p) => day(p.arrivalDate) },
              { key: "id", label: "Bank reference", flex: 1.6, render: (p) => <AppText variant="small" color="muted" selectable>{p.id}</AppText> },
              { key: "status", label: "Status", flex: 0.9, render: (p) => <Badge label={payoutStatusLabel(p.status)} tone={p.status === "failed" ? "danger" : "neutral"} /> },
              { key: "amount", label: "Amount", flex: 1, align: "right", render: (p) => <AppText variant="bodyStrong" align="right">{money(p.amountCents, p.currency)}</AppText> },
              {
                key: "rec",
                label: "Reconciled",
                flex: 1.3,
                render: (p) => (p.reconciledAt ? <Badge label={`Reconciled ${formatDateTime(p.reconciledAt, timeZone)}`} tone="sage" testID={`payout-reconciled-${p.id}`} /> : <Badge label="To reconcile" tone="amber" testID={`payout-todo-${p.id}`} />),
              },
            ]}
            cardsTestID="payouts-list"
            cardHref={(p) => `/office/money/payouts/${p.id}`}
            cardLabel={(p) => `Payout of ${money(p.amountCents, p.currency)}, arrives ${day(p.arrivalDate)}`}
            card={(p) => (
              <ListCardText>
                <ListCardTop>
                  <ListCardTitle>{money(p.amountCents, p.currency)}</ListCardTitle>
                  {p.reconciledAt ? <Badge label="Reconciled" tone="sage" testID={`payout-reconciled-${p.id}`} /> : <Badge label="To reconcile" tone="amber" testID={`payout-todo-${p.id}`} />}
                </ListCardTop>
                <AppText variant="small" color="muted">{arrival(p.status, p.arrivalDate)}</AppText>
                <AppText variant="caption" color="muted" numberOfLines={1}>
                  {`Bank reference ${p.id}`}
                </AppText>
              </ListCardText>
            )}
          />
        )}
      </QueryStates>
    </Screen>
  );
}
