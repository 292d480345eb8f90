import crypto from "node:crypto";
import http from "node:http";
import https from "node:https";
import type { StripeEvent } from "./types";

/**
 * Webhook deliveries signed the way Stripe signs them, so the official SDK's
 * `stripe.webhooks.constructEvent(payload, header, secret)` accepts them:
 * `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256(secret, "<t>.<payload>")>`.
 *
 * Ordering: first attempts go out one after another in event order. An event whose endpoint fails
 * is retried on its own schedule (exponential backoff, capped), so it never holds back later events.
 */

export function signPayload(payload: string, secret: string, timestampSec: number): string {
  const v1 = crypto.createHmac("sha256", secret).update(`${timestampSec}.${payload}`, "utf8").digest("hex");
  return `t=${timestampSec},v1=${v1}`;
}

export interface WebhookRetryOptions {
  /** Total attempts per event, the first included (default 8). */
  attempts?: number;
  /** Delay before the second attempt; doubles each time (default 500 ms). */
  baseMs?: number;
  /** Cap on the delay (default 30 s). */
  maxMs?: number;
  /** Per-attempt timeout (default 10 s). */
  timeoutMs?: number;
}

export interface DeliveryAttempt {
  at: number;
  status: number | null;
  error: string | null;
}

export interface Delivery {
  eventId: string;
  type: string;
  attempts: DeliveryAttempt[];
  state: "pending" | "delivered" | "failed";
}

export interface WebhookDispatcherOptions {
  url: string;
  secret: string;
  retry?: WebhookRetryOptions;
  nowMs: () => number;
  onDelivered: (eventId: string) => void;
  log: (msg: string) => void;
}

export class WebhookDispatcher {
  readonly deliveries: Delivery[] = [];
  private tail: Promise<void> = Promise.resolve();
  private readonly pending = new Set<Promise<void>>();
  private readonly timers = new Set<{ timer: NodeJS.Timeout; resolve: () => void }>();
  private readonly inflight = new Set<http.ClientRequest>();
  private generation = 0;
  private closed = false;
  private readonly attempts: number;
  private readonly baseMs: number;
  private readonly maxMs: number;
  private readonly timeoutMs: number;

  constructor(private readonly opts: WebhookDispatcherOptions) {
    this.attempts = Math.max(1, opts.retry?.attempts ?? 8);
    this.baseMs = opts.retry?.baseMs ?? 500;
    this.maxMs = opts.retry?.maxMs ?? 30_000;
    this.timeoutMs = opts.retry?.timeoutMs ?? 10_000;
  }

  enqueue(event: StripeEvent): void {
    if (this.closed) return;
    const payload = JSON.stringify(event, null, 2);
    const delivery: Delivery = { eventId: event.id, type: event.type, attempts: [], state: "pending" };
    this.deliveries.push(delivery);
    const gen = this.generation;
    const first = this.tail.then(() => (gen === this.generation ? this.attempt(delivery, payload) : false));
    this.tail = first.then(
      () => undefined,
      () => undefined,
    );
    const done = first.then(async (ok) => {
      for (let n = 1; !ok && n < this.attempts && gen === this.generation; n++) {
        await this.sleep(Math.min(this.baseMs * 2 ** (n - 1), this.maxMs));
        if (gen !== this.generation) return;
        ok = await this.attempt(delivery, payload);
      }
      if (gen !== this.generation) return;
      delivery.state = ok ? "delivered" : "failed";
      if (ok) this.opts.onDelivered(event.id);
      else this.opts.log(`webhook ${event.type} ${event.id} failed after ${delivery.attempts.length} attempts`);
    });
    this.pending.add(done);
    void done.finally(() => this.pending.delete(done));
  }

  /** Resolves when every delivery queued so far has been delivered or has given up. */
  async flush(): Promise<void> {
    while (this.pending.size) await Promise.allSettled([...this.pending]);
  }

  /** Drops queued deliveries and retry timers (reset, close). */
  cancelAll(): void {
    this.generation++;
    for (const t of this.timers) {
      clearTimeout(t.timer);
      t.resolve();
    }
    this.timers.clear();
    for (const req of this.inflight) req.destroy(new Error("cancelled"));
    this.deliveries.length = 0;
  }

  close(): void {
    this.closed = true;
    this.cancelAll();
  }

  private sleep(ms: number): Promise<void> {
    return new Promise((resolve) => {
      const entry = { timer: setTimeout(() => (this.timers.delete(entry), resolve()), ms), resolve };
      this.timers.add(entry);
    });
  }

  private attempt(delivery: Delivery, payload: string): Promise<boolean> {
    const t = Math.floor(this.opts.nowMs() / 1000);
    const header = signPayload(payload, this.opts.secret, t);
    const record: DeliveryAttempt = { at: t, status: null, error: null };
    delivery.attempts.push(record);
    return new Promise<boolean>((resolve) => {
      const lib = this.opts.url.startsWith("https:") ? https : http;
      const req = lib.request(this.opts.url, {
        method: "POST",
        agent: false,
        timeout: this.timeoutMs,
        headers: {
          "Content-Type": "application/json; charset=utf-8",
          "Content-Length": Buffer.byteLength(payload),
          "Stripe-Signature": header,
          "User-Agent": "Stripe/1.0 (+https://stripe.com/docs/webhooks)",
          Connection: "close",
        },
      });
      this.inflight.add(req);
      const finish = (ok: boolean) => {
        this.inflight.delete(req);
        resolve(ok);
      };
      req.on("response", (res) => {
        record.status = res.statusCode ?? null;
        res.resume();
        res.on("end", () => finish(res.statusCode !== undefined && res.statusCode >= 200 && res.statusCode < 300));
        res.on("error", () => finish(false));
      });
      req.on("timeout", () => req.destroy(new Error(`timed out after ${this.timeoutMs} ms`)));
      req.on("error", (err) => {
        record.error = err.message;
        finish(false);
      });
      req.end(payload);
    });
  }
}
