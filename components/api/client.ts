import { Platform } from "react-native";
import { isApiErrorBody, type FieldErrors } from "../../shared/errors";

/**
 * Same origin on the web: the Express server serves both the app and /api. EXPO_PUBLIC_API_URL (inlined at
 * build time) points elsewhere: `npm run dev` sets it for the Expo dev server, a native build would too.
 */
const CONFIGURED_API_URL = (process.env.EXPO_PUBLIC_API_URL ?? "").replace(/\/+$/, "");
export const BASE_URL: string = CONFIGURED_API_URL || (Platform.OS === "web" ? "" : "http://127.0.0.1:8080");

/** An error the API answered with ({ error: { code, message, fields? } }), or one we made up for a failed request. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: FieldErrors;
  readonly details: Record<string, unknown>;
  /** The server's request id for this answer (error.requestId), for a person to quote. */
  readonly requestId?: string;

  constructor(status: number, code: string, message: string, fields?: FieldErrors, details: Record<string, unknown> = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.details = details;
    if (typeof details.requestId === "string") this.requestId = details.requestId;
  }
}

export const NETWORK_MESSAGE = "Panwise can't be reached right now. Check your connection and try again.";
/** A 503 without the API's own message (a proxy in front answered). */
export const UNAVAILABLE_MESSAGE = "Panwise is briefly unavailable. Try again in a moment.";

/** A message fit to show a person, whatever was thrown. */
export function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return "Something went wrong. Please try again.";
}

// The session, as the client sees it. AuthProvider keeps these in step.
let authToken: string | null = null;
let onUnauthorized: (() => void) | null = null;

export function setAuthToken(token: string | null) {
  authToken = token;
}
export function getAuthToken(): string | null {
  return authToken;
}
/** Called when an authenticated call comes back 401 (expired token, turned-off user): sign out. */
export function setUnauthorizedHandler(handler: (() => void) | null) {
  onUnauthorized = handler;
}

export type Query = Record<string, string | number | boolean | null | undefined>;

export interface RequestOptions {
  method?: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  body?: unknown;
  query?: Query;
  /** Send the bearer token (default true). Sign-in and link screens send none. */
  auth?: boolean;
  signal?: AbortSignal;
  /** Extra request headers (e.g. Idempotency-Key). */
  headers?: Record<string, string>;
}

