import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError, type ZodTypeAny, type z } from "zod";
import { fieldErrorsFrom } from "../../shared/schemas/common";
import type { FieldErrors } from "../../shared/errors";

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
  const count = Object.keys(fields).length;
  return badRequest(count === 1 ? Object.values(fields)[0] : "Some fields need attention.", fields);
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "route_not_found", `No API route ${req.method} ${req.baseUrl}${req.path}.`));
};

/** The one error handler: every failure leaves as { error: { code, message, fields? } }, never a stack trace. */
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
  } else {
    req.log?.error({ err }, "unhandled error");
    httpError = new HttpError(500, "internal_error", "Something went wrong on our side. Please try again.");
  }
  if (httpError.headers) res.set(httpError.headers);
  const body: Record<string, unknown> = { code: httpError.code, message: httpError.message };
  if (httpError.fields) body.fields = httpError.fields;
  if (httpError.extra) Object.assign(body, httpError.extra);
  res.status(httpError.status).json({ error: body });
};
