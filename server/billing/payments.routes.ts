import express, { Router } from "express";
import type { AppContext } from "../http/context";
import { parse } from "../http/errors";
import { allow, currentUser } from "../http/auth";
import { createCheckout } from "./checkout.service";
import { recordManualPaymentAndExpire, refundOverpayment } from "./payments.service";
import { issueCreditNote } from "./credit-notes.service";
import { handleWebhook } from "./stripe-events.service";
import { OFFICE } from "./invoices.routes";
import { rateLimits } from "../http/rate-limits";
import { creditNoteSchema, idParamSchema, manualPaymentSchema } from "../../shared/schemas/billing";
import type { CheckoutDto, CreditNoteResponse, OverpaymentRefundResponse, RecordPaymentResponse, WebhookAckDto } from "../../shared/contracts/billing";

/** Stripe webhooks need the raw body for the signature: mounted before the JSON parser. */
export function stripeWebhookRoute(ctx: AppContext): Router {
  const r = Router();
  r.post("/", express.raw({ type: "*/*", limit: "1mb" }), async (req, res) => {
    // 2xx for every authentic event, rejected ones too (see stripe-events.service.ts handleWebhook for why).
    const result = await handleWebhook(ctx, Buffer.isBuffer(req.body) ? req.body : Buffer.from(""), req.get("stripe-signature"));
    res.json({ received: true, duplicate: !result.handled, rejected: result.outcome === "rejected" } satisfies WebhookAckDto);
  });
  return r;
}

/** Money on one invoice (mounted at /invoices): the card page, payments by hand, overpayment refunds, credit notes. */
export function invoicePaymentRoutes(ctx: AppContext): Router {
  const r = Router();
  const limits = rateLimits(ctx);
  // Opening card-payment pages is limited per user (server/http/rate-limits.ts): 429 with Retry-After.
  r.post("/:id/checkout", allow(...OFFICE, "buyer"), limits.checkout, async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.status(201).json((await createCheckout(ctx, currentUser(req), id)) satisfies CheckoutDto);
  });
  r.post("/:id/payments", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const input = parse(manualPaymentSchema, req.body);
    res.status(201).json({ payment: await recordManualPaymentAndExpire(ctx, currentUser(req), id, input) } satisfies RecordPaymentResponse);
  });
  r.post("/:id/overpayment-refund", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    res.status(201).json({ refund: await refundOverpayment(ctx, id) } satisfies OverpaymentRefundResponse);
  });
  r.post("/:id/credit-notes", allow(...OFFICE), async (req, res) => {
    const { id } = parse(idParamSchema, req.params);
    const input = parse(creditNoteSchema, req.body);
    res.status(201).json({ creditNote: await issueCreditNote(ctx, id, input) } satisfies CreditNoteResponse);
  });
  return r;
}
