export { AuthProvider, AuthContext, type AuthContextValue, type AuthStatus } from "./AuthProvider";
export { useAuth, useSignedInUser } from "./useAuth";
export { RoleGate, RequireRole } from "./RoleGate";
export { homePathFor, AREA_HOME } from "./homePath";
