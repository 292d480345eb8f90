import React from "react";
import { View } from "react-native";
import { Redirect, Slot, usePathname } from "expo-router";
import { useAuth } from "./useAuth";
import { homePathFor } from "./homePath";
import { LoadingState } from "../ui/States";
import { colors } from "../theme";

/** Paths a signed-in person may still open (a link from an e-mail explains itself). */
const OPEN_WHEN_SIGNED_IN = ["/set-password"];

/** The (auth) group: sign-in and password screens. Signed-in people go to their home. */
export function SignedOutLayout() {
  const { status, user } = useAuth();
  const pathname = usePathname();
  if (status === "loading") {
    return (
      <View style={{ flex: 1, backgroundColor: colors.page, justifyContent: "center" }}>
        <LoadingState label="Checking your sign-in…" />
      </View>
    );
  }
  if (user && !OPEN_WHEN_SIGNED_IN.includes(pathname)) return <Redirect href={homePathFor(user.role)} />;
  return <Slot />;
}
