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

  constructor(status: number, code: string, message: string, fields?: FieldErrors, details: Record<string, unknown> = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.details = details;
  }
}

export const NETWORK_MESSAGE = "Panwise can't be reached right now. Check your connection and try again.";

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
}

export function buildUrl(path: string, query?: Query): string {
  const params = Object.entries(query ?? {})
    .filter(([, v]) => v !== undefined && v !== null && v !== "")
    .map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(String(v))}`);
  return `${BASE_URL}${path}${params.length ? `?${params.join("&")}` : ""}`;
}

/** Call the API and return its JSON, or throw an ApiError. */
export async function api<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const { method = "GET", body, query, auth = true, signal } = options;
  const headers: Record<string, string> = { Accept: "application/json" };
  if (body !== undefined) headers["Content-Type"] = "application/json";
  const token = auth ? authToken : null;
  if (token) headers.Authorization = `Bearer ${token}`;

  let res: Response;
  try {
    res = await fetch(buildUrl(path, query), { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal });
  } catch (err) {
    if ((err as { name?: string })?.name === "AbortError") throw err;
    throw new ApiError(0, "network_error", NETWORK_MESSAGE);
  }

  let data: unknown = undefined;
  if (res.status !== 204) {
    const text = await res.text();
    if (text) {
      try {
        data = JSON.parse(text);
      } catch {
        data = undefined;
      }
    }
  }

  if (!res.ok) {
    if (res.status === 401 && token && onUnauthorized) onUnauthorized();
    if (isApiErrorBody(data)) {
      const { code, message, fields, ...details } = data.error;
      throw new ApiError(res.status, code, message, fields, details);
    }
    throw new ApiError(res.status, "http_error", res.status >= 500 ? "Something went wrong on the server. Please try again." : `The request failed (${res.status}).`);
  }
  return data as T;
}
