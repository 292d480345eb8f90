import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { invitationKeys, officeKeys } from "./keys";
import type { InvitationCreateInput, InvitationDto } from "../../shared/schemas/users";

export { invitationKeys } from "./keys";

export const invitationsApi = {
  list: () => api<{ invitations: InvitationDto[] }>("/api/invitations").then((r) => r.invitations),
  create: (input: InvitationCreateInput) => api<{ invitation: InvitationDto }>("/api/invitations", { method: "POST", body: input }).then((r) => r.invitation),
  revoke: (id: number) => api<void>(`/api/invitations/${id}`, { method: "DELETE" }),
  resend: (id: number) => api<{ invitation: InvitationDto }>(`/api/invitations/${id}/resend`, { method: "POST" }).then((r) => r.invitation),
};

export function useInvitationsQuery() {
  return useQuery({ queryKey: invitationKeys.list(), queryFn: invitationsApi.list });
}

function useInvalidateInvitations() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: invitationKeys.all });
    void qc.invalidateQueries({ queryKey: officeKeys.all });
  };
}

export function useCreateInvitationMutation() {
  const invalidate = useInvalidateInvitations();
  return useMutation({ mutationFn: invitationsApi.create, onSuccess: invalidate });
}

/** A new link for the same person, the old one no longer working. */
export function useResendInvitationMutation() {
  const invalidate = useInvalidateInvitations();
  return useMutation({ mutationFn: invitationsApi.resend, onSuccess: invalidate });
}

export function useRevokeInvitationMutation() {
  const invalidate = useInvalidateInvitations();
  return useMutation({ mutationFn: invitationsApi.revoke, onSuccess: invalidate });
}
