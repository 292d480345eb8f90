import http from "node:http";
import path from "node:path";
import type { AddressInfo } from "node:net";
import express, { type NextFunction, type Request, type Response } from "express";
import { FakeAccount, NO_REQUEST } from "./account";
import { apiRouter } from "./api";
import { hostedRouter } from "./hosted";
import { messagePage } from "./pages";
import { Store, type FakeState } from "./store";
import type { Payout } from "./types";
import { WebhookDispatcher, type Delivery, type WebhookRetryOptions } from "./webhooks";

export type { FakeState } from "./store";
export type { Delivery, DeliveryAttempt, WebhookRetryOptions } from "./webhooks";
export type * from "./types";
export { signPayload } from "./webhooks";
export { luhnValid, cardBrand, DECLINING_TEST_CARDS } from "./luhn";

/**
 * A local stand-in for the parts of the Stripe API Panwise uses, for the official `stripe` SDK:
 * `new Stripe(key, { host: "127.0.0.1", port, protocol: "http" })`. It serves /v1 (customers,
 * checkout sessions, payment intents, charges, refunds, balance, balance transactions, payouts,
 * events), a hosted payment page for each checkout session, signed webhooks with retries, and
 * /_fake control endpoints for tests. It is a test double: nothing leaves this machine.
 */

export interface StripeFakeOptions {
  /** Default 12111; 0 picks a free port. */
  port?: number;
  /** Default 127.0.0.1. */
  host?: string;
  /** JSON file the state is kept in (written atomically after each change). Omit to keep state in memory. */
  stateFile?: string;
  /** Base of the hosted page URLs in `session.url`. Default `http://127.0.0.1:<port>`. */
  publicBase?: string;
  /** Where events are POSTed; needs `webhookSecret`. */
  webhookUrl?: string;
  /** `whsec_...`: the signing secret the receiver passes to `stripe.webhooks.constructEvent`. */
  webhookSecret?: string;
  /** Event types sent to the endpoint (Stripe's "enabled events"); `*` wildcards. Default all. */
  webhookEvents?: string[];
  webhookRetry?: WebhookRetryOptions;
  /** Processing fee: percent of the amount, rounded, plus a fixed amount in cents. Defaults 2.9 and 30. */
  feePercent?: number;
  feeFixed?: number;
  /** Runs the automatic payout (sweep of the available balance) on this interval. */
  payoutEveryMs?: number;
  /** Clock, in epoch milliseconds; for tests of expiry. Default Date.now. */
  now?: () => number;
  /** Diagnostic messages (failed webhooks). Default silent. */
  log?: (message: string) => void;
}

export interface StripeFake {
  port: number;
  /** http://host:port, the base the SDK talks to and the hosted pages live under. */
  url: string;
  /** The live state (read it; change it through the API). */
  readonly state: FakeState;
  /** Webhook deliveries since start or reset, with their attempts. */
  readonly deliveries: readonly Delivery[];
  close(): Promise<void>;
  /** Empties the state (and its file) and drops pending webhook deliveries. */
  reset(): void;
  /** Resolves when every queued webhook delivery has been delivered or has given up. */
  flushWebhooks(): Promise<void>;
  /** The automatic payout now: sweeps the available balance; null when there is nothing to pay out. */
  runPayout(): Payout | null;
}

