import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Link, useRouter } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { useQuery } from "@tanstack/react-query";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { TextField } from "../../ui/TextField";
import { TextLink } from "../../ui/TextLink";
import { Badge } from "../../ui/Badge";
import { FormError, Notice } from "../../ui/FormError";
import { EmptyState, ErrorState, LoadingState } from "../../ui/States";
import { LinkPressable } from "../../ui/LinkPressable";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { ApiError, messageOf } from "../../api/client";
import { usePayoutQuery, usePayoutsQuery, useReconcilePayoutMutation, type PayoutDetailDto, type PayoutDto, type PayoutTransactionDto } from "../../api/payouts";
import { userKeys, usersApi } from "../../api/users";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { payoutStatusLabel } from "../../../shared/billing";
import { useIsWide } from "../../shell/useIsWide";
import { BackLink, BillingTable, Figure, billingStyles, day, money } from "./parts";
import { colors, radii, space } from "../../theme";

/** Fees and refunds take money off: shown with a minus, and zero as zero. */
const minus = (cents: number, currency: string) => (cents ? money(-Math.abs(cents), currency) : money(0, currency));
const arrival = (status: string, date: string) => (status === "paid" ? `Arrived ${day(date)}` : `${payoutStatusLabel(status)} · due ${day(date)}`);

const TXN_TYPE: Record<string, string> = { charge: "Card payment", payment: "Card payment", refund: "Refund", adjustment: "Adjustment", stripe_fee: "Processor fee" };

/** The card processor's payouts to the bank, each to check against Panwise's payments and refunds. */
export function PayoutsScreen() {
  const wide = useIsWide();
  const router = useRouter();
  const payouts = usePayoutsQuery();
  const timeZone = useBakeryTimeZone();
  const open = (p: PayoutDto) => router.push(`/office/money/payouts/${p.id}`);

  return (
    <Screen testID="payouts-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Payouts" subtitle="What the card processor sent to the bank. Open one to match it to invoices and mark it reconciled." testID="payouts-title" />
      {payouts.isPending ? (
        <LoadingState label="Loading payouts…" testID="payouts-loading" />
      ) : payouts.isError ? (
        <ErrorState
          error={payouts.error}
          title={payouts.error instanceof ApiError && payouts.error.code === "payments_unavailable" ? "The card processor can't be reached" : "Payouts didn't load"}
          onRetry={() => payouts.refetch()}
          retrying={payouts.isFetching}
          testID="payouts-error"
        />
      ) : payouts.data.length === 0 ? (
        <EmptyState icon="dollar-sign" title="No payouts yet" message="Card payments are paid out to the bank every few days; each payout shows here." testID="payouts-empty" />
      ) : wide ? (
        <BillingTable<PayoutDto>
          testID="payouts-table"
          rows={payouts.data}
          rowKey={(p) => p.id}
          onRowPress={open}
          rowLabel={(p) => `Payout of ${money(p.amountCents, p.currency)}, ${arrival(p.status, p.arrivalDate)}, ${p.reconciledAt ? "reconciled" : "to reconcile"}`}
          rowTestID={(p) => `payout-row-${p.id}`}
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
        />
      ) : (
        <View style={billingStyles.cards} testID="payouts-list">
          {payouts.data.map((p) => (
            <Link key={p.id} href={`/office/money/payouts/${p.id}`} asChild>
              <LinkPressable accessibilityRole="link" accessibilityLabel={`Payout of ${money(p.amountCents, p.currency)}, arrives ${day(p.arrivalDate)}`} testID={`payout-row-${p.id}`} style={billingStyles.card} highlightStyle={billingStyles.cardHover}>
                <View style={billingStyles.cardText}>
                  <View style={billingStyles.cardTop}>
                    <AppText variant="bodyStrong" style={billingStyles.grow}>
                      {money(p.amountCents, p.currency)}
                    </AppText>
                    {p.reconciledAt ? <Badge label="Reconciled" tone="sage" testID={`payout-reconciled-${p.id}`} /> : <Badge label="To reconcile" tone="amber" testID={`payout-todo-${p.id}`} />}
                  </View>
                  <AppText variant="small" color="muted">{arrival(p.status, p.arrivalDate)}</AppText>
                  <AppText variant="caption" color="muted" numberOfLines={1}>
                    {`Bank reference ${p.id}`}
                  </AppText>
                </View>
                <Feather name="chevron-right" size={20} color={colors.muted} />
              </LinkPressable>
            </Link>
          ))}
        </View>
      )}
    </Screen>
  );
}

