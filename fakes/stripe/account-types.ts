import type { Metadata, CheckoutSession, PaymentIntent, StripeEvent } from "./types";
import type { Decline } from "./luhn";

/** The fake account's constants and the shapes its callers pass in (split from account.ts). */

/** The API version the installed SDK (stripe 23) pins; events carry the caller's Stripe-Version when sent. */
export const DEFAULT_API_VERSION = "2026-10-28.endive";
export const CURRENCY = "usd";
export const BANK_ACCOUNT = "ba_PanwiseFakeBankAccount0";

export interface RequestCtx {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string | null;
}

export const NO_REQUEST: RequestCtx = { requestId: null, idempotencyKey: null, apiVersion: null };

export interface AccountOptions {
  feePercent: number;
  feeFixed: number;
  nowMs: () => number;
  publicBase: () => string;
  /** Whether an event of this type goes to the webhook endpoint (sets `pending_webhooks`). */
  webhookWants: (type: string) => boolean;
  onEvent: (event: StripeEvent) => void;
}

export interface NewLineItem {
  name: string;
  description: string | null;
  productMetadata: Metadata;
  currency: string;
  unitAmount: number;
  quantity: number;
}

export interface NewCheckoutSession {
  lineItems: NewLineItem[];
  successUrl: string | null;
  cancelUrl: string | null;
  customer: string | null;
  customerEmail: string | null;
  customerCreation: "always" | "if_required" | null;
  metadata: Metadata;
  clientReferenceId: string | null;
  paymentIntentData: { metadata: Metadata; description: string | null };
  expiresAt: number | null;
}

export interface CardInput {
  /** Digits only; used for the outcome and last4/brand, never stored. */
  number: string;
  expMonth: number;
  expYear: number;
  name: string;
  email: string;
}

export type PaymentResult = { ok: true; session: CheckoutSession; redirectTo: string | null } | { ok: false; decline: Decline; paymentIntent: PaymentIntent };

