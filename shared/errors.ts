/** The one error shape every API answer uses: { "error": { code, message, fields?, requestId? } }. */
export type FieldErrors = Record<string, string>;

export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    fields?: FieldErrors;
    /** The answer's X-Request-Id, for a person to quote when asking for help (every server error carries it). */
    requestId?: string;
    [extra: string]: unknown;
  };
}

export function isApiErrorBody(value: unknown): value is ApiErrorBody {
  if (!value || typeof value !== "object") return false;
  const err = (value as { error?: unknown }).error;
  return !!err && typeof err === "object" && typeof (err as { code?: unknown }).code === "string"
    && typeof (err as { message?: unknown }).message === "string";
}
