import React from "react";
import { Pressable, StyleSheet } from "react-native";
import { Link, type Href } from "expo-router";
import { layout } from "../theme";
import { AppText } from "./Text";
import { guardLinkPress } from "../shell/leaveGuard";

export interface TextLinkProps {
  href: Href;
  label: string;
  testID?: string;
}

/** An in-app link that looks like a link and is still a 44 px touch target. */
export function TextLink({ href, label, testID }: TextLinkProps) {
  return (
    <Link href={href} onPress={guardLinkPress} asChild>
      <Pressable accessibilityRole="link" style={styles.hit} testID={testID}>
        <AppText variant="label" color="crust" style={styles.text}>
          {label}
        </AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  hit: { minHeight: layout.minTouch, justifyContent: "center", alignSelf: "flex-start" },
  text: { textDecorationLine: "underline" },
});