export function buildUrl(path: string, query?: Query): string {
  const params = Object.entries(query ?? {})
    .filter(([, v]) => v !== undefined && v !== null && v !== "")
    .map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(String(v))}`);
  return `${BASE_URL}${path}${params.length ? `?${params.join("&")}` : ""}`;
}

/** Parse a response body's text as JSON, or undefined. */
function parseJson(text: string): unknown {
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

/** The ApiError for a failed answer (and sign out on a 401 to an authenticated call). */
function failure(status: number, data: unknown, sentToken: boolean): ApiError {
  if (status === 401 && sentToken && onUnauthorized) onUnauthorized();
  if (isApiErrorBody(data)) {
    const { code, message, fields, ...details } = data.error;
    return new ApiError(status, code, message, fields, details);
  }
  if (status === 503) return new ApiError(status, "service_unavailable", UNAVAILABLE_MESSAGE);
  return new ApiError(status, "http_error", status >= 500 ? "Something went wrong on the server. Please try again." : `The request failed (${status}).`);
}

// ---- retrying safe requests ----------------------------------------------------------------------

/**
 * Waits before each retry of a GET. GET is a safe method (RFC 9110 §9.2.1), so sending it again changes nothing;
 * POST, PATCH, PUT and DELETE are never retried here (the person presses the button again, with the same
 * Idempotency-Key where the API takes one).
 */
export const SAFE_RETRY_DELAYS_MS = [500, 1000, 2000];
/** The longest Retry-After this client waits for before one retry; a longer one is not worth a spinner. */
export const MAX_RETRY_AFTER_MS = 10_000;

/** Retry-After in milliseconds: delay-seconds or an HTTP-date (RFC 9110 §10.2.3), or null when absent or unreadable. */
export function retryAfterMs(value: string | null | undefined, now = Date.now()): number | null {
  if (!value) return null;
  const text = value.trim();
  if (/^\d+$/.test(text)) return Number(text) * 1000;
  const at = Date.parse(text);
  return Number.isNaN(at) ? null : Math.max(0, at - now);
}

function headerOf(res: Response, name: string): string | null {
  // Some fetch stand-ins (tests, old polyfills) have no Headers object.
  return typeof res.headers?.get === "function" ? res.headers.get(name) : null;
}

function abortError(): Error {
  const err = new Error("The request was cancelled.");
  err.name = "AbortError";
  return err;
}

function pause(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(abortError());
    const onAbort = () => {
      clearTimeout(timer);
      reject(abortError());
    };
    const timer = setTimeout(() => {
      signal?.removeEventListener?.("abort", onAbort);
      resolve();
    }, ms);
    signal?.addEventListener?.("abort", onAbort, { once: true });
  });
}

/**
 * Send a request; for a GET, send it again (a few times, with backoff) when the network failed or the server
 * answered 503 with a Retry-After (the API does so while its database restarts), waiting at least as long as
 * Retry-After asks. Returns the last Response, or throws the network ApiError.
 */
async function sendWithRetries(method: string, send: () => Promise<Response>, signal?: AbortSignal): Promise<Response> {
  const retries = method === "GET" ? SAFE_RETRY_DELAYS_MS.length : 0;
  for (let attempt = 0; ; attempt++) {
    let res: Response | null = null;
    try {
      res = await send();
    } catch (err) {
      if ((err as { name?: string })?.name === "AbortError") throw err;
      if (attempt >= retries) throw new ApiError(0, "network_error", NETWORK_MESSAGE);
    }
    if (res) {
      const after = res.status === 503 ? retryAfterMs(headerOf(res, "Retry-After")) : null;
      if (after === null || attempt >= retries || after > MAX_RETRY_AFTER_MS) return res;
      await pause(Math.max(after, SAFE_RETRY_DELAYS_MS[attempt]), signal);
    } else {
      await pause(SAFE_RETRY_DELAYS_MS[attempt], signal);
    }
  }
}

/** Call the API and return its JSON, or throw an ApiError. */
export async function api<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const { method = "GET", body, query, auth = true, signal, headers: extra } = options;
  const headers: Record<string, string> = { Accept: "application/json", ...extra };
  if (body !== undefined) headers["Content-Type"] = "application/json";
  const token = auth ? authToken : null;
  if (token) headers.Authorization = `Bearer ${token}`;

  const url = buildUrl(path, query);
  const res = await sendWithRetries(method, () => fetch(url, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal }), signal);

  const data: unknown = res.status === 204 ? undefined : parseJson(await res.text());
  if (!res.ok) throw failure(res.status, data, !!token);
  return data as T;
}

/** GET a file the API makes (CSV) as a Blob, with the bearer token. */
export async function apiBlob(path: string, query?: Query): Promise<Blob> {
  const headers: Record<string, string> = {};
  const token = authToken;
  if (token) headers.Authorization = `Bearer ${token}`;
  const url = buildUrl(path, query);
  const res = await sendWithRetries("GET", () => fetch(url, { method: "GET", headers }));
  if (!res.ok) throw failure(res.status, parseJson(await res.text()), !!token);
  return res.blob();
}

/** A file picked for upload: a browser File, or a { uri, name, type } object on native. */
export type UploadFile = Blob | { uri: string; name: string; type: string };

/**
 * Send one file as multipart/form-data. On the web this uses XMLHttpRequest, whose upload.onprogress
 * reports the bytes sent (fetch cannot); elsewhere fetch, with progress jumping to the end.
 */
export async function uploadFile<T>(path: string, options: { method?: "PUT" | "POST"; field: string; file: UploadFile; fileName?: string; onProgress?: (fraction: number) => void; fields?: Record<string, string>; tooLargeMessage?: string }): Promise<T> {
  const { method = "PUT", field, file, fileName, onProgress, fields, tooLargeMessage } = options;
  const form = new FormData();
  // Text fields first: a multipart parser sees them before the file.
  for (const [k, v] of Object.entries(fields ?? {})) form.append(k, v);
  if (typeof Blob !== "undefined" && file instanceof Blob) form.append(field, file, fileName ?? (file as File).name ?? "upload");
  else form.append(field, file as unknown as Blob);
  const token = authToken;
  const url = buildUrl(path);

  if (Platform.OS === "web" && typeof XMLHttpRequest !== "undefined") {
    return new Promise<T>((resolve, reject) => {
      const xhr = new XMLHttpRequest();
      xhr.open(method, url);
      xhr.setRequestHeader("Accept", "application/json");
      if (token) xhr.setRequestHeader("Authorization", `Bearer ${token}`);
      xhr.upload.onprogress = (e) => {
        if (e.lengthComputable && e.total > 0) onProgress?.(Math.min(1, e.loaded / e.total));
      };
      xhr.onload = () => {
        const data = parseJson(xhr.responseText);
        if (xhr.status >= 200 && xhr.status < 300) {
          onProgress?.(1);
          resolve(data as T);
        } else if (xhr.status === 413 && !isApiErrorBody(data)) {
          // A proxy in front may refuse a large body before the API sees it.
          reject(new ApiError(413, "payload_too_large", tooLargeMessage ?? "The photo is larger than 5 MB. Use a smaller one."));
        } else {
          reject(failure(xhr.status, data, !!token));
        }
      };
      xhr.onerror = () => reject(new ApiError(0, "network_error", NETWORK_MESSAGE));
      xhr.send(form);
    });
  }

  const headers: Record<string, string> = { Accept: "application/json" };
  if (token) headers.Authorization = `Bearer ${token}`;
  let res: Response;
  try {
    res = await fetch(url, { method, headers, body: form });
  } catch {
    throw new ApiError(0, "network_error", NETWORK_MESSAGE);
  }
  const data = parseJson(await res.text());
  if (!res.ok) throw failure(res.status, data, !!token);
  onProgress?.(1);
  return data as T;
}
