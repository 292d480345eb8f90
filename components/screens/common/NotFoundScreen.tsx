import React from "react";
import { StyleSheet, View } from "react-native";
import { colors, space } from "../../theme";
import { EmptyState } from "../../ui/States";
import { LinkButton } from "../../ui/LinkButton";
import { BrandMark } from "../../shell/BrandMark";

export function NotFoundScreen() {
  return (
    <View style={styles.page} testID="not-found">
      <View style={styles.column}>
        <BrandMark />
        <EmptyState
          icon="map"
          title="There's no page here"
          message="The address may be mistyped, or the page has moved."
          action={<LinkButton href="/" label="Go to your home" icon="home" />}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.page, justifyContent: "center", padding: space.lg },
  column: { width: "100%", maxWidth: 460, alignSelf: "center", gap: space.xl },
});
