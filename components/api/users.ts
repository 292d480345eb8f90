import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { officeKeys } from "./office";
import { accountKeys } from "./accounts";
import type { UserDto, UserUpdateInput } from "../../shared/schemas/users";

export const userKeys = {
  all: ["users"] as const,
  lists: () => [...userKeys.all, "list"] as const,
  list: (params: { q?: string } = {}) => [...userKeys.lists(), { q: params.q ?? "" }] as const,
  detail: (id: number) => [...userKeys.all, "detail", id] as const,
};

export const usersApi = {
  list: (params: { q?: string } = {}) => api<{ users: UserDto[] }>("/api/users", { query: { q: params.q?.trim() } }).then((r) => r.users),
  get: (id: number) => api<{ user: UserDto }>(`/api/users/${id}`).then((r) => r.user),
  update: (id: number, patch: UserUpdateInput) => api<{ user: UserDto }>(`/api/users/${id}`, { method: "PATCH", body: patch }).then((r) => r.user),
};

export function useUsersQuery(params: { q?: string } = {}) {
  return useQuery({ queryKey: userKeys.list(params), queryFn: () => usersApi.list(params) });
}

export function useUpdateUserMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number; patch: UserUpdateInput }) => usersApi.update(id, patch),
    onSuccess: (user) => {
      qc.setQueryData(userKeys.detail(user.id), user);
      void qc.invalidateQueries({ queryKey: userKeys.lists() });
      void qc.invalidateQueries({ queryKey: officeKeys.all });
      // Buyer counts on accounts change when a buyer is moved or turned off.
      void qc.invalidateQueries({ queryKey: accountKeys.all });
    },
  });
}
