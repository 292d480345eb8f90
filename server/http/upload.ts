import type { RequestHandler } from "express";
import multer from "multer";
import sharp from "sharp";
import { HttpError, badRequest } from "./errors";
import { EXT_FOR_MIME, type StoredExt, type StoredMime } from "../files/file-store";

/**
 * The one upload path for photos and certificates:
 * 1. `singleFileUpload` — multer with memory storage, so nothing touches the disk before the bytes are checked,
 *    one file, a byte limit (413), small limits on the other form fields (OWASP File Upload Cheat Sheet: "set a
 *    file size limit", "limit the number of files").
 * 2. `checkUpload` — the type from the bytes (file-type 16 reads the magic numbers), never from the name or the
 *    client's Content-Type (OWASP File Upload Cheat Sheet: "validate the file type, don't trust the Content-Type
 *    header"); then polyglots are refused or neutralised: images are decoded and re-encoded (sharp/libvips), which
 *    keeps the pixels and drops everything else — trailing bytes after PNG IEND / JPEG EOI, HTML, EXIF/XMP
 *    metadata (OWASP File Upload Cheat Sheet: "content disarm & reconstruct"); PDFs must have the header and the
 *    trailer of a PDF and no HTML in the bytes a browser sniffs.
 */

sharp.cache(false); // uploads are decoded once: libvips' operation cache would only hold memory

const MB = 1024 * 1024;
const mb = (bytes: number) => `${Math.round((bytes / MB) * 10) / 10} MB`;

export interface UploadField {
  /** the multipart field name */
  field: string;
  /** what a person calls it: "photo", "certificate file" */
  what: string;
  maxBytes: number;
}

/** Room for the multipart boundaries and the small text fields next to the file. */
const MULTIPART_OVERHEAD = 64 * 1024;

export function tooLarge(u: UploadField): HttpError {
  return new HttpError(413, "payload_too_large", `The ${u.what} is larger than ${mb(u.maxBytes)}. Upload a smaller one.`, { [u.field]: `At most ${mb(u.maxBytes)}.` });
}

/** One file in `field`, kept in memory, at most `maxBytes`; other fields are short text. */
export function singleFileUpload(u: UploadField): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: u.maxBytes, files: 1, fields: 10, fieldSize: 1024, fieldNameSize: 100, parts: 12, headerPairs: 50 },
  }).single(u.field);
  return (req, res, next) => {
    // A declared body far over the limit is refused before any of it is read.
    const declared = Number(req.get("content-length"));
    if (Number.isFinite(declared) && declared > u.maxBytes + MULTIPART_OVERHEAD) {
      res.set("Connection", "close"); // the unread body would otherwise stay on the connection
      return next(tooLarge(u));
    }
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") return next(tooLarge(u));
        if (err.code === "LIMIT_FILE_COUNT" || err.code === "LIMIT_UNEXPECTED_FILE") {
          return next(badRequest(`Send one file, in the field "${u.field}".`, { [u.field]: `Send one ${u.what}.` }));
        }
        return next(badRequest("The form has too many or too long fields.", { [u.field]: `Send the ${u.what} and its details only.` }));
      }
      next(badRequest(`The upload could not be read: send one ${u.what} in the field "${u.field}".`, { [u.field]: `Send one ${u.what}.` }));
    });
  };
}

/** file-type 16 is CommonJS: under tsx its functions arrive on `default`, under Jest on the module itself. */
export async function sniff(buffer: Buffer): Promise<{ mime: string; ext: string } | undefined> {
  const mod = (await import("file-type")) as unknown as { fromBuffer?: typeof import("file-type").fromBuffer; default?: { fromBuffer: typeof import("file-type").fromBuffer } };
  const fromBuffer = mod.fromBuffer ?? mod.default!.fromBuffer;
  return fromBuffer(buffer);
}

export interface CheckRules extends UploadField {
  accept: readonly StoredMime[];
  /** for messages: "a JPEG, PNG or WebP photo" */
  acceptText: string;
  /** images: scale down so neither side is longer (photos); absent = keep the size (certificates must stay legible) */
  maxImageSide?: number;
}

export interface CheckedUpload {
  bytes: Buffer;
  mime: StoredMime;
  ext: StoredExt;
}

const unsupported = (r: CheckRules, why?: string) =>
  new HttpError(415, "unsupported_media_type", why ? `${why} Upload ${r.acceptText}.` : `Upload ${r.acceptText}.`, { [r.field]: why ?? `Upload ${r.acceptText}.` });

