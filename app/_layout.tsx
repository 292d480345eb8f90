import React, { useEffect, useState } from "react";
import { View } from "react-native";
import { Slot } from "expo-router";
import { useFonts } from "expo-font";
import { Nunito_400Regular } from "@expo-google-fonts/nunito/400Regular";
import { Nunito_600SemiBold } from "@expo-google-fonts/nunito/600SemiBold";
import { Nunito_700Bold } from "@expo-google-fonts/nunito/700Bold";
import { Nunito_800ExtraBold } from "@expo-google-fonts/nunito/800ExtraBold";
import { AppProviders } from "@/components/AppProviders";
import { colors } from "@/components/theme";

/** Give up waiting for the fonts after this long and show the app in the fallback font. */
const FONT_WAIT_MS = 2500;

export default function RootLayout() {
  const [fontsLoaded, fontError] = useFonts({ Nunito_400Regular, Nunito_600SemiBold, Nunito_700Bold, Nunito_800ExtraBold });
  const [waitedEnough, setWaitedEnough] = useState(false);
  useEffect(() => {
    const t = setTimeout(() => setWaitedEnough(true), FONT_WAIT_MS);
    return () => clearTimeout(t);
  }, []);

  if (!fontsLoaded && !fontError && !waitedEnough) return <View style={{ flex: 1, backgroundColor: colors.page }} />;
  return (
    <AppProviders>
      <Slot />
    </AppProviders>
  );
}
