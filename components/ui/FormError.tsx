import React from "react";
import { StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { colors, radii, space } from "../theme";
import { AppText } from "./Text";

export interface FormErrorProps {
  message?: string | null;
  testID?: string;
}

/** The error that belongs to the whole form (or action), shown above it. Renders nothing without a message. */
export function FormError({ message, testID = "form-error" }: FormErrorProps) {
  if (!message) return null;
  return (
    <View style={styles.box} accessibilityRole="alert" accessibilityLiveRegion="assertive" testID={testID}>
      <Feather name="alert-circle" size={18} color={colors.dangerInk} />
      <AppText variant="bodyStrong" color="dangerInk" style={styles.text}>
        {message}
      </AppText>
    </View>
  );
}

export interface NoticeProps {
  message: string;
  tone?: "success" | "info";
  testID?: string;
}

/** A short success or information line. */
export function Notice({ message, tone = "success", testID = "notice" }: NoticeProps) {
  return (
    <View style={[styles.box, tone === "success" ? styles.success : styles.info]} accessibilityLiveRegion="polite" testID={testID}>
      <Feather name={tone === "success" ? "check-circle" : "info"} size={18} color={tone === "success" ? colors.sageInk : colors.crustInk} />
      <AppText variant="bodyStrong" color={tone === "success" ? "sageInk" : "crustInk"} style={styles.text}>
        {message}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    flexDirection: "row",
    gap: space.sm,
    alignItems: "flex-start",
    backgroundColor: colors.dangerSoft,
    borderRadius: radii.md,
    padding: space.md,
  },
  success: { backgroundColor: colors.sageSoft },
  info: { backgroundColor: colors.crustSoft },
  text: { flex: 1 },
});