/**
 * Decoding limit: 50 megapixels (a 12 MP phone photo is 4032×3024). libvips refuses larger inputs before
 * allocating them (sharp docs: `limitInputPixels`), which stops decompression bombs.
 */
export const MAX_IMAGE_PIXELS = 50_000_000;

/** Check an upload's bytes against the rules; answers the bytes to store (re-encoded for images). */
export async function checkUpload(buffer: Buffer, r: CheckRules): Promise<CheckedUpload> {
  const found = await sniff(buffer);
  const mime = found?.mime as StoredMime | undefined;
  if (!mime || !r.accept.includes(mime)) throw unsupported(r);
  if (mime === "application/pdf") {
    checkPdf(buffer, r);
    return { bytes: buffer, mime, ext: "pdf" };
  }
  return { bytes: await reencodeImage(buffer, mime, r), mime, ext: EXT_FOR_MIME[mime] };
}

async function reencodeImage(buffer: Buffer, mime: StoredMime, r: CheckRules): Promise<Buffer> {
  let meta: sharp.Metadata;
  try {
    meta = await sharp(buffer, { limitInputPixels: false }).metadata(); // header only: no pixels decoded
  } catch {
    throw unsupported(r, `The ${r.what} could not be read as an image.`);
  }
  const pixels = (meta.width ?? 0) * (meta.height ?? 0);
  if (pixels > MAX_IMAGE_PIXELS) {
    throw new HttpError(413, "payload_too_large", `The ${r.what} is ${meta.width}×${meta.height} pixels; at most ${MAX_IMAGE_PIXELS / 1_000_000} megapixels. Scale it down and upload it again.`, { [r.field]: `At most ${MAX_IMAGE_PIXELS / 1_000_000} megapixels.` });
  }
  try {
    // failOn "error": a damaged image is refused rather than stored half-decoded (sharp docs: failOn).
    let img = sharp(buffer, { limitInputPixels: MAX_IMAGE_PIXELS, failOn: "error" }).rotate(); // bake in the EXIF orientation, metadata is dropped
    if (r.maxImageSide) img = img.resize({ width: r.maxImageSide, height: r.maxImageSide, fit: "inside", withoutEnlargement: true });
    img = mime === "image/jpeg" ? img.jpeg({ quality: 88 }) : mime === "image/png" ? img.png() : img.webp({ quality: 88 });
    return await img.timeout({ seconds: 20 }).toBuffer();
  } catch {
    throw unsupported(r, `The ${r.what} could not be read as an image (it may be damaged).`);
  }
}

/**
 * The resource header a browser sniffs is at most 1445 bytes (WHATWG MIME Sniffing §5.2 "reading the resource
 * header"): no HTML may start there. Only tags of 5+ characters are looked for, so binary PDF data does not
 * match by chance.
 */
export const SNIFF_WINDOW = 1445;
const HTML_MARKERS = ["<script", "<html", "<!doctype html", "<head", "<body", "<iframe", "<svg", "<object", "<embed", "<meta", "<style"];

/** The first HTML marker in a buffer's sniffed window, or null. */
export function htmlMarkerIn(buffer: Buffer, window = SNIFF_WINDOW): string | null {
  const head = buffer.subarray(0, window).toString("latin1").toLowerCase();
  return HTML_MARKERS.find((m) => head.includes(m)) ?? null;
}

/**
 * A PDF starts with "%PDF-" (ISO 32000-1:2008 §7.5.2 file header) and ends with the trailer: "startxref", the
 * offset, then "%%EOF" (§7.5.5). Readers look for %%EOF in the last 1024 bytes (Adobe PDF Reference 1.7,
 * Appendix H, implementation note 18), so it must be there.
 */
export function checkPdf(buffer: Buffer, r: CheckRules): void {
  if (!buffer.subarray(0, 5).equals(Buffer.from("%PDF-"))) throw unsupported(r, `The ${r.what} does not start like a PDF.`);
  const tail = buffer.subarray(Math.max(0, buffer.length - 1024)).toString("latin1");
  if (!tail.includes("%%EOF") || !tail.includes("startxref")) throw unsupported(r, `The ${r.what} is not a complete PDF (its end-of-file trailer is missing).`);
  const marker = htmlMarkerIn(buffer);
  if (marker) throw unsupported(r, `The ${r.what} contains web-page code ("${marker}"), which a PDF does not.`);
}
