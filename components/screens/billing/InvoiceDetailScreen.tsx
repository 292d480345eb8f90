import React from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { DetailList } from "../../ui/DetailList";
import { Button } from "../../ui/Button";
import { TextLink } from "../../ui/TextLink";
import { FormError, Notice } from "../../ui/FormError";
import { Badge } from "../../ui/Badge";
import { NotFoundState, isNotFound } from "../../ui/States";
import { QueryStates } from "../../ui/QueryStates";
import { DataTable } from "../../ui/DataTable";
import { AppText } from "../../ui/Text";
import { messageOf } from "../../api/client";
import { useDownload } from "../../forms/useDownload";
import { downloadInvoicePdf, useInvoiceQuery, useRefundOverpaymentMutation, useRemindMutation, type InvoiceDetailDto, type InvoiceDto } from "../../api/invoices";
import { REMINDER_STAGE_LABELS } from "../../../shared/billing";
import { useBillingSettingsQuery } from "../../api/billingSettings";
import { useBakeryTimeZone } from "../../api/bakery";
import { formatDateTime } from "../../format";
import { useIsWide } from "../../shell/useIsWide";
import { BackLink, DISPOSITION_LABELS, InvoiceStatusBadge, KIND_LABELS, METHOD_LABELS, SumLine, billingStyles, day, money, percent } from "./parts";
import { PayByCard } from "./PayByCard";
import { CreditNoteCard } from "./CreditNoteCard";
import { RecordPaymentCard } from "./RecordPaymentCard";
import { colors, radii, space } from "../../theme";

export interface InvoiceDetailProps {
  id: number;
  /** Office: record payments, issue credit notes. Buyer: their own invoice, to download and pay. */
  mode: "office" | "buyer";
}

/** One invoice: its lines and totals, credits, payments and refunds; PDF and card payment; the office's forms. */
export function InvoiceDetailScreen({ id, mode }: InvoiceDetailProps) {
  const valid = Number.isInteger(id) && id > 0;
  const detail = useInvoiceQuery(valid ? id : null);
  const refund = useRefundOverpaymentMutation(valid ? id : 0);
  const wide = useIsWide();
  const office = mode === "office";
  const listHref = office ? ("/office/invoices" as const) : ("/buyer/invoices" as const);

  const notFound = !valid || (detail.isError && isNotFound(detail.error));

  return (
    <Screen testID="invoice-detail">
      {notFound ? (
        <NotFoundState title="There's no such invoice" message="It may have been typed wrong in the address." back={{ href: listHref, label: "All invoices" }} testID="invoice-not-found" />
      ) : (
        <QueryStates query={detail} testID="invoice" loadingLabel="Loading the invoice…" errorTitle="This invoice didn't load">
          {(d) => <InvoiceBody detail={d} office={office} listHref={listHref} refund={refund} wide={wide} />}
        </QueryStates>
      )}
      {!notFound && detail.isError ? <TextLink href={listHref} label="All invoices" /> : null}
    </Screen>
  );
}

interface InvoiceBodyProps {
  detail: InvoiceDetailDto;
  office: boolean;
  listHref: "/office/invoices" | "/buyer/invoices";
  refund: ReturnType<typeof useRefundOverpaymentMutation>;
  wide: boolean;
}

function InvoiceBody({ detail: d, office, listHref, refund, wide }: InvoiceBodyProps) {
  const inv = d.invoice;
  const payable = inv.amountDueCents > 0 && inv.status !== "void";
  return (
    <>
      <BackLink href={listHref} label="All invoices" testID="back-to-invoices" />
      <PageHeader
        overline={KIND_LABELS[inv.kind]}
        title={inv.number}
        subtitle={`${inv.accountName} · issued ${day(inv.issueDate)}`}
        testID="invoice-title"
        actions={<PdfButton invoice={inv} />}
      />
      {office && d.alerts?.length ? <AlertsCard detail={d} refund={refund} /> : null}
      {office && refund.isSuccess ? <Notice message={`Refunded ${money(refund.data.amountCents, inv.currency)} to the card.`} testID="refund-overpayment-done" /> : null}
      {!office && inv.overpaidCents > 0 ? (
        <Notice tone="info" message={`You paid ${money(inv.overpaidCents, inv.currency)} more than this invoice. The bakery refunds it to your card.`} testID="invoice-overpaid-note" />
      ) : null}
      {/* On a phone what is owed, and paying it, come first. */}
      {!wide ? <SummaryCard invoice={inv} office={office} payable={payable} /> : null}
      <View style={[billingStyles.grid, wide && billingStyles.gridWide]}>
        <View style={[billingStyles.col, wide && billingStyles.mainCol]}>
          <LinesCard detail={d} />
          {d.creditNotes.length ? <CreditNotesCard detail={d} /> : null}
          {office && inv.status !== "void" ? <CreditNoteCard detail={d} /> : null}
        </View>
        <View style={[billingStyles.col, wide && billingStyles.sideCol]}>
          {wide ? <SummaryCard invoice={inv} office={office} payable={payable} /> : null}
          <PaymentsCard detail={d} />
          {d.refunds.length ? <RefundsCard detail={d} /> : null}
          {office && payable ? <RecordPaymentCard detail={d} /> : null}
          {office && (payable || (d.reminders ?? []).length > 0) ? <RemindersCard detail={d} payable={payable} /> : null}
          {!office && payable && inv.kind === "statement" ? <OtherWaysCard /> : null}
          {d.emails?.length ? <EmailsCard detail={d} /> : null}
        </View>
      </View>
    </>
  );
}

