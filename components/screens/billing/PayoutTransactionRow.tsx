import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { Badge } from "../../ui/Badge";
import { TextLink } from "../../ui/TextLink";
import { AppText } from "../../ui/Text";
import type { PayoutTransactionDto } from "../../api/payouts";
import { day, money } from "./parts";
import { AMOUNT_LABEL, TXN_TYPE, minus } from "./payoutText";
import { colors, radii, space } from "../../theme";

/**
 * One transaction of the payout, led by what the bookkeeper checks against the books: the invoice and its account,
 * the date and the amount received. The processor's fee and what was paid out are lines of their own; the card
 * processor's ids come last, as references.
 */
export function PayoutTransactionRow({ t, currency: cur, first, wide }: { t: PayoutTransactionDto; currency: string; first: boolean; wide: boolean }) {
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
