import React from "react";
import { StyleSheet, View } from "react-native";
import { Badge, type BadgeTone } from "../../ui/Badge";
import { AppText } from "../../ui/Text";
import { TextLink, type TextLinkProps } from "../../ui/TextLink";
import { formatMoney } from "../../../shared/money";
import { INVOICE_KIND_LABELS, INVOICE_STATUS_LABELS as SHARED_INVOICE_STATUS_LABELS, PAYMENT_METHOD_LABELS } from "../../../shared/billing";
import { formatCalendarDate } from "../../../shared/format";
import { currentLocale } from "../../format";
import type { InvoiceDto, InvoiceStatus, PaymentDto, CreditNoteDto } from "../../api/invoices";
import { colors, radii, space } from "../../theme";

/** Money in an invoice's (or a payout's lower-case) currency, in the bakery's locale. */
export function money(cents: number, currency = "USD"): string {
  return formatMoney(cents, currency.toUpperCase(), currentLocale());
}

/** "Mar 2, 2026" (en-US) for a calendar date (no time zone involved). */
export function day(date: string | null | undefined): string {
  if (!date) return "—";
  return formatCalendarDate(date.slice(0, 10), "date", currentLocale());
}

/** Basis points as a percentage: 875 → "8.75 %". */
export function percent(bp: number): string {
  const whole = Math.floor(bp / 100);
  const frac = bp % 100;
  return `${whole}${frac ? `.${String(frac).padStart(2, "0").replace(/0$/, "")}` : ""} %`;
}

export const INVOICE_STATUS_LABELS: Record<InvoiceStatus, string> = SHARED_INVOICE_STATUS_LABELS;

const STATUS_TONE: Record<InvoiceStatus, BadgeTone> = { open: "amber", paid: "sage", void: "neutral", partially_refunded: "crust", refunded: "neutral" };

/** The invoice's status, and "Overdue" in red when it is past its due date with money owed. */
export function InvoiceStatusBadge({ invoice, testID }: { invoice: Pick<InvoiceDto, "status" | "overdue">; testID?: string }) {
  if (invoice.overdue) return <Badge label="Overdue" tone="danger" testID={testID} />;
  return <Badge label={INVOICE_STATUS_LABELS[invoice.status]} tone={STATUS_TONE[invoice.status]} testID={testID} />;
}

export const METHOD_LABELS: Record<PaymentDto["method"], string> = PAYMENT_METHOD_LABELS;

export const DISPOSITION_LABELS: Record<CreditNoteDto["disposition"], string> = {
  applied: "Taken off this invoice",
  refund: "Refunded to the card",
  carry: "Carried to the next invoice",
};

export const KIND_LABELS: Record<InvoiceDto["kind"], string> = INVOICE_KIND_LABELS;

/** "‹ All invoices" and the like, above a detail page's title. */
export function BackLink({ href, label, testID }: TextLinkProps) {
  return <TextLink href={href} label={`‹ ${label}`} testID={testID} />;
}

/** A label and an amount on one line (invoice totals). */
export function SumLine({ label, value, strong, testID, tone }: { label: string; value: string; strong?: boolean; testID?: string; tone?: "danger" | "sage" }) {
  const color = tone === "danger" ? "dangerInk" : tone === "sage" ? "sageInk" : "ink";
  return (
    <View style={[styles.sum, strong && styles.sumStrong]} testID={testID}>
      <AppText variant={strong ? "bodyStrong" : "body"} color={strong ? color : "muted"} style={styles.sumLabel}>
        {label}
      </AppText>
      <AppText variant={strong ? "bodyStrong" : "body"} color={color} align="right">
        {value}
      </AppText>
    </View>
  );
}

/** A tile with a big figure (payout sums, invoice totals on a phone). */
export function Figure({ label, value, testID, tone }: { label: string; value: string; testID?: string; tone?: "danger" }) {
  return (
    <View style={[styles.figure, tone === "danger" && styles.figureDanger]} testID={testID} accessible accessibilityLabel={`${label}: ${value}`}>
      <AppText variant="caption" color={tone === "danger" ? "dangerInk" : "muted"}>
        {label}
      </AppText>
      <AppText variant="heading" color={tone === "danger" ? "dangerInk" : "ink"}>
        {value}
      </AppText>
    </View>
  );
}

export const billingStyles = StyleSheet.create({
  cardTop: { flexDirection: "row", alignItems: "center", gap: space.sm, flexWrap: "wrap" },
  grow: { flexGrow: 1, flexShrink: 1 },
  figures: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  filters: { gap: space.md },
  filtersWide: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", gap: space.lg },
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "flex-start" },
  col: { gap: space.lg },
  mainCol: { flex: 2, minWidth: 0 },
  sideCol: { flex: 1, minWidth: 0 },
});

const styles = StyleSheet.create({
  sum: { flexDirection: "row", alignItems: "baseline", justifyContent: "space-between", gap: space.md, paddingVertical: space.xxs },
  sumStrong: { borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.sm, marginTop: space.xs },
  sumLabel: { flexShrink: 1 },
  figure: { flexGrow: 1, flexBasis: 130, minWidth: 0, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  figureDanger: { backgroundColor: colors.dangerSoft },
});
