import React from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { AppText } from "../../../ui/Text";
import type { UnitSystem } from "../../../../shared/units";
import { colors, layout, radii, space } from "../../../theme";

/** Grams and °C, or pounds/ounces and °F: a two-way switch that stays put on this device. */
export function UnitsSwitch({ system, onChange }: { system: UnitSystem; onChange: (s: UnitSystem) => void }) {
  const options: { value: UnitSystem; label: string; a11y: string }[] = [
    { value: "metric", label: "g · °C", a11y: "Grams and degrees Celsius" },
    { value: "us", label: "lb, oz · °F", a11y: "Pounds, ounces and degrees Fahrenheit" },
  ];
  return (
    <View style={styles.units} testID="units">
      <AppText variant="label" color="muted">
        Units
      </AppText>
      <View style={styles.segments} accessibilityRole="radiogroup" accessibilityLabel="Units">
        {options.map((o, i) => {
          const on = o.value === system;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              aria-checked={on}
              accessibilityLabel={o.a11y}
              onPress={() => onChange(o.value)}
              testID={`units-${o.value}`}
              style={({ pressed }) => [styles.segment, i > 0 && styles.segmentNext, on && styles.segmentOn, pressed && !on && styles.segmentPressed]}
            >
              <AppText variant="label" color={on ? "onPrimary" : "ink"}>
                {o.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  units: { flexDirection: "row", alignItems: "center", gap: space.sm },
  segments: { flexDirection: "row", borderWidth: 1.5, borderColor: colors.inputBorder, borderRadius: radii.pill, overflow: "hidden", backgroundColor: colors.surface },
  segment: { minHeight: layout.minTouch, minWidth: 88, paddingHorizontal: space.md, alignItems: "center", justifyContent: "center" },
  segmentNext: { borderLeftWidth: 1.5, borderLeftColor: colors.inputBorder },
  segmentOn: { backgroundColor: colors.primary },
  segmentPressed: { backgroundColor: colors.sunken },
});
