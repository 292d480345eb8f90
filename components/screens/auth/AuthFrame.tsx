import React from "react";
import { ScrollView, StyleSheet, View } from "react-native";
import { colors, radii, shadow, space } from "../../theme";
import { AppText, Heading } from "../../ui/Text";
import { BrandMark } from "../../shell/BrandMark";
import { useIsWide } from "../../shell/useIsWide";

export interface AuthFrameProps {
  title: string;
  intro?: string;
  children: React.ReactNode;
  testID?: string;
}

/** The signed-out pages: the mark, one card with the form, a short line about Panwise. */
export function AuthFrame({ title, intro, children, testID }: AuthFrameProps) {
  const wide = useIsWide();
  return (
    <ScrollView style={styles.page} contentContainerStyle={[styles.content, wide && styles.contentWide]} keyboardShouldPersistTaps="handled" testID={testID}>
      <View style={styles.column}>
        <View style={styles.brand}>
          <BrandMark size={36} />
          <AppText variant="small" color="muted">
            Wholesale pre-orders and the bake day, in one place.
          </AppText>
        </View>
        <View style={[styles.card, wide && styles.cardWide]}>
          <View style={styles.titleBlock}>
            <Heading level={1} testID="page-title">
              {title}
            </Heading>
            {intro ? <AppText color="muted">{intro}</AppText> : null}
          </View>
          {children}
        </View>
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.page },
  content: { flexGrow: 1, padding: space.lg, paddingTop: space.xxl, paddingBottom: space.xxxl },
  contentWide: { justifyContent: "center" },
  column: { width: "100%", maxWidth: 460, alignSelf: "center", gap: space.xl },
  brand: { gap: space.sm, alignItems: "flex-start" },
  card: {
    backgroundColor: colors.surface,
    borderRadius: radii.xl,
    borderWidth: 1,
    borderColor: colors.border,
    padding: space.xl,
    gap: space.lg,
    ...shadow.card,
  },
  cardWide: { padding: space.xxl },
  titleBlock: { gap: space.xs },
});
