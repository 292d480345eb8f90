import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { accountKeys, officeKeys, userKeys, type UserListParams } from "./keys";
import type { UserDto, UserUpdateInput } from "../../shared/schemas/users";

export { userKeys } from "./keys";

export const usersApi = {
  list: (params: UserListParams = {}) => api<{ users: UserDto[] }>("/api/users", { query: { q: params.q?.trim() } }).then((r) => r.users),
  get: (id: number) => api<{ user: UserDto }>(`/api/users/${id}`).then((r) => r.user),
  update: (id: number, patch: UserUpdateInput) => api<{ user: UserDto }>(`/api/users/${id}`, { method: "PATCH", body: patch }).then((r) => r.user),
};

export function useUsersQuery(params: UserListParams = {}) {
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
