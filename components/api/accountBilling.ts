import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api, apiBlob, uploadFile, type UploadFile } from "./client";
import { saveBlob } from "./files";
import { accountBillingKeys } from "./keys";
import type { PaymentTerms } from "../../shared/billing";
import type { CertificateListDto, PaymentTermsResponse, ReviewCertificateResponse, ReviewedCertificateDto, TaxCertificateDto, UploadCertificateResponse } from "../../shared/contracts/billing";

export type { CertificateLimitsDto, CertificateListDto, TaxCertificateDto } from "../../shared/contracts/billing";

export { accountBillingKeys } from "./keys";

export const accountBillingApi = {
  setTerms: (accountId: number, paymentTerms: PaymentTerms) => api<PaymentTermsResponse>(`/api/accounts/${accountId}/terms`, { method: "PUT", body: { paymentTerms } }).then((r) => r.paymentTerms),
  certificates: (accountId: number) => api<CertificateListDto>(`/api/accounts/${accountId}/certificates`).then((r) => r.certificates),
  upload: (accountId: number, file: UploadFile, expiresOn: string, onProgress?: (fraction: number) => void) =>
    uploadFile<UploadCertificateResponse>(`/api/accounts/${accountId}/certificates`, {
      method: "POST",
      field: "file",
      file,
      fields: { expiresOn },
      onProgress,
      tooLargeMessage: "The certificate file is larger than 10 MB.",
    }).then((r) => r.certificate),
  review: (id: number, status: ReviewedCertificateDto["status"]) => api<ReviewCertificateResponse>(`/api/certificates/${id}/review`, { method: "POST", body: { status } }).then((r) => r.certificate),
  file: (id: number) => apiBlob(`/api/certificates/${id}/file`),
};

/** The owner changes how an account pays: card on each invoice, or weekly statements on net terms. */
export function useSetTermsMutation(accountId: number) {
  return useMutation({ mutationFn: (terms: PaymentTerms) => accountBillingApi.setTerms(accountId, terms) });
}

export function useCertificatesQuery(accountId: number | null) {
  return useQuery({ queryKey: accountBillingKeys.certificates(accountId ?? 0), queryFn: () => accountBillingApi.certificates(accountId ?? 0), enabled: !!accountId && accountId > 0 });
}

/** Upload a certificate (PDF, JPEG or PNG, at most 10 MB) with its expiry date, with the share sent so far (0..1). */
export function useUploadCertificateMutation(accountId: number) {
  const qc = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: ({ file, expiresOn }: { file: UploadFile; expiresOn: string }) => {
      setProgress(0);
      return accountBillingApi.upload(accountId, file, expiresOn, setProgress);
    },
    onSuccess: () => void qc.invalidateQueries({ queryKey: accountBillingKeys.certificates(accountId) }),
  });
  return Object.assign(mutation, { progress });
}

export function useReviewCertificateMutation(accountId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, status }: { id: number; status: ReviewedCertificateDto["status"] }) => accountBillingApi.review(id, status),
    onSuccess: () => void qc.invalidateQueries({ queryKey: accountBillingKeys.certificates(accountId) }),
  });
}

const EXT: Record<string, string> = { "application/pdf": "pdf", "image/jpeg": "jpg", "image/png": "png" };

export async function downloadCertificate(c: Pick<TaxCertificateDto, "id" | "contentType">): Promise<void> {
  saveBlob(await accountBillingApi.file(c.id), `certificate-${c.id}.${EXT[c.contentType] ?? "bin"}`);
}
