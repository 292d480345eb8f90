import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, uploadFile, type UploadFile } from "./client";
import { formulaKeys, productKeys, productionKeys, type ProductListParams } from "./keys";
import type { ProductDto, ProductInput } from "../../shared/schemas/catalog";

export { productKeys, type ProductListParams } from "./keys";

export type ProductPatch = Partial<ProductInput>;

export const productsApi = {
  list: (params: ProductListParams = {}) => api<{ products: ProductDto[] }>("/api/products", { query: { all: params.all ? 1 : undefined } }).then((r) => r.products),
  get: (id: number) => api<{ product: ProductDto }>(`/api/products/${id}`).then((r) => r.product),
  create: (input: ProductInput) => api<{ product: ProductDto }>("/api/products", { method: "POST", body: input }).then((r) => r.product),
  update: (id: number, patch: ProductPatch) => api<{ product: ProductDto }>(`/api/products/${id}`, { method: "PATCH", body: patch }).then((r) => r.product),
  archive: (id: number) => api<{ product: ProductDto }>(`/api/products/${id}/archive`, { method: "POST" }).then((r) => r.product),
  uploadPhoto: (id: number, file: UploadFile, onProgress?: (fraction: number) => void) =>
    uploadFile<{ product: ProductDto }>(`/api/products/${id}/photo`, { method: "PUT", field: "photo", file, onProgress }).then((r) => r.product),
};

export function useProductsQuery(params: ProductListParams = {}) {
  return useQuery({ queryKey: productKeys.list(params), queryFn: () => productsApi.list(params) });
}

export function useProductQuery(id: number | null) {
  return useQuery({ queryKey: productKeys.detail(id ?? 0), queryFn: () => productsApi.get(id ?? 0), enabled: !!id && id > 0 });
}

function useProductSaved() {
  const qc = useQueryClient();
  return (product: ProductDto) => {
    qc.setQueryData(productKeys.detail(product.id), product);
    void qc.invalidateQueries({ queryKey: productKeys.lists() });
    // Its formula, components and bake feed the plans and the forecast; formulas list their products.
    void qc.invalidateQueries({ queryKey: productionKeys.all });
    void qc.invalidateQueries({ queryKey: formulaKeys.all });
  };
}

export function useCreateProductMutation() {
  const saved = useProductSaved();
  return useMutation({ mutationFn: productsApi.create, onSuccess: saved });
}

export function useUpdateProductMutation(id: number) {
  const saved = useProductSaved();
  return useMutation({ mutationFn: (patch: ProductPatch) => productsApi.update(id, patch), onSuccess: saved });
}

export function useArchiveProductMutation(id: number) {
  const saved = useProductSaved();
  return useMutation({ mutationFn: () => productsApi.archive(id), onSuccess: saved });
}

/** Upload a product photo, with the share sent so far (0..1) for a progress bar. */
export function useUploadProductPhotoMutation(id: number) {
  const saved = useProductSaved();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (file: UploadFile) => {
      setProgress(0);
      return productsApi.uploadPhoto(id, file, setProgress);
    },
    onSuccess: saved,
  });
  return Object.assign(mutation, { progress });
}
