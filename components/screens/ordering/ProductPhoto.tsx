import React from "react";
import { Image, StyleSheet, View } from "react-native";
import Feather from "@expo/vector-icons/Feather";
import { BASE_URL } from "../../api/client";
import { colors, radii } from "../../theme";

/** Tiles up to this size (CSS px) take the 160 px photo, which is sharp at 2×; larger ones the 640 px one. */
const THUMB_MAX_SIZE = 80;

/** The product's photo at the size that fits the tile, or a drawn stand-in. */
export function ProductPhoto({ url: large, thumbUrl, name, size = 72 }: { url: string | null; thumbUrl?: string | null; name: string; size?: number }) {
  const url = size <= THUMB_MAX_SIZE && thumbUrl ? thumbUrl : large;
  if (url) {
    const src = /^https?:/.test(url) ? url : `${BASE_URL}${url}`;
    return <Image source={{ uri: src }} accessibilityLabel={`Photo of ${name}`} testID="product-photo" style={[styles.photo, { width: size, height: size }]} resizeMode="cover" />;
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
