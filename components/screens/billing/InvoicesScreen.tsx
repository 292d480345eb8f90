import React, { useState } from "react";
import type { Href } from "expo-router";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { SEARCH_INPUT, TextField } from "../../ui/TextField";
import { DateField } from "../../ui/DateField";
import { ChoiceGroup } from "../../ui/ChoiceGroup";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { LoadingState } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { DataTable, TitleCell } from "../../ui/DataTable";
import { ListCard, ListCardText, ListCardTitle, ListCardTop, ListCards } from "../../ui/ListCard";
import { AppText } from "../../ui/Text";
import { useAccountsQuery } from "../../api/accounts";
import { useInvoicesQuery, useIssueStatementsMutation, useRemindAllOverdueMutation, type InvoiceDto, type InvoiceListParams, type InvoiceSort, type InvoiceStatus, type InvoiceTotalsDto } from "../../api/invoices";
import { messageOf } from "../../api/client";
import { useDebounced } from "../../forms/useDebounced";
import { cleanDate } from "../../ordering/dates";
import { useIsWide } from "../../shell/useIsWide";
import { Figure, INVOICE_STATUS_LABELS, InvoiceStatusBadge, billingStyles, day, money } from "./parts";
import { Badge } from "../../ui/Badge";
import { space } from "../../theme";

type Show = "all" | InvoiceStatus | "overdue";

const OFFICE_SHOW: { value: Show; label: string }[] = [
  { value: "all", label: "All" },
  { value: "open", label: "Open" },
  { value: "overdue", label: "Overdue" },
  { value: "paid", label: "Paid" },
  { value: "partially_refunded", label: "Part refunded" },
  { value: "refunded", label: "Refunded" },
  { value: "void", label: "Void" },
];
const BUYER_SHOW: { value: Show; label: string }[] = [
  { value: "all", label: "All" },
  { value: "open", label: "To pay" },
  { value: "overdue", label: "Overdue" },
  { value: "paid", label: "Paid" },
];
const SORTS: { value: InvoiceSort; label: string }[] = [
  { value: "newest", label: "Newest" },
  { value: "oldest", label: "Oldest" },
  { value: "due", label: "Due date" },
  { value: "amount", label: "Amount" },
  { value: "account", label: "Account" },
];

export const invoicesLabel = (n: number) => (n === 1 ? "1 invoice" : `${n} invoices`);

export interface InvoicesScreenProps {
  /** Office (owner, bookkeeper): every account, all filters, statements. Buyer: their own invoices. */
  mode: "office" | "buyer";
  /** Start filtered to one account (from the account's page). */
  accountId?: number;
  /** Start on one "Show" filter (?show=overdue from the credit-hold banner). */
  show?: string;
}

