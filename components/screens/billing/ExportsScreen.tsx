import React from "react";
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
import { space } from "../../theme";

const EXPORTS: { file: ExportFile; name: string; title: string; label: string; about: string }[] = [
  { file: "invoices.csv", name: "invoices", title: "Invoices", label: "Download invoices CSV", about: "Every invoice and statement with its subtotal, tax, credits, payments and what is still owed." },
  { file: "payments.csv", name: "payments", title: "Payments", label: "Download payments CSV", about: "Every payment received, card or otherwise, with its invoice, reference and processor ids." },
  { file: "payouts.csv", name: "payouts", title: "Payouts", label: "Download payouts CSV", about: "Each payout to the bank with its gross, fees, refunds, net and whether it is reconciled." },
];

/** CSV files for the accounts package: one header row, dates YYYY-MM-DD, amounts in dollars with the currency code beside them. */
export function ExportsScreen() {
  const wide = useIsWide();
  return (
    <Screen testID="exports-screen">
      <BackLink href="/office/money" label="Money" testID="back-to-money" />
      <PageHeader overline="Money" title="Exports" subtitle="Spreadsheet files (CSV, UTF-8) for the accountant or the bookkeeping package." testID="exports-title" />
      <View style={[styles.grid, wide && styles.gridWide]}>
        {EXPORTS.map((e) => (
          <ExportCard key={e.name} {...e} />
        ))}
      </View>
    </Screen>
  );
}

function ExportCard({ file, name, title, label, about }: (typeof EXPORTS)[number]) {
  const today = useBakeryQuery().data?.today;
  const download = useDownload();
  return (
    <Card title={title} style={styles.card} testID={`export-${name}-card`}>
      <AppText color="muted" style={styles.about}>
        {about}
      </AppText>
      {download.done ? <Notice message={`${file} downloaded.`} testID={`export-${name}-done`} /> : null}
      <FormError message={download.error} testID={`export-${name}-error`} />
      <Button label={label} icon="download" variant="secondary" busy={download.pending !== null} onPress={() => download.run(() => downloadExport(file, today))} testID={`export-${name}`} />
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.lg },
  gridWide: { flexDirection: "row", alignItems: "stretch" },
  card: { flex: 1 },
  about: { flexGrow: 1 },
});
