import type { Metadata } from "./types";

/**
 * Stripe-style errors and the parameter parsing the endpoints share. Bodies arrive form-encoded and
 * parsed by qs, so every value is a string (or a nested object/array of strings): integers and
 * booleans are coerced here, and unknown parameters are refused as Stripe refuses them.
 */

export type ErrorType = "invalid_request_error" | "card_error" | "idempotency_error" | "api_error";

export interface StripeErrorBody {
  type: ErrorType;
  message: string;
  code?: string;
  decline_code?: string;
  param?: string;
  doc_url?: string;
  charge?: string;
  payment_intent?: unknown;
}

export class StripeApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: StripeErrorBody,
  ) {
    super(body.message);
  }
}

export const invalid = (message: string, param?: string, code?: string, status = 400) =>
  new StripeApiError(status, { type: "invalid_request_error", message, ...(code ? { code, doc_url: `https://stripe.com/docs/error-codes/${code.replace(/_/g, "-")}` } : {}), ...(param ? { param } : {}) });

export const missing = (param: string) => invalid(`Missing required param: ${param}.`, param, "parameter_missing");

const OBJECT_NAMES: Record<string, string> = {
  cus: "customer", cs: "checkout.session", pi: "payment_intent", ch: "charge", re: "refund", po: "payout", txn: "balance_transaction", evt: "event",
};

export function objectNameFor(id: string): string {
  return OBJECT_NAMES[id.split("_")[0]!] ?? "object";
}

export const noSuch = (id: string, param = "id", status = 404) =>
  invalid(`No such ${objectNameFor(id)}: '${id}'`, param, "resource_missing", status);

export type Params = Record<string, unknown>;

export function asParams(v: unknown): Params {
  return v && typeof v === "object" && !Array.isArray(v) ? (v as Params) : {};
}

/** Refuses parameters the endpoint does not take (the fake supports a subset; Stripe refuses typos). */
export function allowOnly(params: Params, allowed: readonly string[], prefix = ""): void {
  for (const key of Object.keys(params)) {
    if (key === "expand" && !prefix) continue;
    if (!allowed.includes(key)) {
      const name = prefix ? `${prefix}[${key}]` : key;
      throw invalid(`Received unknown parameter: ${name}`, name, "parameter_unknown");
    }
  }
}

export function str(params: Params, name: string, opts: { required?: boolean; max?: number; label?: string } = {}): string | undefined {
  const label = opts.label ?? name;
  const v = params[name];
  if (v === undefined || v === "") {
    if (opts.required) throw missing(label);
    return undefined;
  }
  if (typeof v !== "string") throw invalid(`Invalid string: ${label} must be a string.`, label, "parameter_invalid_string");
  if (opts.max !== undefined && v.length > opts.max) throw invalid(`Invalid string: must be at most ${opts.max} characters (${label}).`, label, "parameter_invalid_string");
  return v;
}

export function int(params: Params, name: string, opts: { required?: boolean; min?: number; max?: number; label?: string } = {}): number | undefined {
  const label = opts.label ?? name;
  const v = params[name];
  if (v === undefined || v === "") {
    if (opts.required) throw missing(label);
    return undefined;
  }
  const n = typeof v === "number" ? v : typeof v === "string" && /^-?\d+$/.test(v.trim()) ? Number(v.trim()) : NaN;
  if (!Number.isSafeInteger(n)) throw invalid(`Invalid integer: ${typeof v === "string" ? v : JSON.stringify(v)}`, label, "parameter_invalid_integer");
  if (opts.min !== undefined && n < opts.min) {
    throw invalid(opts.min === 1 ? `Invalid positive integer` : `This value must be greater than or equal to ${opts.min}.`, label, "parameter_invalid_integer");
  }
  if (opts.max !== undefined && n > opts.max) throw invalid(`This value must be less than or equal to ${opts.max}.`, label, "parameter_invalid_integer");
  return n;
}

export function oneOf<T extends string>(params: Params, name: string, values: readonly T[], opts: { required?: boolean; label?: string } = {}): T | undefined {
  const label = opts.label ?? name;
  const v = str(params, name, opts);
  if (v === undefined) return undefined;
  if (!(values as readonly string[]).includes(v)) throw invalid(`Invalid ${label}: must be one of ${values.join(", ")}`, label, "parameter_invalid_string");
  return v as T;
}