/** The invoices list: filters, search and sort; a table with a totals row from 1024 px, cards on a phone. */
export function InvoicesScreen({ mode, accountId: startAccount, show: startShow }: InvoicesScreenProps) {
  const wide = useIsWide();
  const router = useRouter();
  const office = mode === "office";
  const [q, setQ] = useState("");
  const [show, setShow] = useState<Show>(() => ((office ? OFFICE_SHOW : BUYER_SHOW).some((o) => o.value === startShow) ? (startShow as Show) : "all"));
  const [accountId, setAccountId] = useState<number | null>(startAccount && startAccount > 0 ? startAccount : null);
  const [fromText, setFromText] = useState("");
  const [toText, setToText] = useState("");
  const [sort, setSort] = useState<InvoiceSort>("newest");
  const [moreFilters, setMoreFilters] = useState(!!startAccount);
  const search = useDebounced(q.trim());
  const from = useDebounced(fromText.trim());
  const to = useDebounced(toText.trim());
  const fromError = from && !cleanDate(from) ? "Write the date as YYYY-MM-DD." : null;
  const toError = to && !cleanDate(to) ? "Write the date as YYYY-MM-DD." : null;
  const rangeError = !fromError && !toError && from && to && from > to ? "The end is before the start." : null;

  const params: InvoiceListParams = {
    q: search || undefined,
    status: show === "all" || show === "overdue" ? undefined : show,
    overdue: show === "overdue" || undefined,
    accountId: office && accountId ? accountId : undefined,
    from: from && !fromError && !rangeError ? from : undefined,
    to: to && !toError && !rangeError ? to : undefined,
    sort,
  };
  const invoices = useInvoicesQuery(params);
  const filtered = !!(params.q || params.status || params.overdue || params.accountId || params.from || params.to);
  const base = office ? ("/office/invoices" as const) : ("/buyer/invoices" as const);
  const open = (inv: InvoiceDto) => router.push(`${base}/${inv.id}`);
  const showFilters = wide || moreFilters;

  return (
    <Screen testID="invoices-screen">
      <PageHeader
        overline={office ? "Billing" : "Your account"}
        title="Invoices"
        subtitle={office ? "Every invoice and weekly statement, with what is still owed." : "Your invoices from the bakery: download them, and pay open ones by card."}
        testID="invoices-title"
      />
      {office ? <StatementsBar /> : null}
      <View style={[billingStyles.filters, wide && billingStyles.filtersWide]}>
        <View style={wide ? styles.search : undefined}>
          <TextField
            label="Search"
            placeholder={office ? "Invoice number or account" : "Invoice number"}
            value={q}
            onChangeText={setQ}
            testID="invoices-search"
            {...SEARCH_INPUT}
          />
        </View>
        <ChoiceGroup<Show> label="Show" choices={office ? OFFICE_SHOW : BUYER_SHOW} value={show} onChange={setShow} testID="invoices-status" />
      </View>
      {!wide ? (
        <Button
          label={moreFilters ? "Fewer filters" : "More filters: dates, sort" + (office ? ", account" : "")}
          icon="sliders"
          variant="ghost"
          small
          onPress={() => setMoreFilters((m) => !m)}
          testID="invoices-more-filters"
        />
      ) : null}
      {showFilters ? (
        <View style={[billingStyles.filters, wide && billingStyles.filtersWide]}>
          <View style={styles.date}>
            <DateField label="Issued from" value={fromText} onChangeText={setFromText} error={fromError ?? rangeError} max={toText || undefined} testID="invoices-from" />
          </View>
          <View style={styles.date}>
            <DateField label="Issued to" value={toText} onChangeText={setToText} error={toError} min={fromText || undefined} testID="invoices-to" />
          </View>
          <ChoiceGroup<InvoiceSort> label="Sort by" choices={SORTS.filter((s) => office || s.value !== "account")} value={sort} onChange={setSort} testID="invoices-sort" />
          {office ? <AccountFilter value={accountId} onChange={setAccountId} /> : null}
        </View>
      ) : null}

      <QueryStates
        query={invoices}
        testID="invoices"
        loadingLabel="Loading invoices…"
        errorTitle="Invoices didn't load"
        isEmpty={(data) => data.invoices.length === 0}
        empty={
          filtered
            ? { icon: "search", title: "No invoices match", message: "Try other words or dates, or show all invoices." }
            : {
                icon: "file-text",
                title: "No invoices yet",
                message: office ? "Invoices appear when deliveries are confirmed (card accounts) or weekly statements are issued." : "Your invoices appear here after your deliveries.",
              }
        }
      >
        {(data) => (
          <>
            {office && (data.totals.overpaidCount ?? 0) > 0 ? <OverpaidNotice count={data.totals.overpaidCount ?? 0} /> : null}
            {wide ? (
              <InvoiceTable invoices={data.invoices} totals={data.totals} office={office} onOpen={open} />
            ) : (
              <>
                <TotalsTiles totals={data.totals} currency={data.invoices[0]?.currency} />
                <ListCards testID="invoices-list">
                  {data.invoices.map((inv) => (
                    <InvoiceCard key={inv.id} invoice={inv} href={`${base}/${inv.id}`} office={office} />
                  ))}
                </ListCards>
              </>
            )}
          </>
        )}
      </QueryStates>
    </Screen>
  );
}

