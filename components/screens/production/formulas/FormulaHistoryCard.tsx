import React from "react";
import { StyleSheet, View } from "react-native";
import { Card } from "../../../ui/Card";
import { Badge } from "../../../ui/Badge";
import { TextLink } from "../../../ui/TextLink";
import { QueryStates } from "../../../ui/QueryStates";
import { AppText } from "../../../ui/Text";
import { useFormulaHistoryQuery } from "../../../api/formulas";
import { useBakeryTimeZone } from "../../../api/bakery";
import { formatDateTime } from "../../../format";
import type { KitchenPaths } from "../../../production/paths";
import { colors, space } from "../../../theme";

/** Every saved version: when, the note, and a link to read it (or to edit the current one). */
export function FormulaHistoryCard({ id, current, reading, paths }: { id: number; current: number; reading?: number; paths: KitchenPaths }) {
  const history = useFormulaHistoryQuery(id);
  const timeZone = useBakeryTimeZone();
  return (
    <Card title="History" testID="formula-history">
      <QueryStates query={history} loadingLabel="Loading the history…" errorTitle="The history didn't load" testID="history" isEmpty={(list) => list.length === 0} empty={<AppText color="muted">No versions yet.</AppText>}>
        {(list) => (
          <View>
            {list.map((h, i) => {
              const isCurrent = h.version === current;
              const isReading = reading ? h.version === reading : isCurrent;
              return (
                <View key={h.version} style={[styles.history, i > 0 && styles.divider]} testID={`history-${h.version}`}>
                  <View style={styles.flex}>
                    <View style={styles.titleRow}>
                      <AppText variant="bodyStrong">{`Version ${h.version}`}</AppText>
                      {isCurrent ? <Badge label="Current" tone="sage" /> : null}
                      {isReading && !isCurrent ? <Badge label="Reading" tone="crust" /> : null}
                    </View>
                    <AppText variant="small" color="muted">{`${formatDateTime(h.createdAt, timeZone)}${h.note ? ` · ${h.note}` : ""}`}</AppText>
                  </View>
                  {isReading ? null : <TextLink href={(isCurrent ? paths.formula(id) : paths.formula(id, h.version))} label={isCurrent ? "Edit" : "Open"} testID={`history-${h.version}-open`} />}
                </View>
              );
            })}
          </View>
        )}
      </QueryStates>
    </Card>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1, minWidth: 0 },
  titleRow: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.sm },
  history: { flexDirection: "row", alignItems: "center", gap: space.md, paddingVertical: space.sm, minHeight: 52 },
  divider: { borderTopWidth: 1, borderTopColor: colors.border },
});
