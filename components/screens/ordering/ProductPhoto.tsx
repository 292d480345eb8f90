import React from "react";
import { Image, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { BASE_URL } from "../../api/client";
import { colors, radii } from "../../theme";

/** The product's photo, or a drawn stand-in. */
export function ProductPhoto({ url, name, size = 72 }: { url: string | null; name: string; size?: number }) {
  if (url) {
    const src = /^https?:/.test(url) ? url : `${BASE_URL}${url}`;
    return <Image source={{ uri: src }} accessibilityLabel={`Photo of ${name}`} style={[styles.photo, { width: size, height: size }]} resizeMode="cover" />;
  }
  return (
    <View style={[styles.photo, styles.noPhoto, { width: size, height: size }]} accessible accessibilityLabel={`No photo of ${name} yet`}>
      <Feather name="image" size={Math.round(size / 3)} color={colors.muted} />
    </View>
  );
}

const styles = StyleSheet.create({
  photo: { borderRadius: radii.md, backgroundColor: colors.sunken },
  noPhoto: { alignItems: "center", justifyContent: "center", borderWidth: 1, borderColor: colors.border },
});
