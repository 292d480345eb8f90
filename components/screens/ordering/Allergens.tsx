import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { AppText } from "../../ui/Text";
import { Badge } from "../../ui/Badge";
import { ALLERGEN_CAUTION, ALLERGEN_LABEL, type AllergenCode } from "../../../shared/allergens";
import { mayContainLabel } from "../../ordering/allergens";
import { colors, radii, space } from "../../theme";

/** Allergen chips from the fixed list, then the "may contain" line. */
export function AllergenChips({ allergens, mayContain, testID }: { allergens: readonly AllergenCode[]; mayContain: string; testID?: string }) {
  const traces = mayContainLabel(mayContain);
  if (allergens.length === 0 && !traces) return null;
  return (
    <View style={styles.allergens} testID={testID}>
      {allergens.length ? (
        <View style={styles.chips} accessibilityLabel={`Contains: ${allergens.map((a) => ALLERGEN_LABEL[a]).join(", ")}`}>
          {allergens.map((a) => (
            <Badge key={a} label={ALLERGEN_LABEL[a]} tone="neutral" />
          ))}
        </View>
      ) : null}
      {traces ? (
        <AppText variant="small" color="muted">
          {`May contain: ${traces}`}
        </AppText>
      ) : null}
    </View>
  );
}

/** The allergen caution, shown once per screen that lists products. */
export function AllergenCaution() {
  return (
    <View style={styles.caution} testID="allergen-caution">
      <Feather name="info" size={18} color={colors.crustInk} />
      <AppText variant="small" color="ink" style={styles.flex}>
        {ALLERGEN_CAUTION}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  allergens: { gap: space.xs },
  chips: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  caution: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", backgroundColor: colors.crustSoft, borderRadius: radii.md, padding: space.md },
  flex: { flex: 1 },
});