/** One payout: its sums, its transactions matched to invoices (problems in red), and reconciling it. */
export function PayoutDetailScreen({ id }: { id: string }) {
  const valid = /^po_[A-Za-z0-9_]+$/.test(id);
  const detail = usePayoutQuery(valid ? id : null);
  const back = <BackLink href="/office/money/payouts" label="All payouts" testID="back-to-payouts" />;

  if (!valid || (detail.isError && detail.error instanceof ApiError && detail.error.status === 404)) {
    return (
      <Screen testID="payout-detail">
        {back}
        <EmptyState icon="help-circle" title="There's no such payout" message="It may have been typed wrong in the address." testID="payout-not-found" />
      </Screen>
    );
  }
  if (detail.isPending) {
    return (
      <Screen testID="payout-detail">
        {back}
        <LoadingState label="Loading the payout…" testID="payout-loading" />
      </Screen>
    );
  }
  if (detail.isError) {
    return (
      <Screen testID="payout-detail">
        {back}
        <ErrorState
          error={detail.error}
          title={detail.error instanceof ApiError && detail.error.code === "payments_unavailable" ? "The card processor can't be reached" : "This payout didn't load"}
          onRetry={() => detail.refetch()}
          retrying={detail.isFetching}
          testID="payout-error"
        />
      </Screen>
    );
  }
  const d = detail.data;
  return (
    <Screen testID="payout-detail">
      {back}
      <PayoutBody detail={d} />
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
                  <TxnRow key={t.balanceTransactionId} t={t} currency={cur} first={i === 0} wide={wide} />
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

/** What a transaction did, in the bookkeeper's words: money received, money refunded, or the processor's own line. */
const AMOUNT_LABEL: Record<string, string> = { charge: "Received", payment: "Received", refund: "Refunded" };

/**
 * One transaction of the payout, led by what the bookkeeper checks against the books: the invoice and its account,
 * the date and the amount received. The processor's fee and what was paid out are lines of their own; the card
 * processor's ids come last, as references.
 */
function TxnRow({ t, currency: cur, first, wide }: { t: PayoutTransactionDto; currency: string; first: boolean; wide: boolean }) {
  const kind = TXN_TYPE[t.type] ?? "Other transaction";
  const refLabel = t.type === "refund" ? "Refund reference" : "Card payment reference";
  const ref = t.type === "refund" ? t.source : t.cardPaymentRef;
  return (
    <View style={[styles.txn, !first && styles.divider, !t.matched && styles.txnAlert, wide && styles.txnWide]} testID={`txn-${t.balanceTransactionId}`}>
      <View style={styles.txnLead}>
        <View style={styles.txnHead}>
          {t.invoiceId && t.invoiceNumber ? (
            <TextLink href={`/office/invoices/${t.invoiceId}`} label={`Invoice ${t.invoiceNumber}`} testID={`txn-invoice-${t.balanceTransactionId}`} />
          ) : (
            <AppText variant="bodyStrong">No invoice found</AppText>
          )}
          {t.matched ? <Badge label="Matched" tone="sage" /> : null}
        </View>
        {t.accountName ? (
          <AppText testID={`txn-account-${t.balanceTransactionId}`}>{t.accountName}</AppText>
        ) : null}
        <AppText variant="small" color={t.matched ? "muted" : "ink"} testID={`txn-date-${t.balanceTransactionId}`}>{`${kind} · ${day(t.date)}`}</AppText>
        {t.matched ? null : (
          <View style={styles.problem}>
            <Feather name="alert-triangle" size={16} color={colors.dangerInk} />
            <AppText variant="small" color="dangerInk" style={styles.flex} testID={`txn-problem-${t.balanceTransactionId}`}>
              {t.problem ?? "Doesn't match Panwise's records."}
            </AppText>
          </View>
        )}
        {ref ? (
          <AppText variant="caption" color={t.matched ? "muted" : "ink"} numberOfLines={1} selectable testID={`txn-ref-${t.balanceTransactionId}`}>
            {`${refLabel} ${ref}`}
          </AppText>
        ) : null}
      </View>
      <View style={[styles.txnSums, wide && styles.txnSumsWide]}>
        <SumLine label={AMOUNT_LABEL[t.type] ?? kind} value={money(t.amountCents, cur)} strong testID={`txn-amount-${t.balanceTransactionId}`} />
        <SumLine label="Processor fee" value={minus(t.feeCents, cur)} testID={`txn-fee-${t.balanceTransactionId}`} />
        <SumLine label="Paid out" value={money(t.netCents, cur)} testID={`txn-net-${t.balanceTransactionId}`} />
      </View>
    </View>
  );
}

function SumLine({ label, value, strong, testID }: { label: string; value: string; strong?: boolean; testID: string }) {
  return (
    <View style={styles.sumLine} testID={testID}>
      <AppText variant={strong ? "bodyStrong" : "small"} color={strong ? "ink" : "muted"} style={styles.flex}>
        {label}
      </AppText>
      <AppText variant={strong ? "bodyStrong" : "small"} color={strong ? "ink" : "muted"} align="right">
        {value}
      </AppText>
    </View>
  );
}

/** "Rosalind Hart" for the owner (who can read the people list), "you", or a neutral stand-in. */
function useStaffName(id: number | null): string {
  const me = useSignedInUser();
  const users = useQuery({ queryKey: userKeys.list({}), queryFn: () => usersApi.list({}), enabled: me.role === "owner" && !!id && id !== me.id });
  if (!id) return "someone in the office";
  if (id === me.id) return `you (${me.name})`;
  return users.data?.find((u) => u.id === id)?.name ?? "another office user";
}

function ReconcileCard({ detail: d }: { detail: PayoutDetailDto }) {
  const mutation = useReconcilePayoutMutation(d.payout.id);
  const timeZone = useBakeryTimeZone();
  const who = useStaffName(d.reconciled?.byId ?? null);
  const [note, setNote] = useState("");
  const [forcing, setForcing] = useState(false);
  const [noteError, setNoteError] = useState<string | null>(null);
  const err = mutation.error;
  const unmatchedRefusal = err instanceof ApiError && err.code === "payout_unmatched";
  const clean = d.unmatched === 0 && d.netMatchesPayout;

  if (d.reconciled) {
    return (
      <Card title="Reconciled" action={<Badge label="Done" tone="sage" />} testID="payout-reconciled">
        <AppText testID="payout-reconciled-by">{`Marked reconciled by ${who} on ${formatDateTime(d.reconciled.at, timeZone)}.`}</AppText>
        {d.reconciled.note ? (
          <AppText color="muted" testID="payout-reconciled-note">
            {`Note: ${d.reconciled.note}`}
          </AppText>
        ) : null}
      </Card>
    );
  }

  const reconcile = (force: boolean) => {
    setNoteError(null);
    if (force && !note.trim()) {
      setNoteError("Say why it is fine although it doesn't match.");
      return;
    }
    mutation.mutate(
      { note: note.trim(), ...(force ? { force: true } : {}) },
      {
        onError: (e) => {
          if (e instanceof ApiError && e.code === "payout_unmatched") setForcing(true);
        },
      },
    );
  };

  return (
    <Card title="Reconcile" testID="payout-reconcile-card">
      <AppText color="muted">
        {clean ? "Every transaction matches an invoice and the net is what the bank received." : "Check the transactions in red first. If they are explained, mark the payout reconciled anyway with a note."}
      </AppText>
      <FormError message={err && !(unmatchedRefusal && forcing) ? messageOf(err) : null} testID="reconcile-error" />
      {forcing ? <FormError message={unmatchedRefusal ? messageOf(err) : "This payout doesn't match Panwise's records."} testID="reconcile-refused" /> : null}
      <TextField
        label="Note"
        optional={!forcing}
        hint={forcing ? "Needed: what explains the difference." : "For the records, e.g. the bank statement line."}
        value={note}
        onChangeText={setNote}
        error={noteError}
        multiline
        maxLength={300}
        testID="reconcile-note"
      />
      <View style={billingStyles.buttons}>
        {forcing ? (
          <>
            <Button label="Mark reconciled anyway" icon="check-square" variant="danger" busy={mutation.isPending} onPress={() => reconcile(true)} testID="reconcile-force" />
            <Button label="Not yet" variant="ghost" onPress={() => { setForcing(false); mutation.reset(); }} testID="reconcile-cancel" />
          </>
        ) : (
          <Button label="Reconcile" icon="check" variant="accent" busy={mutation.isPending} onPress={() => reconcile(false)} testID="reconcile" />
        )}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  txn: { gap: space.xxs, paddingVertical: space.sm, paddingHorizontal: space.sm, borderRadius: radii.sm },
  txnAlert: { backgroundColor: colors.dangerSoft },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  txnWide: { flexDirection: "row", alignItems: "flex-start", gap: space.lg },
  txnLead: { flex: 1, gap: space.xxs },
  txnHead: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.xs },
  txnSums: { gap: space.xxs, marginTop: space.xs },
  txnSumsWide: { width: 220, marginTop: 0 },
  sumLine: { flexDirection: "row", alignItems: "baseline", gap: space.sm },
  problem: { flexDirection: "row", alignItems: "flex-start", gap: space.xs },
});