export async function startStripeFake(opts: StripeFakeOptions = {}): Promise<StripeFake> {
  const host = opts.host ?? "127.0.0.1";
  const nowMs = opts.now ?? Date.now;
  const log = opts.log ?? (() => undefined);
  if (opts.webhookUrl && !opts.webhookSecret) throw new Error("Stripe fake: webhookUrl needs webhookSecret (whsec_...)");
  if (opts.webhookSecret && !opts.webhookSecret.startsWith("whsec_")) throw new Error("Stripe fake: webhookSecret must start with whsec_");
  if (opts.webhookUrl) new URL(opts.webhookUrl); // throws on a malformed URL at start rather than at the first event

  const store = new Store(opts.stateFile ? path.resolve(opts.stateFile) : null);
  let publicBase = opts.publicBase?.replace(/\/+$/, "") ?? "";
  const wanted = opts.webhookEvents ?? ["*"];
  const webhookWants = (type: string) =>
    Boolean(opts.webhookUrl) && wanted.some((p) => p === "*" || p === type || (p.endsWith(".*") && type.startsWith(p.slice(0, -1))));

  let dispatcher: WebhookDispatcher | null = null;
  const account = new FakeAccount(store, {
    feePercent: opts.feePercent ?? 2.9,
    feeFixed: opts.feeFixed ?? 30,
    nowMs,
    publicBase: () => publicBase,
    webhookWants,
    onEvent: (event) => {
      if (dispatcher && webhookWants(event.type)) dispatcher.enqueue(event);
    },
  });
  if (opts.webhookUrl && opts.webhookSecret) {
    dispatcher = new WebhookDispatcher({
      url: opts.webhookUrl,
      secret: opts.webhookSecret,
      retry: opts.webhookRetry,
      nowMs,
      log,
      onDelivered: (id) => account.webhookDelivered(id),
    });
  }

  const reset = () => {
    dispatcher?.cancelAll();
    store.reset();
  };
  const runPayout = () => {
    const payout = account.runAutomaticPayout(NO_REQUEST);
    if (payout) store.save();
    return payout;
  };
  const flushWebhooks = async () => {
    await dispatcher?.flush();
  };

  const app = express();
  app.disable("x-powered-by");
  app.set("query parser", "extended");
  app.use("/v1", apiRouter({ account, store, nowMs }));
  app.use("/pay", hostedRouter({ account, store, nowMs }));

  const control = express.Router();
  control.post("/reset", (_req, res) => {
    reset();
    res.json({ ok: true });
  });
  control.get("/state", (_req, res) => void res.json(store.state));
  control.post("/payouts/run", (_req, res) => void res.json({ payout: runPayout() }));
  control.post("/webhooks/flush", async (_req, res) => {
    await flushWebhooks();
    res.json({ deliveries: dispatcher?.deliveries ?? [] });
  });
  control.get("/webhooks", (_req, res) => void res.json({ url: opts.webhookUrl ?? null, events: wanted, deliveries: dispatcher?.deliveries ?? [] }));
  app.use("/_fake", control);

  app.get("/", (_req, res) => {
    const s = store.state;
    res.type("html").send(
      messagePage(
        "Panwise local Stripe fake (test only)",
        `Serving the Stripe API on ${publicBase}/v1 for test keys (sk_test_...). ${Object.keys(s.checkoutSessions).length} payment page(s), ` +
          `${Object.keys(s.charges).length} charge(s), available balance ${account.availableBalance()} cents. Webhooks: ${opts.webhookUrl ?? "none"}.`,
      ),
    );
  });
  app.use((_req, res) => void res.status(404).type("text").send("Not found. The Stripe API is under /v1, hosted pages under /pay/<session id>.\n"));
  app.use((err: unknown, _req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(err);
    const status = (err as { status?: unknown })?.status;
    if (typeof status === "number" && status >= 400 && status < 500) return void res.status(status).type("text").send(`Bad request: ${(err as Error).message}\n`);
    console.error("stripe fake: internal error", err);
    res.status(500).type("text").send("Stripe fake internal error\n");
  });

  const server = http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port ?? 12111, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
  const port = (server.address() as AddressInfo).port;
  const url = `http://${host === "0.0.0.0" || host === "::" ? "127.0.0.1" : host}:${port}`;
  if (!publicBase) publicBase = url;

  const timers: NodeJS.Timeout[] = [
    setInterval(() => {
      if (account.expireDue()) store.save();
    }, 1000),
  ];
  if (opts.payoutEveryMs && opts.payoutEveryMs > 0) timers.push(setInterval(runPayout, opts.payoutEveryMs));
  for (const t of timers) t.unref();

  let closing: Promise<void> | null = null;
  return {
    port,
    url,
    get state() {
      return store.state;
    },
    get deliveries() {
      return dispatcher?.deliveries ?? [];
    },
    reset,
    flushWebhooks,
    runPayout,
    close: () =>
      (closing ??= new Promise<void>((resolve) => {
        for (const t of timers) clearInterval(t);
        dispatcher?.close();
        server.closeAllConnections();
        server.close(() => resolve());
      })),
  };
}
