import type { Job } from "./scheduler";
import { purgeExpired } from "../auth/auth.service";
import { lockPastCutoff } from "../orders/orders.service";
import { materialiseAll } from "../orders/standing.service";
import { freezeDue } from "../production/plan.service";
import { processOutbox } from "../mail/outbox.service";
import { applyCreditHolds, issueStatements } from "../billing/invoices.service";
import { autoDeliver, invoiceUninvoicedCardOrders } from "../billing/dispatch.service";
import { catchUpStripe } from "./stripe-catch-up";
import { runReminderSchedule } from "../billing/reminders.service";

/** Every scheduled job the server runs (each under a MariaDB named lock). */
export const jobs: Job[] = [
  { name: "send-mail", everyMs: 2000, run: async (ctx) => void (await processOutbox(ctx)) },
  { name: "purge-expired-tokens", everyMs: 60 * 60 * 1000, run: purgeExpired },
  { name: "lock-orders-at-cutoff", everyMs: 30 * 1000, run: async (ctx) => void (await lockPastCutoff(ctx)) },
  { name: "materialise-standing-orders", everyMs: 15 * 60 * 1000, run: async (ctx) => void (await materialiseAll(ctx)) },
  { name: "freeze-plans-at-cutoff", everyMs: 60 * 1000, run: async (ctx) => void (await freezeDue(ctx)) },
  { name: "deliver-unconfirmed-orders", everyMs: 5 * 60 * 1000, run: async (ctx) => void (await autoDeliver(ctx)) },
  { name: "weekly-statements", everyMs: 60 * 60 * 1000, run: async (ctx) => void (await issueStatements(ctx)) },
  { name: "payment-reminders", everyMs: 60 * 60 * 1000, run: async (ctx) => void (await runReminderSchedule(ctx)) },
  { name: "credit-holds", everyMs: 15 * 60 * 1000, run: async (ctx) => void (await applyCreditHolds(ctx)) },
  { name: "invoice-card-orders", everyMs: 10 * 60 * 1000, run: async (ctx) => void (await invoiceUninvoicedCardOrders(ctx)) },
  // Missed Stripe webhooks: on start and every STRIPE_CATCH_UP_EVERY_MS (3 minutes by default).
  { name: "stripe-catch-up", everyMs: (ctx) => ctx.config.stripe.catchUpEveryMs, run: catchUpStripe },
];
