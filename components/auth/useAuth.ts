import { useContext } from "react";
import { AuthContext, type AuthContextValue } from "./AuthProvider";

export function useAuth(): AuthContextValue {
  const ctx = useContext(AuthContext);
  if (!ctx) throw new Error("useAuth must be used inside <AuthProvider>.");
  return ctx;
}

/** The signed-in user; only for screens behind a RoleGate. */
export function useSignedInUser() {
  const { user } = useAuth();
  if (!user) throw new Error("useSignedInUser needs a signed-in user (use it behind RoleGate).");
  return user;
}
