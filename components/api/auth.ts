import { useMutation, useQuery } from "@tanstack/react-query";
import { api } from "./client";
import { authKeys } from "./keys";
import type { SessionUser, SignInResponse } from "../../shared/schemas/auth";
import type { InvitationPreviewDto } from "../../shared/contracts/auth";

export { authKeys } from "./keys";
/** Who an invitation link is for (shared/contracts/auth.ts). */
export type InvitationPreview = InvitationPreviewDto;

export const authApi = {
  signIn: (body: { email: string; password: string }) => api<SignInResponse>("/api/auth/sign-in", { method: "POST", body, auth: false }),
  me: () => api<{ user: SessionUser }>("/api/auth/me"),
  /** Ends the session on the server (every token of this user stops working). */
  signOut: () => api<void>("/api/auth/sign-out", { method: "POST" }),
  requestPasswordReset: (body: { email: string }) => api<{ message: string }>("/api/auth/password-reset", { method: "POST", body, auth: false }),
  confirmPasswordReset: (body: { token: string; password: string }) =>
    api<SignInResponse>("/api/auth/password-reset/confirm", { method: "POST", body, auth: false }),
  invitation: (token: string) => api<InvitationPreview>(`/api/auth/invitations/${encodeURIComponent(token)}`, { auth: false }),
  acceptInvitation: (body: { token: string; password: string; name: string }) =>
    api<SignInResponse>("/api/auth/invitations/accept", { method: "POST", body, auth: false }),
};

export function useSignInMutation() {
  return useMutation({ mutationFn: authApi.signIn });
}

export function usePasswordResetRequestMutation() {
  return useMutation({ mutationFn: authApi.requestPasswordReset });
}

export function usePasswordResetConfirmMutation() {
  return useMutation({ mutationFn: authApi.confirmPasswordReset });
}

export function useInvitationAcceptMutation() {
  return useMutation({ mutationFn: authApi.acceptInvitation });
}

/** Who an invitation link is for; its error explains a dead link. */
export function useInvitationPreviewQuery(token: string | null) {
  return useQuery({
    queryKey: authKeys.invitation(token ?? ""),
    queryFn: () => authApi.invitation(token ?? ""),
    enabled: !!token,
    staleTime: Infinity,
  });
}