function StatementsBar() {
  const issue = useIssueStatementsMutation();
  const remind = useRemindAllOverdueMutation();
  const r = issue.data;
  const sent = remind.data;
  return (
    <View style={styles.statements}>
      <View style={billingStyles.buttons}>
        <Button label="Remind all overdue" icon="bell" variant="secondary" busy={remind.isPending} onPress={() => remind.mutate()} testID="remind-all" />
        <AppText variant="small" color="muted" style={styles.flex}>
          A payment reminder to each account with an overdue invoice (not to any already reminded today).
        </AppText>
      </View>
      <FormError message={remind.isError ? messageOf(remind.error) : null} testID="remind-all-error" />
      {sent ? (
        <Notice
          testID="remind-all-result"
          message={
            sent.sent.length === 0
              ? sent.skipped.length
                ? `Nothing sent: ${sent.skipped.join(", ")} ${sent.skipped.length === 1 ? "was" : "were"} reminded today already.`
                : "Nothing is overdue: no reminders to send."
              : `Reminders queued for ${sent.sent.join(", ")}.${sent.skipped.length ? ` Left out (reminded today already): ${sent.skipped.join(", ")}.` : ""}`
          }
        />
      ) : null}
      <View style={billingStyles.buttons}>
        <Button label="Issue statements now" icon="send" variant="secondary" busy={issue.isPending} onPress={() => issue.mutate(undefined)} testID="issue-statements" />
        <AppText variant="small" color="muted" style={styles.flex}>
          Weekly statements for accounts on terms, for delivered orders not invoiced yet. They also go out every Monday on their own.
        </AppText>
      </View>
      <FormError message={issue.isError ? messageOf(issue.error) : null} testID="statements-error" />
      {r ? (
        <Notice
          testID="statements-result"
          message={r.length === 0 ? "Nothing to invoice: every delivered order on terms is already on a statement." : `Issued and e-mailed ${r.length === 1 ? "1 statement" : `${r.length} statements`}: ${r.join(", ")}.`}
        />
      ) : null}
    </View>
  );
}

function AccountFilter({ value, onChange }: { value: number | null; onChange: (id: number | null) => void }) {
  const accounts = useAccountsQuery({});
  if (accounts.isPending) return <LoadingState label="Loading accounts…" testID="invoices-accounts-loading" />;
  if (accounts.isError) return <FormError message={`The account filter didn't load: ${messageOf(accounts.error)}`} testID="invoices-accounts-error" />;
  return (
    <ChoiceGroup<string>
      label="Account"
      testID="invoices-account"
      value={value ? String(value) : "all"}
      onChange={(v) => onChange(v === "all" ? null : Number(v))}
      choices={[{ value: "all", label: "All accounts" }, ...accounts.data.map((a) => ({ value: String(a.id), label: a.businessName }))]}
    />
  );
}

function TotalsTiles({ totals, currency = "USD" }: { totals: InvoiceTotalsDto; currency?: string }) {
  return (
    <View style={billingStyles.figures} testID="invoices-totals">
      <Figure label="Invoices" value={String(totals.count)} testID="invoices-total-count" />
      <Figure label="Invoiced" value={money(totals.totalCents, currency)} testID="invoices-total-amount" />
      <Figure label="Paid" value={money(totals.paidCents, currency)} testID="invoices-total-paid" />
      <Figure label="Still owed" value={money(totals.dueCents, currency)} testID="invoices-total-due" tone={totals.dueCents > 0 ? "danger" : undefined} />
    </View>
  );
}

