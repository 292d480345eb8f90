import React, { useState } from "react";
import { StyleSheet, View } from "react-native";
import { Screen } from "../../ui/Screen";
import { PageHeader } from "../../ui/PageHeader";
import { Card } from "../../ui/Card";
import { Button } from "../../ui/Button";
import { FormError, Notice } from "../../ui/FormError";
import { AppText } from "../../ui/Text";
import { useDownload } from "../../forms/useDownload";
import { downloadExport, type ExportFile } from "../../api/reports";
import { useBakeryQuery } from "../../api/bakery";
import { useIsWide } from "../../shell/useIsWide";
import { BackLink } from "./parts";
import { DateField } from "../../ui/DateField";
import { cleanDate } from "../../ordering/dates";
import { space } from "../../theme";

const EXPORTS: { file: ExportFile; name: string; title: string; label: string; about: string }[] = [
  { file: "invoices.csv", name: "invoices", title: "Invoices", label: "Download invoices CSV", about: "Every invoice and statement with its subtotal, tax, credits, payments and what is still owed." },
  { file: "payments.csv", name: "payments", title: "Payments", label: "Download payments CSV", about: "Every payment received, card or otherwise, with its invoice, reference and processor ids." },
  { file: "payouts.csv", name: "payouts", title: "Payouts", label: "Download payouts CSV", about: "Each payout to the bank with its gross, fees, refunds, net and whether it is reconciled." },
];

/** CSV files for the accounts package: one header row, dates YYYY-MM-DD, amounts in dollars with the currency code beside them. */
export function ExportsScreen() {
  const wide = useIsWide();
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const range = exportRange(from, to);
  return (
    <Screen testID="exports-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Exports" subtitle="Spreadsheet files (CSV, UTF-8) for the accountant or the bookkeeping package." testID="exports-title" />
      <Card title="Dates" testID="export-range">
        <AppText color="muted">Leave both empty for everything. Invoices count by the day issued, payments by the day received, payouts by the day they reach the bank; both ends are included.</AppText>
        <View style={[styles.range, wide && styles.rangeWide]}>
          <View style={styles.rangeField}>
            <DateField label="From" optional value={from} onChangeText={setFrom} max={to || undefined} testID="export-from" />
          </View>
          <View style={styles.rangeField}>
            <DateField label="To" optional value={to} onChangeText={setTo} min={from || undefined} error={range.error} testID="export-to" />
          </View>
        </View>
      </Card>
      <View style={[styles.grid, wide && styles.gridWide]}>
        {EXPORTS.map((e) => (
          <ExportCard key={e.name} {...e} range={range} />
        ))}
      </View>
    </Screen>
  );
}

/** The typed range, or why it cannot be used (the server checks the same: shared/schemas/billing.ts exportRangeSchema). */
export function exportRange(fromText: string, toText: string): { from?: string; to?: string; error: string | null } {
  const from = fromText.trim() ? cleanDate(fromText) : null;
  const to = toText.trim() ? cleanDate(toText) : null;
  if ((fromText.trim() && !from) || (toText.trim() && !to)) return { error: "Write the date as YYYY-MM-DD (year, month, day)." };
  if (from && to && to < from) return { error: "The end date is before the start date." };
  return { from: from ?? undefined, to: to ?? undefined, error: null };
}

function ExportCard({ file, name, title, label, about, range }: (typeof EXPORTS)[number] & { range: ReturnType<typeof exportRange> }) {
  const today = useBakeryQuery().data?.today;
  const download = useDownload();
  return (
    <Card title={title} style={styles.card} testID={`export-${name}-card`}>
      <AppText color="muted" style={styles.about}>
        {about}
      </AppText>
      {download.done ? <Notice message={`${file} downloaded.`} testID={`export-${name}-done`} /> : null}
      <FormError message={download.error} testID={`export-${name}-error`} />
      <Button
        label={range.from || range.to ? `${label} (${range.from ?? "start"} to ${range.to ?? "now"})` : label}
        icon="download"
        variant="secondary"
        disabled={!!range.error}
        busy={download.pending !== null}
        onPress={() => download.run(() => downloadExport(file, today, { from: range.from, to: range.to }))}
        testID={`export-${name}`}
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "stretch" },
  card: { flex: 1 },
  range: { gap: space.md },
  rangeWide: { flexDirection: "row" },
  rangeField: { flexGrow: 1, flexBasis: 200, maxWidth: 280 },
  about: { flexGrow: 1 },
});
