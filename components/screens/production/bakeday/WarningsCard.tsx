import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText, Heading } from "../../../ui/Text";
import { colors, radii, space } from "../../../theme";

/** What to check before baking: the plan's warnings and the liquids that cannot be reached. */

export function WarningsCard({ warnings }: { warnings: string[] }) {
  if (warnings.length === 0) return null;
  return (
    <View style={styles.warnings} accessibilityRole="alert" testID="plan-warnings">
      <View style={styles.warningsHead}>
        <Feather name="alert-octagon" size={20} color={colors.dangerInk} />
        <Heading level={2} variant="heading" color="dangerInk">
          {warnings.length === 1 ? "1 thing to check" : `${warnings.length} things to check`}
        </Heading>
      </View>
      {warnings.map((w) => (
        <AppText key={w} color="ink">{`•  ${w}`}</AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  warnings: { gap: space.sm, backgroundColor: colors.dangerSoft, borderRadius: radii.lg, padding: space.lg },
  warningsHead: { flexDirection: "row", alignItems: "center", gap: space.sm },
});
