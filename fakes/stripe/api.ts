import crypto from "node:crypto";
import express, { type NextFunction, type Request, type Response } from "express";
import type { FakeAccount, NewLineItem, RequestCtx } from "./account";
import { CURRENCY, DEFAULT_API_VERSION } from "./account";
import { collectionOf, randomToken, type Store } from "./store";
import {
  StripeApiError, allowOnly, array, asParams, email, expandList, int, invalid, metadata, noSuch, object, oneOf, rangeFilter, str, url, type Params,
} from "./params";
import type { ListResponse, Refund } from "./types";

/**
 * The /v1 REST surface: authentication, idempotency, parameter validation, lists with Stripe's
 * cursor pagination, `expand[]`, and Stripe's error bodies. State changes live in account.ts.
 */

export interface ApiDeps {
  account: FakeAccount;
  store: Store;
  nowMs: () => number;
}

const IDEMPOTENCY_TTL_SEC = 24 * 3600;

interface Caller {
  /** Idempotency keys are scoped by this hash of the API key (the key itself is never stored). */
  scope: string;
}

function authenticate(req: Request): Caller {
  const header = req.get("authorization") ?? "";
  let key = "";
  const bearer = /^Bearer\s+(.+)$/i.exec(header);
  const basic = /^Basic\s+(.+)$/i.exec(header);
  if (bearer) key = bearer[1]!.trim();
  else if (basic) key = Buffer.from(basic[1]!, "base64").toString("utf8").split(":")[0] ?? "";
  const fail = (message: string) => new StripeApiError(401, { type: "invalid_request_error", message });
  if (!key) {
    throw fail(
      "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY'). See https://stripe.com/docs/api#authentication for details.",
    );
  }
  const redacted = key.length > 12 ? `${key.slice(0, 8)}${"*".repeat(Math.min(24, key.length - 12))}${key.slice(-4)}` : "****";
  if (key.startsWith("pk_")) throw fail("This API call cannot be made with a publishable API key. Please use a secret API key.");
  if (key.startsWith("sk_live_") || key.startsWith("rk_live_")) throw fail(`The Panwise Stripe fake only accepts test mode keys (sk_test_...), not ${redacted}.`);
  if (!/^sk_test_[A-Za-z0-9_]+$/.test(key)) throw fail(`Invalid API Key provided: ${redacted}`);
  return { scope: crypto.createHash("sha256").update(key).digest("hex").slice(0, 16) };
}

function canonical(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(canonical);
  if (v && typeof v === "object") return Object.fromEntries(Object.keys(v).sort().map((k) => [k, canonical((v as Params)[k])]));
  return v;
}

