import React from "react";
import { StyleSheet, View } from "react-native";
import { space } from "../theme";
import { AppText, Heading } from "./Text";

export interface PageHeaderProps {
  title: string;
  overline?: string;
  subtitle?: string;
  actions?: React.ReactNode;
  testID?: string;
}

/** The page's one level-1 heading, with an optional line above and below it and actions on the right. */
export function PageHeader({ title, overline, subtitle, actions, testID = "page-title" }: PageHeaderProps) {
  return (
    <View style={styles.row}>
      <View style={styles.text}>
        {overline ? (
          <AppText variant="overline" color="crust">
            {overline}
          </AppText>
        ) : null}
        <Heading level={1} variant="display" testID={testID}>
          {title}
        </Heading>
        {subtitle ? <AppText color="muted">{subtitle}</AppText> : null}
      </View>
      {actions ? <View style={styles.actions}>{actions}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", justifyContent: "space-between", gap: space.md, marginBottom: space.xs },
  text: { flexGrow: 1, flexShrink: 1, flexBasis: 260, gap: space.xs },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