export function object(params: Params, name: string, label = name): Params | undefined {
  const v = params[name];
  if (v === undefined || v === "") return undefined;
  if (!v || typeof v !== "object" || Array.isArray(v)) throw invalid(`Invalid object`, label, "parameter_invalid_object");
  return v as Params;
}

/**
 * qs turns `a[0]=x&a[1]=y` into an array, but above 20 indexes it falls back to an object with
 * numeric keys; both mean an array here.
 */
export function array(params: Params, name: string, label = name): unknown[] | undefined {
  const v = params[name];
  if (v === undefined || v === "") return undefined;
  if (Array.isArray(v)) return v;
  if (v && typeof v === "object" && Object.keys(v).every((k) => /^\d+$/.test(k))) {
    return Object.entries(v as Params).sort(([a], [b]) => Number(a) - Number(b)).map(([, x]) => x);
  }
  throw invalid(`Invalid array`, label, "parameter_invalid_array");
}

/** Stripe's metadata limits: 50 keys, key up to 40 characters, value up to 500; empty values unset a key. */
export function metadata(params: Params, name: string, label = name, base: Metadata = {}): Metadata {
  const v = params[name];
  if (v === undefined || v === "") return { ...base };
  if (!v || typeof v !== "object" || Array.isArray(v)) throw invalid(`Invalid object`, label, "parameter_invalid_object");
  const out: Metadata = { ...base };
  for (const [k, val] of Object.entries(v as Params)) {
    if (typeof val !== "string" && typeof val !== "number" && typeof val !== "boolean") throw invalid(`Invalid metadata value for key ${k}: must be a string.`, `${label}[${k}]`);
    if (k.length > 40) throw invalid(`Metadata keys can have up to 40 characters (${k}).`, `${label}[${k}]`);
    const s = String(val);
    if (s.length > 500) throw invalid(`Metadata values can have up to 500 characters (${k}).`, `${label}[${k}]`);
    if (s === "") delete out[k];
    else out[k] = s;
  }
  if (Object.keys(out).length > 50) throw invalid(`Metadata can have up to 50 keys.`, label);
  return out;
}

export function email(params: Params, name: string): string | undefined {
  const v = str(params, name, { max: 512 });
  if (v !== undefined && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(v)) throw invalid(`Invalid email address: ${v}`, name, "email_invalid");
  return v;
}

export function url(params: Params, name: string, opts: { required?: boolean } = {}): string | undefined {
  const v = str(params, name, { required: opts.required, max: 5000 });
  if (v === undefined) return undefined;
  let ok = false;
  try {
    const u = new URL(v);
    ok = u.protocol === "http:" || u.protocol === "https:";
  } catch {
    ok = false;
  }
  if (!ok) throw invalid(`Not a valid URL`, name, "url_invalid");
  return v;
}

/** `expand[]` from a body or query: a list of dotted paths. */
export function expandList(params: Params): string[] {
  const v = params.expand;
  if (v === undefined || v === "") return [];
  const list = array(params, "expand") ?? [];
  return list.map((x) => {
    if (typeof x !== "string") throw invalid("Invalid array", "expand", "parameter_invalid_array");
    return x;
  });
}

/** Stripe's `created` filter: an exact integer or `{ gt, gte, lt, lte }`. */
export function rangeFilter(params: Params, name: string): ((n: number) => boolean) | null {
  const v = params[name];
  if (v === undefined || v === "") return null;
  if (typeof v === "string") {
    const n = int(params, name)!;
    return (x) => x === n;
  }
  const o = object(params, name)!;
  allowOnly(o, ["gt", "gte", "lt", "lte"], name);
  const b = Object.fromEntries(["gt", "gte", "lt", "lte"].map((k) => [k, int(o, k, { label: `${name}[${k}]` })]));
  return (x) => (b.gt === undefined || x > b.gt) && (b.gte === undefined || x >= b.gte) && (b.lt === undefined || x < b.lt) && (b.lte === undefined || x <= b.lte);
}
