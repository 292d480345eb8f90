import type Stripe from "stripe";
import type { AppContext } from "../http/context";
import { CheckoutSessionRecord } from "../billing/checkout-session.entity";
import { StripeSyncState } from "../billing/stripe-sync-state.entity";
import { expireStaleSessions } from "../billing/checkout.service";
import { handleEvent } from "../billing/stripe-events.service";

/**
 * The Stripe catch-up: webhooks can be lost (an endpoint down longer than Stripe retries, or a fake killed
 * before it delivered them). Stripe's docs advise not to rely on delivery alone: list the events you may have
 * missed (Events API, GET /v1/events with `created` and `types`; events are kept 30 days) and retrieve the
 * objects themselves. Both go through payments.handleEvent, the webhook's own code path: checked the same
 * way, recorded once by event id.
 */

/** The event types that change an invoice (see stripe-events.service.ts planEvent). */
export const CATCH_UP_TYPES = ["checkout.session.completed", "checkout.session.expired", "payment_intent.succeeded", "charge.refunded"];
/**
 * Each listing starts this far before the cursor: `created` has one-second resolution and events of the same
 * moment need not become visible in order, so a window is listed again; known ids are skipped.
 */
const OVERLAP_SEC = 5 * 60;
/**
 * The first run looks back three days, the longest Stripe retries a webhook in live mode (Stripe docs,
 * "Webhooks: retry behavior"); anything older was delivered or has its session checked below.
 */
const FIRST_LOOK_BACK_SEC = 3 * 24 * 3600;
const CURSOR = "events";

export interface CatchUpResult {
  listed: number;
  applied: number;
  rejected: number;
}

/** Events since the last one processed, oldest first; the cursor stops before the first that failed. */
export async function catchUpEvents(ctx: AppContext): Promise<CatchUpResult> {
  const states = ctx.dataSource.getRepository(StripeSyncState);
  const state = await states.findOneBy({ name: CURSOR });
  // Stripe's timestamps are its wall clock, compared here with this machine's (not the business clock).
  const since = state ? state.createdCursor : Math.floor(Date.now() / 1000) - FIRST_LOOK_BACK_SEC;
  const listed = await ctx.stripe.events
    .list({ created: { gte: Math.max(0, since - OVERLAP_SEC) }, types: CATCH_UP_TYPES, limit: 100 })
    .autoPagingToArray({ limit: 10000 });
  const oldestFirst = [...listed].sort((a, b) => a.created - b.created || (a.id < b.id ? -1 : 1));
  const result: CatchUpResult = { listed: listed.length, applied: 0, rejected: 0 };
  let cursor = since;
  try {
    for (const event of oldestFirst) {
      const r = await handleEvent(ctx, event, "catch-up");
      if (r.handled && r.outcome === "applied") result.applied++;
      if (r.handled && r.outcome === "rejected") result.rejected++;
      cursor = Math.max(cursor, event.created);
    }
  } finally {
    // Saved even when one failed, up to the last one handled: the next run starts there.
    if (!state || cursor !== state.createdCursor) await states.save({ name: CURSOR, createdCursor: cursor });
  }
  if (result.applied || result.rejected) ctx.logger.info({ ...result }, "Stripe catch-up applied missed events");
  return result;
}

/**
 * Open checkout sessions older than `olderThanMs` (younger ones are left to their webhooks): one Stripe says
 * is paid is applied as its checkout.session.completed event would be; one that expired is marked so; one
 * whose amount is no longer what is owed is expired (a page that could not be expired when the invoice changed).
 */
export async function catchUpSessions(ctx: AppContext, olderThanMs = ctx.config.stripe.catchUpSessionAgeMs): Promise<{ checked: number; applied: number; expired: number }> {
  const repo = ctx.dataSource.getRepository(CheckoutSessionRecord);
  const rows = await repo.createQueryBuilder("s")
    .where("s.status = 'open' AND s.createdAt <= NOW(3) - INTERVAL :us MICROSECOND", { us: Math.max(0, Math.floor(olderThanMs)) * 1000 })
    .orderBy("s.createdAt", "ASC").limit(200).getMany();
  const out = { checked: rows.length, applied: 0, expired: 0 };
  const invoices = new Set<number>();
  for (const rec of rows) {
    const s: Stripe.Checkout.Session = await ctx.stripe.checkout.sessions.retrieve(rec.id);
    if (s.status === "complete") {
      // The same event the webhook would have brought, under an id of its own so it is applied once.
      const event = { id: `catch-up:${s.id}`.slice(0, 80), object: "event", type: "checkout.session.completed", created: s.created, data: { object: s } } as unknown as Stripe.Event;
      const r = await handleEvent(ctx, event, "catch-up");
      if (r.handled && r.outcome === "applied") out.applied++;
    } else if (s.status === "expired") {
      await repo.update({ id: rec.id, status: "open" }, { status: "expired" });
    } else {
      invoices.add(rec.invoiceId);
    }
  }
  for (const invoiceId of invoices) out.expired += await expireStaleSessions(ctx, invoiceId);
  if (out.applied || out.expired) ctx.logger.info(out, "Stripe catch-up: checkout sessions settled");
  return out;
}

/** The job: events first (they carry refunds too), then the sessions. */
export async function catchUpStripe(ctx: AppContext): Promise<void> {
  try {
    await catchUpEvents(ctx);
    await catchUpSessions(ctx);
  } catch (err) {
    const e = err as { type?: string; status?: number; code?: string };
    if (e?.type === "StripeConnectionError" || e?.status === 503 || e?.code === "ECONNREFUSED") {
      ctx.logger.warn("Stripe catch-up: Stripe is not reachable; trying again at the next run");
      return;
    }
    throw err;
  }
}
