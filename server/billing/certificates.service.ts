import { DateTime } from "luxon";
import type { AppContext } from "../http/context";
import { HttpError, badRequest, conflict, notFound } from "../http/errors";
import type { SessionUser } from "../../shared/schemas/auth";
import { localToday } from "../../shared/calendar";
import { getBakery } from "../bakery/bakery.service";
import { CustomerAccount } from "../accounts/account.entity";
import { TaxCertificate } from "./tax-certificate.entity";
import { certificateStore, STORED_TYPES, type StoredMime } from "../files/file-store";
import { checkUpload, type CheckRules, type CheckedUpload } from "../http/upload";
import { resolveAccount } from "../calendar/calendar.service";
import type { CertificateListDto, ReviewedCertificateDto, UploadedCertificateDto } from "../../shared/contracts/billing";

/**
 * Resale / tax-exemption certificates: a buyer (own account) or the owner uploads one with its expiry date,
 * the owner approves or rejects it. Limits, so one account cannot fill the disk (OWASP File Upload Cheat Sheet:
 * "set a file size limit" and a per-user storage quota; the figures are the bakery's choice, documented here and
 * in the API answers):
 * - one file at most 10 MB (a scanned certificate is usually well under 1 MB);
 * - at most 10 certificates and 20 MB stored per account, whatever their status (rejected ones stay on file
 *   as part of the tax records);
 * - the expiry date from today to five years ahead, in the bakery's time zone by the server clock (common
 *   practice, no source: US state resale certificates run from one year to about four years or do not expire;
 *   a date more than five years ahead is almost always a typing error).
 */
export const CERTIFICATE_MAX_BYTES = 10 * 1024 * 1024;
export const CERTIFICATES_PER_ACCOUNT = 10;
export const CERTIFICATE_BYTES_PER_ACCOUNT = 20 * 1024 * 1024;
export const CERTIFICATE_MAX_YEARS = 5;

export const CERTIFICATE_UPLOAD: CheckRules = {
  field: "file",
  what: "certificate file",
  maxBytes: CERTIFICATE_MAX_BYTES,
  accept: ["application/pdf", "image/jpeg", "image/png"],
  acceptText: "the certificate as a PDF, JPEG or PNG",
};

/** The expiry dates accepted today: [today, today + 5 years], local dates in the bakery's zone (luxon). */
export async function expiryRange(ctx: AppContext): Promise<{ from: string; to: string }> {
  const zone = (await getBakery(ctx)).timeZone;
  const from = localToday(ctx.clock.now(), zone);
  const to = DateTime.fromISO(from, { zone }).plus({ years: CERTIFICATE_MAX_YEARS }).toISODate()!;
  return { from, to };
}

/** Both sides are YYYY-MM-DD with a four-digit year (dateSchema), so string order is date order. */
export function checkExpiry(expiresOn: string, range: { from: string; to: string }): void {
  if (expiresOn < range.from || expiresOn > range.to) {
    const message = `The expiry date must be between today (${range.from}) and ${range.to}, five years ahead.`;
    throw badRequest(message, { expiresOn: message });
  }
}

async function usage(ctx: AppContext, accountId: number, m = ctx.dataSource.manager): Promise<{ count: number; bytes: number }> {
  const row = await m
    .getRepository(TaxCertificate)
    .createQueryBuilder("c")
    .select("COUNT(*)", "count")
    .addSelect("COALESCE(SUM(c.sizeBytes), 0)", "bytes")
    .where("c.accountId = :accountId", { accountId })
    .getRawOne<{ count: string; bytes: string }>();
  return { count: Number(row?.count ?? 0), bytes: Number(row?.bytes ?? 0) };
}

