import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./client";
import { formulaKeys, productKeys, productionKeys } from "./keys";
import { productsApi } from "./products";
import type { FormulaDto, FormulaInput } from "../../shared/schemas/production";
import type { FormulaVersionDto } from "../../shared/contracts/production";

export type { FormulaVersionDto } from "../../shared/contracts/production";
export { formulaKeys } from "./keys";

export const formulasApi = {
  list: () => api<{ formulas: FormulaDto[] }>("/api/formulas").then((r) => r.formulas),
  get: (id: number, version?: number) => api<{ formula: FormulaDto }>(`/api/formulas/${id}`, { query: { version } }).then((r) => r.formula),
  history: (id: number) => api<{ versions: FormulaVersionDto[] }>(`/api/formulas/${id}/history`).then((r) => r.versions),
  create: (input: FormulaInput) => api<{ formula: FormulaDto }>("/api/formulas", { method: "POST", body: input }).then((r) => r.formula),
  update: (id: number, input: FormulaInput) => api<{ formula: FormulaDto }>(`/api/formulas/${id}`, { method: "PUT", body: input }).then((r) => r.formula),
};

export function useFormulasQuery() {
  return useQuery({ queryKey: formulaKeys.lists(), queryFn: formulasApi.list });
}

/** One formula: its current version, or an earlier one to read. */
export function useFormulaQuery(id: number | null, version?: number) {
  return useQuery({
    queryKey: formulaKeys.detail(id ?? 0, version ?? 0),
    queryFn: () => formulasApi.get(id!, version),
    enabled: !!id && id > 0,
  });
}

export function useFormulaHistoryQuery(id: number | null) {
  return useQuery({ queryKey: formulaKeys.history(id ?? 0), queryFn: () => formulasApi.history(id!), enabled: !!id && id > 0 });
}

function useFormulaSaved() {
  const qc = useQueryClient();
  return (formula: FormulaDto) => {
    qc.setQueryData(formulaKeys.detail(formula.id), formula);
    void qc.invalidateQueries({ queryKey: formulaKeys.all });
    // Unfrozen plans and the forecast use the current version; frozen plans report the difference.
    void qc.invalidateQueries({ queryKey: productionKeys.all });
    // Products take their allergens from their formula.
    void qc.invalidateQueries({ queryKey: productKeys.all });
  };
}

export function useCreateFormulaMutation() {
  const saved = useFormulaSaved();
  return useMutation({ mutationFn: formulasApi.create, onSuccess: saved });
}

/** Save an edit: the server keeps it as the formula's next version. */
export function useUpdateFormulaMutation(id: number) {
  const saved = useFormulaSaved();
  return useMutation({ mutationFn: (input: FormulaInput) => formulasApi.update(id, input), onSuccess: saved });
}

/**
 * Link products to a formula (owner): each product named in `link` gets this formula, each in `unlink`
 * gets none. One PATCH per product, one after the other.
 */
export function useLinkProductsMutation(formulaId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ link, unlink }: { link: number[]; unlink: number[] }) => {
      for (const id of link) await productsApi.update(id, { formulaId });
      for (const id of unlink) await productsApi.update(id, { formulaId: null });
    },
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: productKeys.all });
      void qc.invalidateQueries({ queryKey: formulaKeys.all });
      void qc.invalidateQueries({ queryKey: productionKeys.all });
    },
  });
}
