import React from "react";
import { View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { ApiError } from "../../api/client";
import { usePayoutQuery, type PayoutDetailDto } from "../../api/payouts";
import { useIsWide } from "../../shell/useIsWide";
import { BackLink, Figure, billingStyles, money } from "./parts";
import { arrival, minus } from "./payoutText";
import { PayoutTransactionRow } from "./PayoutTransactionRow";
import { ReconcileCard } from "./ReconcileCard";

/** One payout: its sums, its transactions matched to invoices (problems in red), and reconciling it. */
export function PayoutDetailScreen({ id }: { id: string }) {
  const valid = /^po_[A-Za-z0-9_]+$/.test(id);
  const detail = usePayoutQuery(valid ? id : null);
  const notFound = !valid || (detail.isError && detail.error instanceof ApiError && detail.error.status === 404);
  const unreachable = detail.error instanceof ApiError && detail.error.code === "payments_unavailable";

  return (
    <Screen testID="payout-detail">
      <BackLink href="/office/money/payouts" label="All payouts" testID="back-to-payouts" />
      {notFound ? (
        <EmptyState icon="help-circle" title="There's no such payout" message="It may have been typed wrong in the address." testID="payout-not-found" />
      ) : (
        <QueryStates query={detail} testID="payout" loadingLabel="Loading the payout…" errorTitle={unreachable ? "The card processor can't be reached" : "This payout didn't load"}>
          {(d) => <PayoutBody detail={d} />}
        </QueryStates>
      )}
    </Screen>
  );
}

function PayoutBody({ detail: d }: { detail: PayoutDetailDto }) {
  const wide = useIsWide();
  const cur = d.payout.currency;
  return (
    <>
      <PageHeader overline="Payout" title={money(d.payout.amountCents, cur)} subtitle={`${arrival(d.payout.status, d.payout.arrivalDate)} · Bank reference ${d.payout.id}`} testID="payout-title" />
      <View style={billingStyles.figures} testID="payout-sums">
        <Figure label="Card payments (gross)" value={money(d.grossCents, cur)} testID="payout-gross" />
        <Figure label="Processor fees" value={minus(d.feesCents, cur)} testID="payout-fees" />
        <Figure label="Refunds" value={minus(d.refundsCents, cur)} testID="payout-refunds" />
        <Figure label="Net" value={money(d.netCents, cur)} testID="payout-net" tone={d.netMatchesPayout ? undefined : "danger"} />
      </View>
      {d.netMatchesPayout ? (
        <Notice message={`The net of its transactions, ${money(d.netCents, cur)}, is what the bank received.`} testID="payout-net-ok" />
      ) : (
        <FormError message={`The net of its transactions (${money(d.netCents, cur)}) differs from the payout (${money(d.payout.amountCents, cur)}).`} testID="payout-net-mismatch" />
      )}
      {d.unmatched > 0 && d.reconciled ? (
        <Notice tone="info" message={d.unmatched === 1 ? "1 transaction didn't match Panwise's records; the payout was marked reconciled anyway (see the note)." : `${d.unmatched} transactions didn't match Panwise's records; the payout was marked reconciled anyway (see the note).`} testID="payout-unmatched" />
      ) : d.unmatched > 0 ? (
        <FormError message={d.unmatched === 1 ? "1 transaction doesn't match Panwise's records. It is marked in red below." : `${d.unmatched} transactions don't match Panwise's records. They are marked in red below.`} testID="payout-unmatched" />
      ) : null}
      <View style={[billingStyles.grid, wide && billingStyles.gridWide]}>
        <View style={[billingStyles.col, wide && billingStyles.mainCol]}>
          <Card title="Transactions" testID="payout-transactions">
            {d.transactions.length === 0 ? (
              <AppText color="muted">This payout has no transactions.</AppText>
            ) : (
              <View>
                {d.transactions.map((t, i) => (
                  <PayoutTransactionRow key={t.balanceTransactionId} t={t} currency={cur} first={i === 0} wide={wide} />
                ))}
              </View>
            )}
          </Card>
        </View>
        <View style={[billingStyles.col, wide && billingStyles.sideCol]}>
          <ReconcileCard detail={d} />
        </View>
      </View>
    </>
  );
}
