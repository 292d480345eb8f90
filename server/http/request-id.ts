import crypto from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";

/** An incoming X-Request-Id is kept when it is this: at most 128 of A–Z, a–z, 0–9, ".", "_" and "-". */
export const REQUEST_ID_PATTERN = /^[A-Za-z0-9._-]{1,128}$/;

/** The request id a proxy in front sent, when it is safe to log and echo; otherwise null. */
export function acceptedRequestId(header: string | string[] | undefined): string | null {
  const value = Array.isArray(header) ? header[0] : header;
  return value !== undefined && REQUEST_ID_PATTERN.test(value) ? value : null;
}

/**
 * pino-http's genReqId: the caller's X-Request-Id when valid, else a random UUID (RFC 9562 version 4), never a
 * per-process counter (two instances would hand out the same ids). Echoed in the X-Request-Id response header;
 * every error body carries it as error.requestId (server/http/errors.ts), so a person can quote it.
 */
export function requestIdFor(req: IncomingMessage, res: ServerResponse): string {
  const id = acceptedRequestId(req.headers["x-request-id"]) ?? crypto.randomUUID();
  res.setHeader("X-Request-Id", id);
  return id;
}