/**
 * For the office: an overpayment (a card page paid after the invoice was settled another way), with its
 * refund in one action, and payment notices from Stripe that were rejected (not applied).
 */
function AlertsCard({ detail, refund }: { detail: InvoiceDetailDto; refund: ReturnType<typeof useRefundOverpaymentMutation> }) {
  const inv = detail.invoice;
  const alerts = detail.alerts ?? [];
  return (
    <Card title="Needs your attention" testID="invoice-alerts">
      {alerts.map((a, i) => (
        <Entry
          key={`${a.kind}-${a.eventId ?? i}`}
          divided={i > 0}
          testID={`invoice-alert-${a.kind}`}
          title={a.kind === "overpayment" ? `Paid twice: ${money(a.amountCents ?? 0, inv.currency)} too much` : "Payment notice rejected"}
          badge={<Badge label={a.kind === "overpayment" ? "Overpaid" : "Not applied"} tone={a.kind === "overpayment" ? "amber" : "danger"} />}
        >
          <AppText variant="small">{a.message}</AppText>
          {a.kind === "overpayment" ? (
            <View style={styles.action}>
              <Button
                label={`Refund ${money(a.amountCents ?? 0, inv.currency)} to the card`}
                icon="rotate-ccw"
                busy={refund.isPending}
                disabled={refund.isSuccess}
                onPress={() => refund.mutate()}
                testID="refund-overpayment"
              />
              <FormError message={refund.isError ? messageOf(refund.error) : null} testID="refund-overpayment-error" />
            </View>
          ) : null}
        </Entry>
      ))}
    </Card>
  );
}

function PdfButton({ invoice }: { invoice: InvoiceDto }) {
  const download = useDownload();
  return (
    <View style={styles.pdf}>
      <Button label="Download PDF" icon="download" variant="secondary" busy={download.pending !== null} onPress={() => download.run(() => downloadInvoicePdf(invoice))} testID="invoice-pdf" />
      <FormError message={download.error} testID="invoice-pdf-error" />
    </View>
  );
}

function SummaryCard({ invoice: inv, office, payable }: { invoice: InvoiceDto; office: boolean; payable: boolean }) {
  const timeZone = useBakeryTimeZone();
  return (
    <Card title={payable ? "Amount due" : "Nothing owed"} action={<InvoiceStatusBadge invoice={inv} testID="invoice-status" />} testID="invoice-summary">
      <AppText variant="display" color={inv.overdue ? "dangerInk" : "ink"} testID="invoice-amount-due">
        {money(inv.amountDueCents, inv.currency)}
      </AppText>
      {inv.overdue ? (
        <AppText variant="bodyStrong" color="dangerInk" testID="invoice-overdue-note">
          {`Overdue: it was due ${day(inv.dueDate)}.`}
        </AppText>
      ) : null}
      {payable ? <PayByCard invoiceId={inv.id} label={office ? "Open card payment page" : "Pay by card"} variant={office ? "secondary" : "primary"} testID="pay-by-card" /> : null}
      <DetailList
        items={[
          ...(office ? [{ label: "Account", value: <TextLink href={`/office/accounts/${inv.accountId}`} label={inv.accountName} testID="invoice-account-link" /> }] : []),
          { label: "Issued", value: day(inv.issueDate) },
          { label: "Due", value: day(inv.dueDate), testID: "invoice-due-date" },
          ...(inv.periodStart && inv.periodEnd ? [{ label: "Deliveries", value: `${day(inv.periodStart)} – ${day(inv.periodEnd)}` }] : []),
          { label: "E-mailed", value: inv.sentAt ? `To the billing e-mail, ${formatDateTime(inv.sentAt, timeZone)}` : "Not sent yet", testID: "invoice-sent" },
        ]}
      />
    </Card>
  );
}

