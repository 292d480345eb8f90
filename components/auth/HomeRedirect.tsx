import React from "react";
import { Redirect } from "expo-router";
import { useAuth } from "./useAuth";
import { homePathFor } from "./homePath";
import { CheckingSignIn } from "./RoleGate";

/** "/": signed out goes to sign-in, signed in goes to the role's home (no notice: nobody was turned away). */
export function HomeRedirect() {
  const { status, user } = useAuth();
  if (status === "loading") return <CheckingSignIn />;
  return <Redirect href={user ? homePathFor(user.role) : "/sign-in"} />;
}