const mb = (bytes: number) => `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;

/** 409 when the account has its 10 certificates, 413 when adding `bytes` would pass 20 MB. */
function assertRoom(current: { count: number; bytes: number }, bytes: number): void {
  if (current.count >= CERTIFICATES_PER_ACCOUNT) {
    throw conflict(
      "certificate_quota",
      `This account already has ${current.count} certificates on file, the most one account can keep (${CERTIFICATES_PER_ACCOUNT}). Contact the bakery if one needs replacing.`,
      { limit: CERTIFICATES_PER_ACCOUNT },
    );
  }
  if (current.bytes + bytes > CERTIFICATE_BYTES_PER_ACCOUNT) {
    const left = Math.max(0, CERTIFICATE_BYTES_PER_ACCOUNT - current.bytes);
    throw new HttpError(
      413,
      "storage_quota",
      `An account can keep at most ${mb(CERTIFICATE_BYTES_PER_ACCOUNT)} of certificates; this account uses ${mb(current.bytes)}, so this file (${mb(bytes)}) does not fit. ${left > 0 ? `Upload a file under ${mb(left)} (a scan at 150 dpi usually is).` : "Contact the bakery if one needs replacing."}`,
      { file: `At most ${mb(left)} left for this account.` },
      { limitBytes: CERTIFICATE_BYTES_PER_ACCOUNT, usedBytes: current.bytes },
    );
  }
}

/** Before reading an upload's body: refuse at once when the account has no room left at all. */
export async function assertRoomBeforeUpload(ctx: AppContext, accountId: number): Promise<void> {
  assertRoom(await usage(ctx, accountId), 0);
}

export async function listCertificates(ctx: AppContext, accountId: number): Promise<CertificateListDto> {
  const rows = await ctx.dataSource.getRepository(TaxCertificate).find({ where: { accountId }, order: { id: "DESC" } });
  const range = await expiryRange(ctx);
  const used = await usage(ctx, accountId);
  return {
    certificates: rows.map((c) => ({ id: c.id, status: c.status, expiresOn: c.expiresOn, expired: c.expiresOn < range.from, contentType: c.contentType, sizeBytes: c.sizeBytes, createdAt: c.createdAt.toISOString() })),
    limits: { maxCount: CERTIFICATES_PER_ACCOUNT, maxBytesPerAccount: CERTIFICATE_BYTES_PER_ACCOUNT, maxFileBytes: CERTIFICATE_MAX_BYTES, count: used.count, usedBytes: used.bytes, expiresFrom: range.from, expiresTo: range.to },
  };
}

/** An account's certificates, for a user who may see them (a buyer only their own account's: 404 otherwise). */
export async function listCertificatesFor(ctx: AppContext, user: SessionUser, accountId: number): Promise<CertificateListDto> {
  const account = await resolveAccount(ctx, user, accountId);
  return listCertificates(ctx, account.id);
}

/** Before the upload's body is read: the account exists and is the buyer's own, and it has room left. */
export async function checkBeforeUpload(ctx: AppContext, user: SessionUser, accountId: number): Promise<void> {
  const account = await resolveAccount(ctx, user, accountId);
  await assertRoomBeforeUpload(ctx, account.id);
}

/** The uploaded file (read into memory by server/http/upload.ts): expiry in range, bytes checked, then stored. */
export async function uploadCertificate(ctx: AppContext, user: SessionUser, accountId: number, expiresOn: string, file: Buffer | undefined): Promise<UploadedCertificateDto> {
  const account = await resolveAccount(ctx, user, accountId);
  checkExpiry(expiresOn, await expiryRange(ctx));
  if (!file) throw badRequest("Attach the certificate (PDF, JPEG or PNG).", { file: "Attach the certificate." });
  const checked = await checkUpload(file, CERTIFICATE_UPLOAD);
  return addCertificate(ctx, account.id, checked, expiresOn);
}

/**
 * Store a checked upload for an account. The account row is locked (SELECT … FOR UPDATE) while the quota is
 * counted and the row inserted, so concurrent uploads cannot pass the limit together.
 */
export async function addCertificate(ctx: AppContext, accountId: number, upload: CheckedUpload, expiresOn: string): Promise<UploadedCertificateDto> {
  checkExpiry(expiresOn, await expiryRange(ctx));
  const store = certificateStore(ctx.config);
  return ctx.dataSource.transaction(async (m) => {
    const account = await m.getRepository(CustomerAccount).createQueryBuilder("a").setLock("pessimistic_write").where("a.id = :id", { id: accountId }).getOne();
    if (!account) throw notFound("That account");
    assertRoom(await usage(ctx, accountId, m), upload.bytes.length);
    const file = await store.save(upload.bytes, upload.ext);
    const row = await m.getRepository(TaxCertificate).save({ accountId, file, contentType: upload.mime, sizeBytes: upload.bytes.length, status: "pending", expiresOn, reviewedById: null });
    return { id: row.id, status: row.status, expiresOn: row.expiresOn, sizeBytes: row.sizeBytes };
  });
}

export async function reviewCertificate(ctx: AppContext, reviewer: SessionUser, id: number, status: ReviewedCertificateDto["status"]): Promise<ReviewedCertificateDto> {
  const repo = ctx.dataSource.getRepository(TaxCertificate);
  if (!(await repo.existsBy({ id }))) throw notFound("That certificate");
  await repo.update({ id }, { status, reviewedById: reviewer.id });
  return { id, status };
}

/** The certificate a user may download: office roles any, a buyer only their own account's (404 otherwise). */
export async function certificateFor(ctx: AppContext, user: SessionUser, id: number): Promise<{ row: TaxCertificate; contentType: StoredMime; filename: string }> {
  const row = await ctx.dataSource.getRepository(TaxCertificate).findOneBy({ id });
  if (!row || (user.role === "buyer" && user.accountId !== row.accountId)) throw notFound("That certificate");
  const ext = (Object.keys(STORED_TYPES) as (keyof typeof STORED_TYPES)[]).find((k) => STORED_TYPES[k] === row.contentType);
  if (!ext) throw notFound("That certificate's file");
  return { row, contentType: STORED_TYPES[ext], filename: `certificate-${row.id}.${ext}` };
}