function LinesCard({ detail }: { detail: InvoiceDetailDto }) {
  const wide = useIsWide();
  const inv = detail.invoice;
  const cur = inv.currency;
  return (
    <Card title="What was delivered" testID="invoice-lines">
      {detail.lines.length === 0 ? (
        <AppText color="muted">No lines on this invoice.</AppText>
      ) : wide ? (
        <DataTable
          rows={detail.lines}
          rowKey={(l) => l.id}
          rowTestID={(l) => `invoice-line-${l.id}`}
          columns={[
            { key: "date", label: "Delivered", flex: 0.9, render: (l) => day(l.deliveryDate) },
            { key: "what", label: "Item", flex: 2.2, render: (l) => l.description },
            { key: "qty", label: "Qty", flex: 0.5, align: "right", render: (l) => String(l.quantity) },
            { key: "unit", label: "Unit price", flex: 0.9, align: "right", render: (l) => money(l.unitPriceCents, cur) },
            { key: "amount", label: "Amount", flex: 0.9, align: "right", render: (l) => money(l.amountCents, cur) },
          ]}
        />
      ) : (
        <View>
          {detail.lines.map((l, i) => (
            <View key={l.id} style={[styles.line, i > 0 && styles.divider]} testID={`invoice-line-${l.id}`}>
              <View style={styles.flex}>
                <AppText variant="bodyStrong">{l.description}</AppText>
                <AppText variant="small" color="muted">{`${day(l.deliveryDate)} · ${l.quantity} × ${money(l.unitPriceCents, cur)}`}</AppText>
              </View>
              <AppText variant="bodyStrong">{money(l.amountCents, cur)}</AppText>
            </View>
          ))}
        </View>
      )}
      <View style={styles.sums} testID="invoice-sums">
        <SumLine label="Subtotal" value={money(inv.subtotalCents, cur)} testID="invoice-subtotal" />
        <SumLine label={inv.taxExempt ? "Sales tax (exempt: certificate on file)" : `Sales tax (${percent(inv.taxRateBp)})`} value={money(inv.taxCents, cur)} testID="invoice-tax" />
        <SumLine label="Total" value={money(inv.totalCents, cur)} strong testID="invoice-total" />
        {inv.creditedCents ? <SumLine label="Credit notes" value={`− ${money(inv.creditedCents, cur)}`} testID="invoice-credited" /> : null}
        {inv.paidCents ? <SumLine label="Paid" value={`− ${money(inv.paidCents, cur)}`} testID="invoice-paid" /> : null}
        {inv.refundedCents ? <SumLine label="Refunded" value={`+ ${money(inv.refundedCents, cur)}`} testID="invoice-refunded" /> : null}
        <SumLine label="Amount due" value={money(inv.amountDueCents, cur)} strong tone={inv.overdue ? "danger" : undefined} testID="invoice-due" />
      </View>
    </Card>
  );
}

function CreditNotesCard({ detail }: { detail: InvoiceDetailDto }) {
  const cur = detail.invoice.currency;
  return (
    <Card title="Credit notes" testID="invoice-credit-notes">
      {detail.creditNotes.map((c, i) => (
        <Entry key={c.id} divided={i > 0} testID={`credit-note-${c.id}`} title={c.number} badge={<Badge label={c.carriedFromInvoiceId ? "Carried from an earlier invoice" : DISPOSITION_LABELS[c.disposition]} tone="crust" />}>
          <AppText variant="small" color="muted">{`${day(c.issueDate)} · ${c.reason}`}</AppText>
          {c.lines.map((l, j) => (
            <AppText key={j} variant="small">{`${l.quantity} × ${l.description} at ${money(l.unitPriceCents, cur)}`}</AppText>
          ))}
          <AppText variant="bodyStrong" align="right">{`− ${money(c.totalCents, cur)}${c.taxCents ? ` (incl. ${money(c.taxCents, cur)} tax)` : ""}`}</AppText>
        </Entry>
      ))}
    </Card>
  );
}

