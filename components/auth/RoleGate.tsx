import React from "react";
import { Redirect } from "expo-router";
import { View } from "react-native";
import { useAuth } from "./useAuth";
import { homePathFor } from "./homePath";
import { LoadingState } from "../ui/States";
import { colors } from "../theme";
import type { Role } from "../../shared/roles";

export interface RoleGateProps {
  /** Roles that may see what is inside. */
  roles: readonly Role[];
  children: React.ReactNode;
}

/**
 * Signed out: go to sign-in. Signed in with another role: go to that role's own home.
 * Otherwise render the children.
 */
export function RoleGate({ roles, children }: RoleGateProps) {
  const { status, user } = useAuth();
  if (status === "loading") {
    return (
      <View style={{ flex: 1, backgroundColor: colors.page, justifyContent: "center" }}>
        <LoadingState label="Checking your sign-in…" />
      </View>
    );
  }
  if (!user) return <Redirect href="/sign-in" />;
  if (!roles.includes(user.role)) return <Redirect href={homePathFor(user.role)} />;
  return <>{children}</>;
}

/** Inside a group: a screen only some of the group's roles may use sends the rest to their home. */
export function RequireRole({ roles, children }: RoleGateProps) {
  const { user } = useAuth();
  if (!user) return <Redirect href="/sign-in" />;
  if (!roles.includes(user.role)) return <Redirect href={homePathFor(user.role)} />;
  return <>{children}</>;
}