function InvoiceTable({ invoices, totals, office, onOpen }: { invoices: InvoiceDto[]; totals: InvoiceTotalsDto; office: boolean; onOpen: (inv: InvoiceDto) => void }) {
  const cur = invoices[0]?.currency ?? "USD";
  return (
    <DataTable<InvoiceDto>
      testID="invoices-table"
      rows={invoices}
      rowKey={(i) => i.id}
      onRowPress={onOpen}
      rowLabel={(i) => `${i.number}, ${i.accountName}, ${money(i.totalCents, i.currency)}, ${i.overdue ? "overdue" : INVOICE_STATUS_LABELS[i.status].toLowerCase()}`}
      rowTestID={(i) => `invoice-row-${i.id}`}
      footer
      footerTestID="invoices-totals"
      columns={[
        {
          key: "number",
          label: "Invoice",
          flex: 1.6,
          render: (i) => <TitleCell title={i.number} detail={i.kind === "statement" ? "Statement" : null} />,
          footer: <AppText variant="bodyStrong" testID="invoices-total-count">{invoicesLabel(totals.count)}</AppText>,
        },
        ...(office ? [{ key: "account", label: "Account", flex: 1.5, render: (i: InvoiceDto) => i.accountName }] : []),
        { key: "issued", label: "Issued", flex: 1.15, render: (i) => day(i.issueDate) },
        { key: "due", label: "Due", flex: 1.15, render: (i) => <AppText color={i.overdue ? "dangerInk" : "ink"}>{day(i.dueDate)}</AppText> },
        { key: "status", label: "Status", flex: 0.95, render: (i) => <StatusCell invoice={i} office={office} /> },
        { key: "total", label: "Total", flex: 0.9, align: "right", render: (i) => money(i.totalCents, i.currency), footer: <AppText variant="bodyStrong" align="right" testID="invoices-total-amount">{money(totals.totalCents, cur)}</AppText> },
        { key: "paid", label: "Paid", flex: 0.9, align: "right", render: (i) => money(i.paidCents, i.currency), footer: <AppText variant="bodyStrong" align="right" testID="invoices-total-paid">{money(totals.paidCents, cur)}</AppText> },
        {
          key: "owed",
          label: "Owed",
          flex: 0.9,
          align: "right",
          render: (i) => (
            <AppText variant={i.amountDueCents > 0 ? "bodyStrong" : "body"} color={i.overdue ? "dangerInk" : "ink"} align="right">
              {money(i.amountDueCents, i.currency)}
            </AppText>
          ),
          footer: <AppText variant="bodyStrong" align="right" testID="invoices-total-due">{money(totals.dueCents, cur)}</AppText>,
        },
      ]}
    />
  );
}

/** Money paid twice is the bookkeeper's to give back: said above the list, flagged on each row. */
function OverpaidNotice({ count }: { count: number }) {
  return (
    <Notice
      tone="info"
      testID="invoices-overpaid"
      message={`${count === 1 ? "1 invoice was" : `${count} invoices were`} paid more than ${count === 1 ? "it owes" : "they owe"}. Open ${count === 1 ? "it" : "them"} to refund the extra to the card.`}
    />
  );
}

/** The status, and for the office a flag on an invoice paid more than it owes. */
function StatusCell({ invoice: i, office }: { invoice: InvoiceDto; office: boolean }) {
  return (
    <View style={styles.status}>
      <InvoiceStatusBadge invoice={i} testID={`invoice-status-${i.id}`} />
      {office && i.overpaidCents > 0 ? <Badge label={`Overpaid ${money(i.overpaidCents, i.currency)}`} tone="amber" testID={`invoice-overpaid-${i.id}`} /> : null}
    </View>
  );
}

function InvoiceCard({ invoice: i, href, office }: { invoice: InvoiceDto; href: Href; office: boolean }) {
  return (
    <ListCard
      href={href}
      accessibilityLabel={`${i.number}${office ? `, ${i.accountName}` : ""}, ${money(i.totalCents, i.currency)}, ${i.overdue ? "overdue" : INVOICE_STATUS_LABELS[i.status].toLowerCase()}`}
      testID={`invoice-row-${i.id}`}
    >
      <ListCardText>
        <ListCardTop>
          <ListCardTitle>{i.number}</ListCardTitle>
          <StatusCell invoice={i} office={office} />
        </ListCardTop>
        {office ? <AppText variant="small">{i.accountName}</AppText> : null}
        <AppText variant="small" color="muted">
          {`Issued ${day(i.issueDate)} · due ${day(i.dueDate)}${i.kind === "statement" ? " · statement" : ""}`}
        </AppText>
        <AppText variant="small" color={i.overdue ? "dangerInk" : "ink"}>
          {i.amountDueCents > 0 ? `${money(i.amountDueCents, i.currency)} owed of ${money(i.totalCents, i.currency)}` : `${money(i.totalCents, i.currency)} · nothing owed`}
        </AppText>
      </ListCardText>
    </ListCard>
  );
}

const styles = StyleSheet.create({
  search: { flexGrow: 1, flexBasis: 280, maxWidth: 420 },
  date: { flexBasis: 160, flexGrow: 0, minWidth: 150 },
  statements: { gap: space.sm },
  status: { gap: space.xxs },
  flex: { flex: 1, minWidth: 200 },
});

