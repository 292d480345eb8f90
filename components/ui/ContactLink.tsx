import React from "react";
import { Linking, Platform, Pressable, StyleSheet } from "react-native";
import { AppText } from "./Text";
import { layout } from "../theme";

/** The URL a phone number or e-mail address opens (RFC 3966 tel: with only digits and a leading +, RFC 6068 mailto:). */
export function contactUrl(kind: "phone" | "email", value: string): string | null {
  const v = value.trim();
  if (kind === "email") return /^[^\s@]+@[^\s@]+$/.test(v) ? `mailto:${v}` : null;
  const digits = v.replace(/(?!^\+)[^\d]/g, "");
  return digits.replace("+", "").length >= 3 ? `tel:${digits}` : null;
}

/** A phone number or e-mail address that calls or writes when tapped (a real link on the web); "Not given" when empty. */
export function ContactLink({ kind, value, testID }: { kind: "phone" | "email"; value: string | null | undefined; testID?: string }) {
  const url = value ? contactUrl(kind, value) : null;
  if (!value || !url) {
    return (
      <AppText color={value ? "ink" : "muted"} testID={testID} selectable>
        {value || "Not given"}
      </AppText>
    );
  }
  // On the web the link is an <a href> (react-native-web renders href), so the phone or mail app opens as usual.
  const web = Platform.OS === "web" ? ({ href: url } as object) : {};
  return (
    <Pressable
      accessibilityRole="link"
      {...web}
      onPress={Platform.OS === "web" ? undefined : () => void Linking.openURL(url)}
      style={styles.hit}
      testID={testID ? `${testID}-link` : undefined}
    >
      <AppText color="crust" style={styles.text} testID={testID}>
        {value}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  hit: { minHeight: layout.minTouch, justifyContent: "center", alignSelf: "flex-start" },
  text: { textDecorationLine: "underline" },
});
