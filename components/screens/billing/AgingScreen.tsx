import type { RoutePath } from "../../routing";
import React from "react";
import { View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Badge } from "../../ui/Badge";
import { DataTable } from "../../ui/DataTable";
import { ListCard, ListCardText, ListCardTitle, ListCardTop, ListCards } from "../../ui/ListCard";
import { QueryStates } from "../../ui/QueryStates";
import { AppText } from "../../ui/Text";
import { useAgingQuery, type AgingDto, type AgingRowDto } from "../../api/reports";
import { useBakeryQuery } from "../../api/bakery";
import { useIsWide } from "../../shell/useIsWide";
import { AGING_BUCKETS, type AgingBucket } from "../../../shared/billing";
import { accountStatusLabel } from "../../../shared/schemas/accounts";
import { BackLink, Figure, SumLine, billingStyles, day, money } from "./parts";

export const BUCKET_LABELS: Record<AgingBucket, string> = {
  current: "Current",
  "1-30": "1–30 days",
  "31-60": "31–60 days",
  "61-90": "61–90 days",
  "90+": "Over 90 days",
};

/** What each account owes, by how long past due: the bookkeeper's chase list. */
export function AgingScreen() {
  const wide = useIsWide();
  const router = useRouter();
  const aging = useAgingQuery();
  const currency = useBakeryQuery().data?.currency ?? "USD";
  const m = (c: number) => money(c, currency);
  const invoicesOf = (a: AgingRowDto): RoutePath => `/office/invoices?accountId=${a.accountId}`;

  const holdLabel = (r: AgingRowDto) => accountStatusLabel({ status: "on_hold", creditHold: r.creditHold });
  const rowLabel = (r: AgingRowDto) => `${r.accountName}${r.onHold ? `, ${holdLabel(r).toLowerCase()}` : ""}: ${m(r.total)} owed`;
  const body = (a: AgingDto) =>
    wide ? (
      <DataTable<AgingRowDto>
        testID="aging-table"
        rows={a.accounts}
        rowKey={(r) => r.accountId}
        onRowPress={(r) => router.push(invoicesOf(r))}
        rowLabel={rowLabel}
        rowTestID={(r) => `aging-row-${r.accountId}`}
        footer
        footerTestID="aging-totals"
        columns={[
          {
            key: "account",
            label: "Account",
            flex: 2,
            render: (r) => (
              <View style={billingStyles.cardTop}>
                <AppText variant="bodyStrong">{r.accountName}</AppText>
                {r.onHold ? <Badge label={holdLabel(r)} tone="amber" testID={`aging-hold-${r.accountId}`} /> : null}
              </View>
            ),
            footer: "Total",
          },
          ...AGING_BUCKETS.map((b) => ({
            key: b,
            label: BUCKET_LABELS[b],
            flex: 1,
            align: "right" as const,
            render: (r: AgingRowDto) => (
              <AppText color={r[b] && b !== "current" ? "dangerInk" : r[b] ? "ink" : "muted"} align="right" testID={`aging-${r.accountId}-${b}`}>
                {r[b] ? m(r[b]) : "–"}
              </AppText>
            ),
            footer: <AppText variant="bodyStrong" align="right" testID={`aging-total-${b}`}>{m(a.totals[b])}</AppText>,
          })),
          { key: "total", label: "Total", flex: 1.1, align: "right", render: (r) => <AppText variant="bodyStrong" align="right" testID={`aging-${r.accountId}-total`}>{m(r.total)}</AppText>, footer: <AppText variant="bodyStrong" align="right" testID="aging-total-total">{m(a.totals.total)}</AppText> },
        ]}
      />
    ) : (
      <>
        <View style={billingStyles.figures} testID="aging-totals">
          {AGING_BUCKETS.map((b) => (
            <Figure key={b} label={BUCKET_LABELS[b]} value={m(a.totals[b])} testID={`aging-total-${b}`} tone={b !== "current" && a.totals[b] > 0 ? "danger" : undefined} />
          ))}
          <Figure label="Total owed" value={m(a.totals.total)} testID="aging-total-total" />
        </View>
        <ListCards testID="aging-list">
          {a.accounts.map((r) => (
            <ListCard key={r.accountId} href={invoicesOf(r)} accessibilityLabel={rowLabel(r)} testID={`aging-row-${r.accountId}`}>
              <ListCardText>
                <ListCardTop>
                  <ListCardTitle>{r.accountName}</ListCardTitle>
                  {r.onHold ? <Badge label={holdLabel(r)} tone="amber" testID={`aging-hold-${r.accountId}`} /> : null}
                </ListCardTop>
                {AGING_BUCKETS.filter((b) => r[b] > 0).map((b) => (
                  <SumLine key={b} label={BUCKET_LABELS[b]} value={m(r[b])} tone={b !== "current" ? "danger" : undefined} testID={`aging-${r.accountId}-${b}`} />
                ))}
                <SumLine label="Total" value={m(r.total)} strong testID={`aging-${r.accountId}-total`} />
              </ListCardText>
            </ListCard>
          ))}
        </ListCards>
      </>
    );

  return (
    <Screen testID="aging-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Aging" subtitle={aging.data ? `What is owed on ${day(aging.data.today)}, by days past the due date. Open an account for its invoices.` : "What is owed, by days past the due date."} testID="aging-title" />
      <QueryStates
        query={aging}
        testID="aging"
        loadingLabel="Loading the aging report…"
        errorTitle="The aging report didn't load"
        isEmpty={(data) => data.accounts.length === 0}
        empty={{ icon: "check-circle", title: "Nothing is owed", message: "Every invoice is paid. Open invoices show here by how long they are past due." }}
      >
        {body}
      </QueryStates>
    </Screen>
  );
}
