import React from "react";
import { StyleSheet, View } from "react-native";
import { Link, type Href } from "expo-router";
import Feather from "@expo/vector-icons/Feather";
import { colors, radii, space } from "../theme";
import { AppText } from "./Text";
import { LinkPressable } from "./LinkPressable";
import { guardLinkPress } from "../shell/leaveGuard";
import { nameFromContent } from "./a11y";

export function StatTile({ label, value, testID }: { label: string; value: number | string; testID?: string }) {
  return (
    <View style={styles.tile} testID={testID} accessible accessibilityLabel={`${label}: ${value}`}>
      <AppText variant="display" color="ink">
        {String(value)}
      </AppText>
      <AppText variant="caption" color="muted">
        {label}
      </AppText>
    </View>
  );
}

/** A figure that opens the screen it comes from (the overview's tiles): the figure, what it is, a line under it. */
export function LinkTile({ href, label, value, detail, alert, testID }: { href: Href; label: string; value: number | string; detail?: string; alert?: boolean; testID?: string }) {
  return (
    <Link href={href} onPress={guardLinkPress} asChild>
      <LinkPressable
        accessibilityRole="link"
        {...nameFromContent(`${label}: ${value}${detail ? `, ${detail}` : ""}`)}
        testID={testID}
        style={StyleSheet.flatten([styles.tile, styles.linkTile, alert && styles.alert])}
        highlightStyle={styles.pressed}
      >
        <View style={styles.top}>
          {/* A long figure (a date and time) in a smaller size, so the tiles stay one line of figures. */}
          <AppText variant={String(value).length > 10 ? "heading" : "display"} color={alert ? "dangerInk" : "ink"} style={styles.value}>
            {String(value)}
          </AppText>
          <Feather name="chevron-right" size={18} color={colors.muted} />
        </View>
        <AppText variant="caption" color="ink">
          {label}
        </AppText>
        {detail ? (
          <AppText variant="small" color="muted">
            {detail}
          </AppText>
        ) : null}
      </LinkPressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  tile: { flexGrow: 1, flexBasis: 90, minWidth: 0, backgroundColor: colors.sunken, borderRadius: radii.md, padding: space.md, gap: space.xxs },
  linkTile: { flexBasis: 150, borderWidth: 1, borderColor: colors.border },
  alert: { backgroundColor: colors.dangerSoft, borderColor: colors.danger },
  pressed: { borderColor: colors.crust },
  top: { flexDirection: "row", alignItems: "flex-start", justifyContent: "space-between", gap: space.xs },
  value: { flexShrink: 1 },
});
