import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Button } from "../../../ui/Button";
import { FormError } from "../../../ui/FormError";
import { AppText } from "../../../ui/Text";
import { useDownload } from "../../../forms/useDownload";
import { downloadPlanPdf } from "../../../api/production";
import type { UnitSystem } from "../../../../shared/units";
import { space } from "../../../theme";

/** The production sheet and one weigh-out card per mix, as a PDF, in either unit system. */
export function PdfButtons({ date }: { date: string }) {
  const download = useDownload<UnitSystem>();
  const get = (units: UnitSystem) => download.run(() => downloadPlanPdf(date, units), units);
  return (
    <Card title="Print" testID="plan-pdf">
      <AppText variant="small" color="muted">
        The production sheet, then one weigh-out card per mix.
      </AppText>
      <View style={styles.pdfButtons}>
        <Button label="Production sheet (PDF)" icon="printer" block busy={download.pending === "metric"} onPress={() => get("metric")} testID="pdf-metric" accessibilityLabel="Production sheet (PDF): grams and °C" />
        <Button label="Production sheet, US units (PDF)" icon="printer" variant="secondary" block busy={download.pending === "us"} onPress={() => get("us")} testID="pdf-us" accessibilityLabel="Production sheet, US units (PDF): pounds, ounces and °F" />
      </View>
      <FormError message={download.error} testID="pdf-error" />
    </Card>
  );
}

const styles = StyleSheet.create({
  pdfButtons: { gap: space.sm },
});
