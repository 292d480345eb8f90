import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { accountKeys, officeKeys, userKeys, type AccountListParams } from "./keys";
import type { AccountBuyerDto, AccountDto, AccountInput } from "../../shared/schemas/accounts";

export { accountKeys, type AccountListParams } from "./keys";

export type AccountPatch = Partial<AccountInput>;

export const accountsApi = {
  list: (params: AccountListParams = {}) => api<{ accounts: AccountDto[] }>("/api/accounts", { query: { q: params.q?.trim(), status: params.status } }).then((r) => r.accounts),
  get: (id: number) => api<{ account: AccountDto }>(`/api/accounts/${id}`).then((r) => r.account),
  create: (input: AccountInput) => api<{ account: AccountDto }>("/api/accounts", { method: "POST", body: input }).then((r) => r.account),
  update: (id: number, patch: AccountPatch) => api<{ account: AccountDto }>(`/api/accounts/${id}`, { method: "PATCH", body: patch }).then((r) => r.account),
  buyers: (id: number) => api<{ buyers: AccountBuyerDto[] }>(`/api/accounts/${id}/buyers`).then((r) => r.buyers),
};

/** The account's buyers by name (office). */
export function useAccountBuyersQuery(id: number) {
  return useQuery({ queryKey: accountKeys.buyers(id), queryFn: () => accountsApi.buyers(id), enabled: id > 0 });
}

export function useAccountsQuery(params: AccountListParams = {}, options: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: accountKeys.list(params), queryFn: () => accountsApi.list(params), enabled: options.enabled ?? true });
}

export function useAccountQuery(id: number | null) {
  return useQuery({
    queryKey: accountKeys.detail(id ?? 0),
    queryFn: () => accountsApi.get(id ?? 0),
    enabled: !!id && id > 0,
  });
}

function useAccountSaved() {
  const qc = useQueryClient();
  return (account: AccountDto) => {
    qc.setQueryData(accountKeys.detail(account.id), account);
    void qc.invalidateQueries({ queryKey: accountKeys.lists() });
    void qc.invalidateQueries({ queryKey: officeKeys.all });
    // People lists show account names.
    void qc.invalidateQueries({ queryKey: userKeys.all });
  };
}

export function useCreateAccountMutation() {
  const saved = useAccountSaved();
  return useMutation({ mutationFn: accountsApi.create, onSuccess: saved });
}

export function useUpdateAccountMutation(id: number) {
  const saved = useAccountSaved();
  return useMutation({ mutationFn: (patch: AccountPatch) => accountsApi.update(id, patch), onSuccess: saved });
}
