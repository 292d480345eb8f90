import React from "react";
import { Pressable, StyleSheet } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, radii } from "../../../theme";

export function RoundButton({ icon, label, onPress, testID }: { icon: "chevron-left" | "chevron-right"; label: string; onPress: () => void; testID: string }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} testID={testID} style={({ pressed }) => [styles.round, pressed && styles.roundPressed]}>
      <Feather name={icon} size={26} color={colors.ink} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  round: {
    width: 52,
    height: 52,
    borderRadius: radii.pill,
    borderWidth: 1.5,
    borderColor: colors.inputBorder,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  roundPressed: { backgroundColor: colors.sunken },
});
