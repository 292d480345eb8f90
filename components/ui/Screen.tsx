import React from "react";
import { ScrollView, StyleSheet, View, type ViewStyle } from "react-native";
import { colors, layout, space } from "../theme";
import { useIsWide } from "../shell/useIsWide";

export interface ScreenProps {
  children: React.ReactNode;
  /** Narrower column for forms. */
  narrow?: boolean;
  testID?: string;
  /** No scroll view (for screens that manage their own). */
  fixed?: boolean;
  contentStyle?: ViewStyle;
}

/** One page of content: scrolls, centres a column with a max width, pads to the theme. */
export function Screen({ children, narrow, testID, fixed, contentStyle }: ScreenProps) {
  const wide = useIsWide();
  const inner = (
    <View
      style={[
        styles.column,
        { maxWidth: narrow ? layout.formMaxWidth : layout.contentMaxWidth, paddingHorizontal: wide ? space.xxl : space.lg, paddingTop: wide ? space.xxl : space.xl },
        contentStyle,
      ]}
    >
      {children}
    </View>
  );
  if (fixed) {
    return (
      <View style={styles.page} testID={testID}>
        {inner}
      </View>
    );
  }
  return (
    <ScrollView style={styles.page} contentContainerStyle={styles.scrollContent} testID={testID} keyboardShouldPersistTaps="handled">
      {inner}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.page },
  scrollContent: { flexGrow: 1, paddingBottom: space.xxxl },
  column: { width: "100%", alignSelf: "center", gap: space.lg },
});
