import React, { useEffect } from "react";
import { Redirect } from "expo-router";
import { View } from "react-native";
import { useAuth } from "./useAuth";
import { homePathFor } from "./homePath";
import { LoadingState } from "../ui/States";
import { colors } from "../theme";
import type { Role } from "../../shared/roles";
import { roleRedirectMessage, setRedirectNotice } from "../shell/redirectNotice";

export interface RoleGateProps {
  /** Roles that may see what is inside. */
  roles: readonly Role[];
  children: React.ReactNode;
}

/**
 * Signed out: go to sign-in. Signed in with another role: go to that role's own home, which says why.
 * Otherwise render the children.
 */
export function RoleGate({ roles, children }: RoleGateProps) {
  const { status, user } = useAuth();
  if (status === "loading") return <CheckingSignIn />;
  if (!user) return <Redirect href="/sign-in" />;
  if (!roles.includes(user.role)) return <RoleRedirect roles={roles} role={user.role} />;
  return <>{children}</>;
}

/** While the stored session is being checked. */
export function CheckingSignIn() {
  return (
    <View style={{ flex: 1, backgroundColor: colors.page, justifyContent: "center" }}>
      <LoadingState label="Checking your sign-in…" />
    </View>
  );
}

/** Back to the person's own home, with a sentence there saying why (components/shell/redirectNotice.ts). */
function RoleRedirect({ roles, role }: { roles: readonly Role[]; role: Role }) {
  const home = homePathFor(role);
  const message = roles.length > 0 ? roleRedirectMessage(roles, role) : null;
  useEffect(() => {
    if (message) setRedirectNotice(message, home);
  }, [message, home]);
  return <Redirect href={home} />;
}

/** Inside a group: a screen only some of the group's roles may use sends the rest to their home. */
export function RequireRole({ roles, children }: RoleGateProps) {
  const { user } = useAuth();
  if (!user) return <Redirect href="/sign-in" />;
  if (!roles.includes(user.role)) return <RoleRedirect roles={roles} role={user.role} />;
  return <>{children}</>;
}
