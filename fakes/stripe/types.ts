import type Stripe from "stripe";

/**
 * The Stripe objects the fake serves: a subset of each object's fields, with Stripe's names and types.
 * The compile-time checks at the bottom hold every shape against the official SDK's own types, so a
 * field the real API does not have, or one with the wrong type, fails `tsc`.
 */

export type Metadata = Record<string, string>;

interface Base {
  id: string;
  created: number;
  livemode: false;
}

export interface Customer extends Base {
  object: "customer";
  address: null;
  balance: number;
  currency: string | null;
  default_source: null;
  delinquent: boolean;
  description: string | null;
  email: string | null;
  invoice_prefix: string;
  metadata: Metadata;
  name: string | null;
  next_invoice_sequence: number;
  phone: string | null;
  preferred_locales: string[];
  shipping: null;
  tax_exempt: "none";
  test_clock: null;
}

export interface CustomerDetails {
  address: null;
  email: string | null;
  name: string | null;
  phone: null;
  tax_exempt: "none";
  tax_ids: [];
}

export interface CheckoutSession extends Base {
  object: "checkout.session";
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  currency: string;
  customer: string | null;
  customer_creation: "always" | "if_required" | null;
  customer_details: CustomerDetails | null;
  customer_email: string | null;
  expires_at: number;
  invoice: null;
  locale: null;
  metadata: Metadata;
  mode: "payment";
  payment_intent: string | null;
  payment_link: null;
  payment_method_types: string[];
  payment_status: "paid" | "unpaid";
  recovered_from: null;
  setup_intent: null;
  status: "open" | "complete" | "expired";
  submit_type: null;
  subscription: null;
  success_url: string | null;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: "hosted";
  url: string | null;
}

export interface Price {
  id: string;
  object: "price";
  active: boolean;
  billing_scheme: "per_unit";
  created: number;
  currency: string;
  livemode: false;
  metadata: Metadata;
  nickname: null;
  product: string;
  type: "one_time";
  unit_amount: number;
  unit_amount_decimal: string;
}

export interface LineItem {
  id: string;
  object: "item";
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  price: Price;
  quantity: number;
}

export interface LastPaymentError {
  charge: string;
  code: Stripe.PaymentIntent.LastPaymentError.Code;
  decline_code?: string;
  doc_url: string;
  message: string;
  payment_method_type: "card";
  type: "card_error";
}

export interface PaymentIntent extends Base {
  object: "payment_intent";
  amount: number;
  amount_capturable: number;
  amount_received: number;
  canceled_at: number | null;
  cancellation_reason: null;
  capture_method: "automatic";
  client_secret: string;
  confirmation_method: "automatic";
  currency: string;
  customer: string | null;
  description: string | null;
  last_payment_error: LastPaymentError | null;
  latest_charge: string | null;
  metadata: Metadata;
  next_action: null;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  status: "requires_payment_method" | "succeeded";
}

export interface CardDetails {
  brand: string;
  country: string;
  exp_month: number;
  exp_year: number;
  funding: string;
  last4: string;
  network: string;
}

export interface Charge extends Base {
  object: "charge";
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  balance_transaction: string | null;
  billing_details: { address: null; email: string | null; name: string | null; phone: null };
  captured: boolean;
  currency: string;
  customer: string | null;
  description: string | null;
  disputed: boolean;
  failure_code: string | null;
  failure_message: string | null;
  metadata: Metadata;
  outcome: {
    network_status: string;
    reason: string | null;
    risk_level: string;
    seller_message: string;
    type: string;
  };
  paid: boolean;
  payment_intent: string | null;
  payment_method: string;
  payment_method_details: { type: "card"; card: CardDetails };
  receipt_email: string | null;
  refunded: boolean;
  status: "succeeded" | "failed";
}

export type BalanceTransactionType = "charge" | "refund" | "payout";

export interface BalanceTransaction extends Omit<Base, "livemode"> {
  object: "balance_transaction";
  amount: number;
  available_on: number;
  balance_type: "payments";
  currency: string;
  description: string | null;
  exchange_rate: null;
  fee: number;
  fee_details: { amount: number; application: null; currency: string; description: string; type: "stripe_fee" }[];
  net: number;
  reporting_category: BalanceTransactionType;
  source: string;
  status: "available";
  type: BalanceTransactionType;
}

export interface Refund extends Omit<Base, "livemode"> {
  object: "refund";
  amount: number;
  balance_transaction: string;
  charge: string;
  currency: string;
  metadata: Metadata;
  payment_intent: string | null;
  reason: "duplicate" | "fraudulent" | "requested_by_customer" | null;
  receipt_number: null;
  status: "succeeded";
}

export interface Payout extends Base {
  object: "payout";
  amount: number;
  arrival_date: number;
  automatic: boolean;
  balance_transaction: string;
  currency: string;
  description: string | null;
  destination: string;
  failure_balance_transaction: null;
  failure_code: null;
  failure_message: null;
  metadata: Metadata;
  method: "standard";
  original_payout: null;
  reconciliation_status: "completed" | "not_applicable";
  reversed_by: null;
  source_type: "card";
  statement_descriptor: string | null;
  status: "paid";
  type: "bank_account";
}

export type ApiObject = Customer | CheckoutSession | PaymentIntent | Charge | BalanceTransaction | Refund | Payout;

export interface StripeEvent extends Base {
  object: "event";
  api_version: string;
  data: { object: ApiObject; previous_attributes?: Record<string, unknown> };
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface Balance {
  object: "balance";
  available: { amount: number; currency: string; source_types: { card: number } }[];
  livemode: false;
  pending: { amount: number; currency: string; source_types: { card: number } }[];
}

export interface ListResponse<T> {
  object: "list";
  data: T[];
  has_more: boolean;
  url: string;
}

// ---- Compile-time fidelity checks against the official SDK's types ---------------------------------

type DeepPartial<T> = T extends readonly (infer U)[] ? DeepPartial<U>[] : T extends object ? { [K in keyof T]?: DeepPartial<T[K]> } : T;
/** `true` when every field of A exists in B with a compatible type; otherwise names the offending keys. */
type Fits<A, B> = [Exclude<keyof A, keyof B>] extends [never] ? (A extends DeepPartial<B> ? true : ["type mismatch with", B]) : ["not a Stripe field:", Exclude<keyof A, keyof B>];
type Assert<T extends true> = T;

export type FidelityChecks = [
  Assert<Fits<Customer, Stripe.Customer>>,
  Assert<Fits<CheckoutSession, Stripe.Checkout.Session>>,
  Assert<Fits<CustomerDetails, Stripe.Checkout.Session.CustomerDetails>>,
  Assert<Fits<LineItem, Stripe.LineItem>>,
  Assert<Fits<Price, Stripe.Price>>,
  Assert<Fits<PaymentIntent, Stripe.PaymentIntent>>,
  Assert<Fits<LastPaymentError, Stripe.PaymentIntent.LastPaymentError>>,
  Assert<Fits<Charge, Stripe.Charge>>,
  Assert<Fits<CardDetails, Stripe.Charge.PaymentMethodDetails.Card>>,
  Assert<Fits<Charge["outcome"], Stripe.Charge.Outcome>>,
  Assert<Fits<BalanceTransaction, Stripe.BalanceTransaction>>,
  Assert<Fits<Refund, Stripe.Refund>>,
  Assert<Fits<Payout, Stripe.Payout>>,
  Assert<Fits<Balance, Stripe.Balance>>,
  Assert<Fits<Omit<StripeEvent, "data" | "type">, Stripe.Event>>,
];
