import React from "react";
import { Redirect } from "expo-router";
import { View } from "react-native";
import { useAuth } from "./useAuth";
import { homePathFor } from "./homePath";
import { LoadingState } from "../ui/States";
import { colors } from "../theme";

/** "/": signed out goes to sign-in, signed in goes to the role's home (no notice: nobody was turned away). */
export function HomeRedirect() {
  const { status, user } = useAuth();
  if (status === "loading") {
    return (
      <View style={{ flex: 1, backgroundColor: colors.page, justifyContent: "center" }}>
        <LoadingState label="Checking your sign-in…" />
      </View>
    );
  }
  return <Redirect href={user ? homePathFor(user.role) : "/sign-in"} />;
}