/** Payment reminders: send one by hand (the e-mail goes through the outgoing e-mail), and when each went out. */
function RemindersCard({ detail, payable }: { detail: InvoiceDetailDto; payable: boolean }) {
  const remind = useRemindMutation(detail.invoice.id);
  const tz = useBakeryTimeZone();
  const reminders = detail.reminders ?? [];
  return (
    <Card title="Payment reminders" testID="invoice-reminders">
      {reminders.length === 0 ? (
        <AppText color="muted" testID="invoice-no-reminders">
          No reminders sent yet.
        </AppText>
      ) : (
        reminders.map((r, i) => (
          <Entry key={r.id} divided={i > 0} testID={`reminder-${r.id}`} title={formatDateTime(r.at, tz)} badge={<Badge label={REMINDER_STAGE_LABELS[r.stage]} tone={r.stage === "manual" ? "neutral" : "crust"} />}>
            {null}
          </Entry>
        ))
      )}
      {payable ? <Button label="Send a payment reminder" icon="bell" variant="secondary" busy={remind.isPending} onPress={() => remind.mutate()} testID="invoice-remind" /> : null}
      {remind.isSuccess ? <Notice message={`Reminder queued for ${detail.invoice.accountName}'s billing e-mail.`} testID="invoice-remind-done" /> : null}
      <FormError message={remind.isError ? messageOf(remind.error) : null} testID="invoice-remind-error" />
    </Card>
  );
}

function PaymentsCard({ detail }: { detail: InvoiceDetailDto }) {
  const cur = detail.invoice.currency;
  return (
    <Card title="Payments received" testID="invoice-payments">
      {detail.payments.length === 0 ? (
        <AppText color="muted" testID="invoice-no-payments">
          No payments yet.
        </AppText>
      ) : (
        detail.payments.map((p, i) => (
          <Entry key={p.id} divided={i > 0} testID={`payment-${p.id}`} title={money(p.amountCents, cur)} badge={<Badge label={METHOD_LABELS[p.method]} tone="sage" />}>
            <AppText variant="small" color="muted">{`Received ${day(p.receivedOn)}${p.reference ? ` · ref. ${p.reference}` : ""}`}</AppText>
          </Entry>
        ))
      )}
    </Card>
  );
}

function RefundsCard({ detail }: { detail: InvoiceDetailDto }) {
  const cur = detail.invoice.currency;
  const timeZone = useBakeryTimeZone();
  return (
    <Card title="Refunds to the card" testID="invoice-refunds">
      {detail.refunds.map((r, i) => (
        <Entry key={r.id} divided={i > 0} testID={`refund-${r.id}`} title={money(r.amountCents, cur)}>
          <AppText variant="small" color="muted">{`${formatDateTime(r.createdAt, timeZone)} · ${r.overpayment ? "overpayment given back · " : ""}${r.stripeRefundId}`}</AppText>
        </Entry>
      ))}
    </Card>
  );
}

const EMAIL_STATUS: Record<string, string> = { pending: "Waiting to send", sending: "Sending", sent: "Sent", failed: "Failed — the owner can send it again" };

/** The invoice's e-mails: the invoice with its PDF, and receipts, with where they are. */
function EmailsCard({ detail }: { detail: InvoiceDetailDto }) {
  const timeZone = useBakeryTimeZone();
  return (
    <Card title="E-mails" testID="invoice-emails">
      {(detail.emails ?? []).map((e, i) => (
        <Entry key={e.id} divided={i > 0} testID={`invoice-email-${e.id}`} title={e.kind === "receipt" ? "Payment receipt" : "Invoice with PDF"}>
          <AppText variant="small" color="muted">{`To ${e.to} · ${EMAIL_STATUS[e.status] ?? "Status unknown"}${e.sentAt ? `, ${formatDateTime(e.sentAt, timeZone)}` : ""}`}</AppText>
        </Entry>
      ))}
    </Card>
  );
}

/** One entry in a card's list (a payment, a credit note, an e-mail): a line above it after the first, its title and badge first. */
function Entry({ divided, title, badge, testID, children }: { divided: boolean; title: string; badge?: React.ReactNode; testID: string; children: React.ReactNode }) {
  return (
    <View style={[styles.entry, divided && styles.divider]} testID={testID}>
      {badge ? (
        <View style={billingStyles.cardTop}>
          <AppText variant="bodyStrong" style={billingStyles.grow}>
            {title}
          </AppText>
          {badge}
        </View>
      ) : (
        <AppText variant="bodyStrong">{title}</AppText>
      )}
      {children}
    </View>
  );
}

/** For statements: the bakery's own transfer or check details. */
function OtherWaysCard() {
  const settings = useBillingSettingsQuery();
  const text = settings.data?.paymentInstructions;
  if (!text) return null;
  return (
    <Card title="Other ways to pay" testID="invoice-instructions">
      <AppText selectable>{text}</AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  pdf: { gap: space.xs, alignItems: "flex-end" },
  flex: { flex: 1 },
  line: { flexDirection: "row", alignItems: "flex-start", gap: space.md, paddingVertical: space.sm },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
  sums: { padding: space.md, borderRadius: radii.md, backgroundColor: colors.page, gap: space.xxs },
  entry: { gap: space.xxs, paddingVertical: space.sm },
  action: { gap: space.xs, marginTop: space.xs, alignItems: "flex-start" },
});
