import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { SEARCH_INPUT, TextField } from "../../ui/TextField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { QueryStates } from "../../ui/QueryStates";
import { TitleCell } from "../../ui/DataTable";
import { TableOrCards } from "../../ui/TableOrCards";
import { StatusBadge } from "../../ui/Badge";
import { LinkButton } from "../../ui/LinkButton";
import { ListCardText, ListCardTitle, ListCardTop } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { useSignedInUser } from "../../auth/useAuth";
import { useAccountsQuery } from "../../api/accounts";
import { useDebounced } from "../../forms/useDebounced";
import { useIsWide } from "../../shell/useIsWide";
import { ACCOUNT_STATUS_LABELS, ACCOUNT_STATUSES, accountStatusLabel, type AccountDto, type AccountStatus } from "../../../shared/schemas/accounts";
import { space } from "../../theme";

type StatusFilter = AccountStatus | "all";

const FILTERS: { value: StatusFilter; label: string }[] = [
  { value: "all", label: "All" },
  ...ACCOUNT_STATUSES.map((s) => ({ value: s, label: ACCOUNT_STATUS_LABELS[s] })),
];

const buyersLabel = (n: number) => (n === 1 ? "1 buyer" : `${n} buyers`);

/** Customer accounts: search, filter by status, open one. The owner can add accounts. */
export function AccountsListScreen() {
  const user = useSignedInUser();
  const isOwner = user.role === "owner";
  const wide = useIsWide();
  const router = useRouter();
  const [q, setQ] = useState("");
  const [status, setStatus] = useState<StatusFilter>("all");
  const search = useDebounced(q.trim());
  const accounts = useAccountsQuery({ q: search || undefined, status: status === "all" ? undefined : status });
  const filtered = !!search || status !== "all";
  const open = (a: AccountDto) => router.push(`/office/accounts/${a.id}`);

  return (
    <Screen testID="accounts-screen">
      <PageHeader
        title="Accounts"
        subtitle="The cafés, restaurants and shops that order from the bakery."
        actions={isOwner ? <LinkButton href="/office/accounts/new" label="New account" icon="plus" testID="new-account" /> : null}
      />
      <View style={[styles.filters, wide && styles.filtersWide]}>
        <View style={wide ? styles.searchWide : undefined}>
          <TextField
            label="Search accounts"
            placeholder="Business, contact, e-mail or address"
            value={q}
            onChangeText={setQ}
            testID="accounts-search"
            {...SEARCH_INPUT}
          />
        </View>
        <ChoiceGroup label="Status" choices={FILTERS} value={status} onChange={setStatus} testID="accounts-status" />
      </View>

      <QueryStates
        query={accounts}
        testID="accounts"
        loadingTestID="loading"
        loadingLabel="Loading accounts…"
        errorTitle="Accounts didn't load"
        empty={
          filtered
            ? { icon: "search", title: "No accounts match", message: "Try other words, or show all statuses." }
            : {
                icon: "briefcase",
                title: "No customer accounts yet",
                message: isOwner ? "Add the first café, restaurant or shop that orders from you." : "The owner hasn't added any accounts yet.",
                action: isOwner ? <LinkButton href="/office/accounts/new" label="New account" icon="plus" /> : undefined,
              }
        }
      >
        {(rows) => (
          <TableOrCards
            rows={rows}
            rowKey={(a) => a.id}
            onOpen={open}
            rowLabel={(a) => `${a.businessName}, ${accountStatusLabel(a)}`}
            rowTestID={(a) => `account-row-${a.id}`}
            tableTestID="accounts-table"
            columns={[
              { key: "business", label: "Business", flex: 2.2, render: (a) => <TitleCell title={a.businessName} detail={a.deliveryAddress} oneLine /> },
              { key: "contact", label: "Contact", flex: 1.4, render: (a) => <AppText numberOfLines={1}>{a.contactName || "—"}</AppText> },
              { key: "billing", label: "Billing e-mail", flex: 1.8, render: (a) => <AppText numberOfLines={1}>{a.billingEmail}</AppText> },
              { key: "buyers", label: "Buyers", flex: 0.8, render: (a) => <AppText>{String(a.buyerCount)}</AppText> },
              { key: "status", label: "Status", flex: 0.9, render: (a) => <StatusBadge status={a.status} creditHold={a.creditHold} /> },
            ]}
            cardsTestID="accounts-list"
            card={(a) => (
              <ListCardText>
                <ListCardTop>
                  <ListCardTitle>{a.businessName}</ListCardTitle>
                  <StatusBadge status={a.status} creditHold={a.creditHold} />
                </ListCardTop>
                <AppText variant="small" color="muted" numberOfLines={2}>
                  {a.deliveryAddress}
                </AppText>
                <AppText variant="small" color="muted">
                  {[a.contactName, buyersLabel(a.buyerCount)].filter(Boolean).join(" · ")}
                </AppText>
              </ListCardText>
            )}
          />
        )}
      </QueryStates>
      {accounts.data && accounts.data.length > 0 ? (
        <AppText variant="small" color="muted" testID="accounts-count">
          {accounts.data.length === 1 ? "1 account" : `${accounts.data.length} accounts`}
        </AppText>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.md },
  filtersWide: { flexDirection: "row", alignItems: "flex-end", gap: space.xl },
  searchWide: { flex: 1, maxWidth: 420 },
});
