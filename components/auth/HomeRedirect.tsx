import React from "react";
import { View } from "react-native";
import { Redirect } from "expo-router";
import { useAuth } from "./useAuth";
import { homePathFor } from "./homePath";
import { LoadingState } from "../ui/States";
import { colors } from "../theme";

/** "/": signed out goes to sign-in, signed in goes to the role's home. */
export function HomeRedirect() {
  const { status, user } = useAuth();
  if (status === "loading") {
    return (
      <View style={{ flex: 1, backgroundColor: colors.page, justifyContent: "center" }}>
        <LoadingState label="Checking your sign-in…" />
      </View>
    );
  }
  if (!user) return <Redirect href="/sign-in" />;
  return <Redirect href={homePathFor(user.role)} />;
}
