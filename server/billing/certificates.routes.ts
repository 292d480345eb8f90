import { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { singleFileUpload } from "../http/upload";
import { certificateStore } from "../files/file-store";
import { sendStoredFile } from "../files/serve";
import * as certificates from "./certificates.service";
import { certificateReviewSchema, certificateUploadSchema, idParamSchema } from "../../shared/schemas/billing";
import type { CertificateListDto, ReviewCertificateResponse, UploadCertificateResponse } from "../../shared/contracts/billing";

/**
 * Resale / tax-exemption certificates of an account (mounted at /accounts): buyers upload their own, the owner too.
 * Quotas per account and the expiry range: certificates.service.ts; bytes checked and polyglots refused or
 * re-encoded: server/http/upload.ts; stored by content hash: server/files/file-store.ts.
 */
export function accountCertificateRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get("/:id/certificates", allow("owner", "bookkeeper", "buyer"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.json((await certificates.listCertificatesFor(ctx, currentUser(req), id)) satisfies CertificateListDto);
  });
  r.post("/:id/certificates", allow("owner", "buyer"), async (req, _res, next) => {
    // Before the body is read: the account exists and is the buyer's own, and it has room left.
    const { id } = parse(idParamSchema, req.params);
    await certificates.checkBeforeUpload(ctx, currentUser(req), id);
    next();
  }, singleFileUpload(certificates.CERTIFICATE_UPLOAD), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const { expiresOn } = parse(certificateUploadSchema, req.body);
    const certificate = await certificates.uploadCertificate(ctx, currentUser(req), id, expiresOn, req.file?.buffer);
    res.status(201).json({ certificate } satisfies UploadCertificateResponse);
  });
  return r;
}

/** One certificate: the owner approves or rejects it; office roles and its own buyer download it. */
export function certificateRoutes(ctx: AppContext): Router {
  const r = Router();
  r.post("/:id/review", allow("owner"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const { status } = parse(certificateReviewSchema, req.body);
    res.json({ certificate: await certificates.reviewCertificate(ctx, currentUser(req), id, status) } satisfies ReviewCertificateResponse);
  });
  /** Downloaded, never shown inline or cached: attachment, private no-store, nosniff (server/files/serve.ts). */
  r.get("/:id/file", allow("owner", "bookkeeper", "buyer"), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const c = await certificates.certificateFor(ctx, currentUser(req), id);
    await sendStoredFile(req, res, certificateStore(ctx.config), c.row.file, { kind: "private-attachment", filename: c.filename }, c.contentType);
  });
  return r;
}
