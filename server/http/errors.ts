import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError, type ZodTypeAny, type z } from "zod";
import { fieldErrorsFrom } from "../../shared/schemas/common";
import type { FieldErrors } from "../../shared/errors";
import { isDatabaseUnavailable } from "../db/retry";

/** Seconds a client is asked to wait when the database is unreachable (a MariaDB restart takes a few). */
export const DB_RETRY_AFTER_SECONDS = 5;

/** An error meant for the client: its status, code and message are sent as they are. */
export class HttpError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields?: FieldErrors,
    public extra?: Record<string, unknown>,
    public headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: FieldErrors) => new HttpError(400, "validation_failed", message, fields);
export const unauthorized = (message = "Sign in to continue.") => new HttpError(401, "unauthorized", message);
export const forbidden = (message = "Your role cannot do that.") => new HttpError(403, "forbidden", message);
export const notFound = (what = "That") => new HttpError(404, "not_found", `${what} was not found.`);
export const conflict = (code: string, message: string, extra?: Record<string, unknown>) => new HttpError(409, code, message, undefined, extra);

/** Parse with a zod schema; a failure becomes a 400 with a message per field. */
export function parse<S extends ZodTypeAny>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw validationError(result.error);
  return result.data;
}

export function validationError(error: ZodError): HttpError {
  const fields = fieldErrorsFrom(error);
  // One message for every field (say, both dates of a range outside the limits) is the message itself.
  const messages = new Set(Object.values(fields));
  return badRequest(messages.size === 1 ? [...messages][0] : "Some fields need attention.", fields);
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "route_not_found", `No API route ${req.method} ${req.baseUrl}${req.path}.`));
};

/** The request's id (server/http/request-id.ts, set by pino-http), as the X-Request-Id header has it. */
function requestIdOf(req: { id?: unknown }, res: { getHeader(name: string): unknown }): string | undefined {
  const id = req.id ?? res.getHeader("X-Request-Id");
  return id === undefined || id === null ? undefined : String(id);
}

/**
 * The one error handler: every failure leaves as { error: { code, message, fields?, requestId } }, never a stack
 * trace. requestId is the X-Request-Id of the answer, for a person to quote.
 */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let httpError: HttpError;
  if (err instanceof HttpError) {
    httpError = err;
  } else if (err instanceof ZodError) {
    httpError = validationError(err);
  } else if (err && typeof err === "object" && "type" in err && (err as { type: string }).type === "entity.too.large") {
    httpError = new HttpError(413, "payload_too_large", "The request body is too large.");
  } else if (err && typeof err === "object" && "type" in err && (err as { type: string }).type === "entity.parse.failed") {
    httpError = badRequest("The request body is not valid JSON.");
  } else if (err instanceof URIError || (err instanceof Error && err.name === "URIError")) {
    // The router's decodeURIComponent of a path parameter failed ("%", "%E0%A4%A"): the client sent a malformed
    // percent-encoding (RFC 3986 §2.1), so a 400 and no error-level log. The router marks these status 400.
    httpError = new HttpError(400, "bad_request", "The address contains a malformed percent-encoding (such as a lone %).");
  } else if (isDatabaseUnavailable(err)) {
    // The database is unreachable (stopped, restarting, out of connections): the transaction was rolled back with its
    // connection, so answer 503 with Retry-After (RFC 9110 §15.6.4 and §10.2.3), not a 500. mysql2's pool drops dead
    // connections and opens new ones when MariaDB is back, with no restart of the server.
    req.log?.warn({ event: "database_unavailable", code: (err as { code?: unknown }).code ?? (err as { driverError?: { code?: unknown } }).driverError?.code }, "database unreachable; answered 503");
    const orderWrite = req.method !== "GET" && req.method !== "HEAD" && /^\/api\/(orders|standing-orders)(\/|$|\?)/.test(req.originalUrl);
    httpError = new HttpError(503, "service_unavailable",
      orderWrite ? "Ordering is briefly unavailable; nothing was saved; try again in a moment." : "Panwise is briefly unavailable; try again in a moment.",
      undefined, undefined, { "Retry-After": String(DB_RETRY_AFTER_SECONDS) });
  } else {
    req.log?.error({ err }, "unhandled error");
    httpError = new HttpError(500, "internal_error", "Something went wrong on our side. Please try again.");
  }
  if (httpError.headers) res.set(httpError.headers);
  const body: Record<string, unknown> = { code: httpError.code, message: httpError.message };
  if (httpError.fields) body.fields = httpError.fields;
  if (httpError.extra) Object.assign(body, httpError.extra);
  const requestId = requestIdOf(req, res);
  if (requestId) body.requestId = requestId;
  res.status(httpError.status).json({ error: body });
};
