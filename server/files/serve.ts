import { pipeline } from "node:stream/promises";
import type { Request, Response } from "express";
import { notFound } from "../http/errors";
import { hashOf, type FileStore, type StoredMime } from "./file-store";

/**
 * How a stored file goes out:
 * - "public-immutable": product photos. Their id is their content hash, so the URL never changes meaning:
 *   `Cache-Control: public, max-age=31536000, immutable` (RFC 9111 §5.2.2; RFC 8246 immutable), ETag = the hash.
 * - "private-attachment": tax certificates. Personal data: `Cache-Control: private, no-store` (RFC 9111 §5.2.2.5,
 *   §5.2.2.7) and `Content-Disposition: attachment` (RFC 6266) so the browser saves it instead of rendering it.
 * Both: the Content-Type of the sniffed bytes and `X-Content-Type-Options: nosniff` (WHATWG Fetch §"X-Content-Type-Options";
 * OWASP File Upload Cheat Sheet), so a browser never guesses another type.
 * Headers are set only once the file is open: a missing file is a 404 JSON like every other API error.
 */
export type ServeAs = { kind: "public-immutable" } | { kind: "private-attachment"; filename: string };

export async function sendStoredFile(req: Request, res: Response, store: FileStore, id: string, as: ServeAs, contentType?: StoredMime): Promise<void> {
  const file = await store.open(id);
  if (!file) throw notFound("That file");
  const headers: Record<string, string> = {
    "Content-Type": contentType ?? file.contentType,
    "X-Content-Type-Options": "nosniff",
    // The file is never a page: no scripts, no plugins, even if opened directly (CSP Level 3 "sandbox", default-src).
    "Content-Security-Policy": "default-src 'none'; sandbox",
  };
  if (as.kind === "public-immutable") {
    const etag = `"${hashOf(id)}"`;
    headers["Cache-Control"] = "public, max-age=31536000, immutable";
    headers.ETag = etag;
    const inm = req.get("if-none-match");
    if (inm && (inm.trim() === "*" || inm.split(",").some((t) => t.trim().replace(/^W\//, "") === etag))) {
      file.stream.destroy();
      res.status(304).set(headers).end(); // RFC 9110 §13.1.2 If-None-Match: weak comparison
      return;
    }
  } else {
    headers["Cache-Control"] = "private, no-store";
    headers["Content-Disposition"] = `attachment; filename="${as.filename.replace(/[^A-Za-z0-9._-]/g, "_")}"`;
  }
  headers["Content-Length"] = String(file.size);
  res.status(200).set(headers);
  try {
    await pipeline(file.stream, res);
  } catch (err) {
    file.stream.destroy();
    // The client went away mid-download: nothing left to answer.
    if (res.headersSent) {
      req.log?.debug?.({ err }, "stored file download ended early");
      return;
    }
    // Nothing sent yet: take the file's headers back, so the error goes out as JSON (express's res.json keeps a
    // Content-Type already set — how a failed certificate download once went out as application/pdf).
    for (const name of Object.keys(headers)) res.removeHeader(name);
    res.status(500);
    throw err;
  }
}