export function apiRouter(deps: ApiDeps): express.Router {
  const { account, store } = deps;
  const router = express.Router();

  router.use((req, res, next) => {
    res.set("Request-Id", `req_${randomToken(14)}`);
    res.set("Stripe-Version", req.get("stripe-version") ?? DEFAULT_API_VERSION);
    res.locals.caller = authenticate(req);
    next();
  });
  router.use(express.urlencoded({ extended: true, limit: "1mb", parameterLimit: 10_000 }));

  type Handler = (params: Params, ctx: RequestCtx, req: Request) => unknown;

  /**
   * One endpoint. `returns` names the object type it answers with ("list:<type>" for lists) so
   * `expand[]` is checked before anything changes, and applied to the result.
   */
  const route = (method: "get" | "post", path: string, returns: string, handler: Handler) => {
    router[method](path, (req: Request, res: Response) => {
      const caller = res.locals.caller as Caller;
      const params = asParams(method === "get" ? req.query : req.body);
      const requestId = res.get("Request-Id") ?? null;
      const key = method === "post" ? (req.get("idempotency-key") ?? null) : null;
      const ctx: RequestCtx = { requestId, idempotencyKey: key, apiVersion: req.get("stripe-version") ?? null };
      if (account.expireDue()) store.save();

      let recordKey: string | null = null;
      let fingerprint = "";
      if (key !== null) {
        if (key.length > 255) throw invalid("Idempotency-Key is too long; it can be at most 255 characters.");
        res.set("Idempotency-Key", key);
        recordKey = `${caller.scope}:${key}`;
        fingerprint = crypto.createHash("sha256").update(JSON.stringify(canonical(params))).digest("hex");
        const prior = store.state.idempotency[recordKey];
        if (prior && prior.createdAt + IDEMPOTENCY_TTL_SEC > account.now()) {
          if (prior.method !== req.method || prior.path !== req.path) {
            throw new StripeApiError(400, {
              type: "idempotency_error",
              message: `Keys for idempotent requests can only be used for the same endpoint they were first used for ('${prior.method} ${prior.path}' vs '${req.method} ${req.path}'). Try using a key other than '${key}' if you meant to execute a different request.`,
            });
          }
          if (prior.fingerprint !== fingerprint) {
            throw new StripeApiError(400, {
              type: "idempotency_error",
              message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
            });
          }
          res.set("Idempotent-Replayed", "true").set("Original-Request", prior.requestId);
          res.status(prior.status).json(prior.body);
          return;
        }
      }

      const paths = expandList(params);
      for (const p of paths) checkExpand(returns, p.split("."), p);

      let status = 200;
      let body: unknown;
      try {
        body = expand(handler(params, ctx, req), paths);
      } catch (err) {
        // Stripe saves a result only once the endpoint has started executing: card errors are
        // replayed, parameter errors are not (fix the request and retry with the same key).
        if (!(err instanceof StripeApiError) || err.status !== 402 || recordKey === null) throw err;
        status = err.status;
        body = { error: err.body };
      }
      if (recordKey !== null) {
        const now = account.now();
        for (const [k, r] of Object.entries(store.state.idempotency)) if (r.createdAt + IDEMPOTENCY_TTL_SEC <= now) delete store.state.idempotency[k];
        // A snapshot: the replay is the response as first sent, not the object as it is now.
        store.state.idempotency[recordKey] = { method: req.method, path: req.path, fingerprint, status, body: structuredClone(body), requestId: requestId ?? "", createdAt: now };
      }
      if (method === "post") store.save();
      res.status(status).json(body);
    });
  };

  // ---- helpers -------------------------------------------------------------------------------

  /** Expandable fields per object type, and the type each expands to ("*": depends on the value). */
  const EXPANDABLE: Record<string, Record<string, string>> = {
    "checkout.session": { customer: "customer", payment_intent: "payment_intent", line_items: "list:item" },
    payment_intent: { customer: "customer", latest_charge: "charge" },
    charge: { customer: "customer", payment_intent: "payment_intent", balance_transaction: "balance_transaction" },
    refund: { charge: "charge", payment_intent: "payment_intent", balance_transaction: "balance_transaction" },
    payout: { balance_transaction: "balance_transaction" },
    balance_transaction: { source: "*" },
  };
  const cannotExpand = (what: string) => invalid(`This property cannot be expanded (${what}).`, "expand");

  function checkExpand(type: string, path: string[], full: string, depth = 0): void {
    if (!path.length || type === "*") return;
    const [head, ...rest] = path as [string, ...string[]];
    if (type.startsWith("list:")) {
      if (head !== "data") throw cannotExpand(full);
      return checkExpand(type.slice(5), rest, full, depth);
    }
    if (depth >= 4) throw invalid("You cannot expand more than 4 levels of a property.", "expand");
    const target = EXPANDABLE[type]?.[head];
    if (!target) throw cannotExpand(full);
    checkExpand(target, rest, full, depth + 1);
  }

  /** Returns a copy of `obj` with the given dotted paths expanded (Stripe allows four levels). */
  const expand = (obj: unknown, paths: string[], depth = 0): unknown => {
    if (!paths.length || !obj || typeof obj !== "object") return obj;
    if (depth >= 4) throw invalid("You cannot expand more than 4 levels of a property.", "expand");
    const copy = structuredClone(obj) as Params;
    const groups = new Map<string, string[]>();
    for (const p of paths) {
      const [head, ...rest] = p.split(".");
      groups.set(head!, [...(groups.get(head!) ?? []), ...(rest.length ? [rest.join(".")] : [])]);
    }
    for (const [field, rest] of groups) {
      if (copy.object === "list" && field === "data") {
        copy.data = (copy.data as unknown[]).map((o) => expand(o, rest, depth));
        continue;
      }
      if (!EXPANDABLE[String(copy.object)]?.[field]) throw cannotExpand(field);
      let value = copy[field];
      if (field === "line_items" && copy.object === "checkout.session") {
        const items = store.state.lineItems[String(copy.id)] ?? [];
        value = { object: "list", data: items, has_more: false, url: `/v1/checkout/sessions/${String(copy.id)}/line_items` } satisfies ListResponse<unknown>;
      } else if (typeof value === "string") {
        value = store.find(value)?.obj ?? value;
      }
      copy[field] = expand(value, rest, depth + 1);
    }
    return copy;
  };

  const listOf = <T extends { id: string }>(
    all: T[],
    params: Params,
    path: string,
    allowed: string[],
    filters: ((o: T) => boolean)[],
  ): ListResponse<T> => {
    allowOnly(params, ["limit", "starting_after", "ending_before", ...allowed]);
    const limit = int(params, "limit", { min: 1, max: 100 }) ?? 10;
    const after = str(params, "starting_after");
    const before = str(params, "ending_before");
    if (after && before) throw invalid("You may only specify one of these parameters: ending_before, starting_after.", "starting_after");
    const keep = (o: T) => filters.every((f) => f(o));
    let candidates: T[];
    let data: T[];
    const cursor = after ?? before;
    if (cursor) {
      const idx = all.findIndex((o) => o.id === cursor);
      if (idx < 0) throw noSuch(cursor, after ? "starting_after" : "ending_before", 400);
      candidates = (after ? all.slice(idx + 1) : all.slice(0, idx)).filter(keep);
      data = after ? candidates.slice(0, limit) : candidates.slice(-limit);
    } else {
      candidates = all.filter(keep);
      data = candidates.slice(0, limit);
    }
    return { object: "list", data, has_more: candidates.length > limit, url: `/v1${path}` };
  };

  const retrieve = (collection: Parameters<Store["get"]>[0]) => (params: Params, _ctx: RequestCtx, req: Request) => {
    allowOnly(params, []);
    const id = String(req.params.id);
    const obj = collectionOf(id) === collection ? store.get(collection, id) : undefined;
    if (!obj) throw noSuch(id);
    return obj;
  };
  /** A list endpoint: exact-match filters by field, `created` ranges, extra filters, pagination, expand. */
  const listed = <T extends { id: string; created: number }>(
    all: T[],
    params: Params,
    path: string,
    equal: Record<string, (o: T) => unknown>,
    extra: { allowed?: string[]; filters?: ((o: T) => boolean)[] } = {},
  ) => {
    const filters = [...(extra.filters ?? [])];
    for (const [name, get] of Object.entries(equal)) {
      const v = str(params, name);
      if (v !== undefined) filters.push((o) => get(o) === v);
    }
    const range = rangeFilter(params, "created");
    if (range) filters.push((o) => range(o.created));
    return listOf(all, params, path, [...Object.keys(equal), "created", ...(extra.allowed ?? [])], filters);
  };

  // ---- customers -----------------------------------------------------------------------------

  route("post", "/customers", "customer", (p, ctx) => {
    allowOnly(p, ["email", "name", "description", "phone", "metadata"]);
    const c = account.createCustomer(
      {
        email: email(p, "email") ?? null,
        name: str(p, "name", { max: 256 }) ?? null,
        description: str(p, "description", { max: 350 }) ?? null,
        phone: str(p, "phone", { max: 20 }) ?? null,
        metadata: metadata(p, "metadata"),
      },
      ctx,
    );
    return c;
  });
  route("get", "/customers", "list:customer", (p) => listed(store.newestFirst("customers"), p, "/customers", { email: (c) => c.email }));
  route("get", "/customers/:id", "customer", retrieve("customers"));

  // ---- checkout sessions ---------------------------------------------------------------------

  route("post", "/checkout/sessions", "checkout.session", (p, ctx) => {
    allowOnly(p, [
      "mode", "line_items", "success_url", "cancel_url", "customer", "customer_email", "customer_creation", "metadata", "client_reference_id",
      "payment_intent_data", "expires_at", "payment_method_types",
    ]);
    const mode = oneOf(p, "mode", ["payment", "setup", "subscription"] as const, { required: true });
    if (mode !== "payment") throw invalid(`The Panwise Stripe fake supports only mode=payment (got ${mode}).`, "mode");
    const types = array(p, "payment_method_types");
    if (types && types.some((t) => t !== "card")) throw invalid("The Panwise Stripe fake supports only the card payment method type.", "payment_method_types");
    const raw = array(p, "line_items");
    if (!raw || !raw.length) throw invalid("You must provide at least one line item (line_items) in payment mode.", "line_items", "parameter_missing");
    if (raw.length > 100) throw invalid("You can have at most 100 line items.", "line_items");
    const lineItems: NewLineItem[] = raw.map((item, i) => {
      const at = `line_items[${i}]`;
      const li = asParams(item);
      allowOnly(li, ["price_data", "quantity", "price"], at);
      if (li.price !== undefined) throw invalid(`No such price: '${String(li.price)}' (the fake knows no prices; use price_data)`, `${at}[price]`, "resource_missing");
      const pd = object(li, "price_data", `${at}[price_data]`);
      if (!pd) throw invalid(`Missing required param: ${at}[price_data].`, `${at}[price_data]`, "parameter_missing");
      allowOnly(pd, ["currency", "unit_amount", "product_data"], `${at}[price_data]`);
      const currency = str(pd, "currency", { required: true, label: `${at}[price_data][currency]` })!.toLowerCase();
      if (currency !== CURRENCY) throw invalid(`The Panwise Stripe fake account settles in usd only (got ${currency}).`, `${at}[price_data][currency]`);
      const unitAmount = int(pd, "unit_amount", { required: true, min: 0, max: 99_999_999, label: `${at}[price_data][unit_amount]` })!;
      const prod = object(pd, "product_data", `${at}[price_data][product_data]`);
      if (!prod) throw invalid(`Missing required param: ${at}[price_data][product_data].`, `${at}[price_data][product_data]`, "parameter_missing");
      allowOnly(prod, ["name", "description", "metadata"], `${at}[price_data][product_data]`);
      return {
        name: str(prod, "name", { required: true, max: 250, label: `${at}[price_data][product_data][name]` })!,
        description: str(prod, "description", { label: `${at}[price_data][product_data][description]` }) ?? null,
        productMetadata: metadata(prod, "metadata", `${at}[price_data][product_data][metadata]`),
        currency,
        unitAmount,
        quantity: int(li, "quantity", { required: true, min: 1, max: 999_999, label: `${at}[quantity]` })!,
      };
    });
    const customer = str(p, "customer") ?? null;
    const customerEmail = email(p, "customer_email") ?? null;
    const customerCreation = oneOf(p, "customer_creation", ["always", "if_required"] as const) ?? null;
    if (customer && customerEmail) throw invalid("You may only specify one of these parameters: customer, customer_email.", "customer_email");
    if (customer && customerCreation) throw invalid("You may only specify one of these parameters: customer, customer_creation.", "customer_creation");
    const pid = object(p, "payment_intent_data") ?? {};
    allowOnly(pid, ["metadata", "description"], "payment_intent_data");
    const session = account.createCheckoutSession(
      {
        lineItems,
        successUrl: url(p, "success_url") ?? null,
        cancelUrl: url(p, "cancel_url") ?? null,
        customer,
        customerEmail,
        customerCreation,
        metadata: metadata(p, "metadata"),
        clientReferenceId: str(p, "client_reference_id", { max: 200 }) ?? null,
        paymentIntentData: {
          metadata: metadata(pid, "metadata", "payment_intent_data[metadata]"),
          description: str(pid, "description", { max: 1000, label: "payment_intent_data[description]" }) ?? null,
        },
        expiresAt: int(p, "expires_at") ?? null,
      },
      ctx,
    );
    return session;
  });
  route("get", "/checkout/sessions", "list:checkout.session", (p) =>
    listed(store.newestFirst("checkoutSessions"), p, "/checkout/sessions", {
      payment_intent: (s) => s.payment_intent,
      customer: (s) => s.customer,
      status: (s) => s.status,
    }),
  );
  route("get", "/checkout/sessions/:id", "checkout.session", retrieve("checkoutSessions"));
  route("post", "/checkout/sessions/:id/expire", "checkout.session", (p, ctx, req) => {
    allowOnly(p, []);
    return account.expireSession(String(req.params.id), ctx);
  });

  // ---- payment intents, charges --------------------------------------------------------------

  route("get", "/payment_intents", "list:payment_intent", (p) =>
    listed(store.newestFirst("paymentIntents"), p, "/payment_intents", { customer: (x) => x.customer }),
  );
  route("get", "/payment_intents/:id", "payment_intent", retrieve("paymentIntents"));
  route("get", "/charges", "list:charge", (p) =>
    listed(store.newestFirst("charges"), p, "/charges", { payment_intent: (c) => c.payment_intent, customer: (c) => c.customer }),
  );
  route("get", "/charges/:id", "charge", retrieve("charges"));

  // ---- refunds -------------------------------------------------------------------------------

  route("post", "/refunds", "refund", (p, ctx) => {
    allowOnly(p, ["charge", "payment_intent", "amount", "reason", "metadata"]);
    const refund = account.createRefund(
      {
        charge: str(p, "charge") ?? null,
        paymentIntent: str(p, "payment_intent") ?? null,
        amount: int(p, "amount", { min: 1 }) ?? null,
        reason: (oneOf(p, "reason", ["duplicate", "fraudulent", "requested_by_customer"] as const) ?? null) satisfies Refund["reason"],
        metadata: metadata(p, "metadata"),
      },
      ctx,
    );
    return refund;
  });
  route("get", "/refunds", "list:refund", (p) =>
    listed(store.newestFirst("refunds"), p, "/refunds", { charge: (r) => r.charge, payment_intent: (r) => r.payment_intent }),
  );
  route("get", "/refunds/:id", "refund", retrieve("refunds"));

  // ---- balance, balance transactions, payouts ------------------------------------------------

  route("get", "/balance", "balance", (p) => {
    allowOnly(p, []);
    return account.balance();
  });
  route("get", "/balance_transactions", "list:balance_transaction", (p) => {
    const payout = str(p, "payout");
    if (payout !== undefined) {
      const po = store.get("payouts", payout);
      if (!po) throw noSuch(payout, "payout");
      if (!po.automatic) throw invalid("Balance transaction history can only be filtered on automatic transfers, not manual.", "payout");
    }
    return listed(
      store.newestFirst("balanceTransactions"),
      p,
      "/balance_transactions",
      { type: (t) => t.type, source: (t) => t.source, currency: (t) => t.currency },
      { allowed: ["payout"], filters: payout === undefined ? [] : [(t) => store.state.txnPayout[t.id] === payout] },
    );
  });
  route("get", "/balance_transactions/:id", "balance_transaction", retrieve("balanceTransactions"));

  route("post", "/payouts", "payout", (p, ctx) => {
    allowOnly(p, ["amount", "currency", "description", "metadata", "method", "statement_descriptor"]);
    const amount = int(p, "amount", { required: true, min: 1 })!;
    const currency = str(p, "currency", { required: true })!.toLowerCase();
    if (currency !== CURRENCY) throw invalid(`The Panwise Stripe fake account holds usd only (got ${currency}).`, "currency");
    if ((oneOf(p, "method", ["standard", "instant"] as const) ?? "standard") !== "standard") throw invalid("The Panwise Stripe fake supports only standard payouts.", "method");
    const payout = account.createManualPayout(
      { amount, description: str(p, "description") ?? null, metadata: metadata(p, "metadata"), statementDescriptor: str(p, "statement_descriptor", { max: 22 }) ?? null },
      ctx,
    );
    return payout;
  });
  route("get", "/payouts", "list:payout", (p) =>
    listed(store.newestFirst("payouts"), p, "/payouts", { status: (x) => x.status }),
  );
  route("get", "/payouts/:id", "payout", retrieve("payouts"));

  // ---- events --------------------------------------------------------------------------------

  route("get", "/events", "list:event", (p) => {
    const type = str(p, "type");
    const types = array(p, "types")?.map(String);
    if (type && types) throw invalid("You may only specify one of these parameters: type, types.", "types");
    if (types && types.length > 20) throw invalid("You can filter on at most 20 types.", "types");
    const matches = (pattern: string, t: string) => (pattern.endsWith("*") ? t.startsWith(pattern.slice(0, -1)) : t === pattern);
    return listed(store.newestFirst("events"), p, "/events", {}, {
      allowed: ["type", "types"],
      filters: [...(type ? [(e: { type: string }) => matches(type, e.type)] : []), ...(types ? [(e: { type: string }) => types.some((t) => matches(t, e.type))] : [])],
    });
  });
  route("get", "/events/:id", "event", retrieve("events"));

  // ---- fallbacks -----------------------------------------------------------------------------

  router.use((req) => {
    throw invalid(`Unrecognized request URL (${req.method}: ${req.baseUrl}${req.path}). The Panwise Stripe fake implements only the endpoints Panwise uses.`, undefined, undefined, 404);
  });
  router.use((err: unknown, _req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(err);
    if (err instanceof StripeApiError) return void res.status(err.status).json({ error: err.body });
    const e = err as { type?: string; status?: number; message?: string };
    if (e && typeof e.status === "number" && e.status >= 400 && e.status < 500) {
      return void res.status(400).json({ error: { type: "invalid_request_error", message: `Invalid request body: ${e.message ?? "could not be parsed"}` } });
    }
    console.error("stripe fake: internal error", err);
    res.status(500).set("Stripe-Should-Retry", "false").json({ error: { type: "api_error", message: `The Panwise Stripe fake failed: ${e?.message ?? String(err)}` } });
  });
  return router;
}
