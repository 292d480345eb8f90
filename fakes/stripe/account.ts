import { newId, randomToken, type Store } from "./store";
import { invalid, noSuch } from "./params";
import { cardBrand, testCardOutcome } from "./luhn";
import * as ledger from "./ledger";
import { CURRENCY, DEFAULT_API_VERSION, NO_REQUEST, type AccountOptions, type CardInput, type NewCheckoutSession, type PaymentResult, type RequestCtx } from "./account-types";
import type {
  ApiObject, Balance, Charge, CheckoutSession, Customer, LineItem, Metadata, PaymentIntent, Payout, Refund, StripeEvent,
} from "./types";

/**
 * The fake Stripe account: every state change (customers, sessions, payments, refunds, payouts)
 * and the event it records. Inputs arrive already validated and typed (see api.ts); the checks
 * here are the ones that depend on state. Callers persist the store afterwards.
 */

const clone = <T>(v: T): T => structuredClone(v);

export class FakeAccount {
  constructor(
    readonly store: Store,
    private readonly opts: AccountOptions,
  ) {}

  get state() {
    return this.store.state;
  }

  now(): number {
    return Math.floor(this.opts.nowMs() / 1000);
  }

  fee(amount: number): number {
    return Math.round((amount * this.opts.feePercent) / 100) + this.opts.feeFixed;
  }

  emit(type: string, obj: ApiObject, ctx: RequestCtx, previous?: Record<string, unknown>): StripeEvent {
    const event: StripeEvent = {
      id: newId("evt"),
      object: "event",
      api_version: ctx.apiVersion ?? DEFAULT_API_VERSION,
      created: this.now(),
      data: { object: clone(obj), ...(previous ? { previous_attributes: previous } : {}) },
      livemode: false,
      pending_webhooks: this.opts.webhookWants(type) ? 1 : 0,
      request: { id: ctx.requestId, idempotency_key: ctx.idempotencyKey },
      type,
    };
    this.store.put("events", event);
    this.opts.onEvent(event);
    return event;
  }

  webhookDelivered(eventId: string): void {
    const e = this.store.get("events", eventId);
    if (e && e.pending_webhooks > 0) {
      e.pending_webhooks--;
      this.store.save();
    }
  }

  // ---- customers ------------------------------------------------------------------------------

  createCustomer(input: { email: string | null; name: string | null; description: string | null; phone: string | null; metadata: Metadata }, ctx: RequestCtx): Customer {
    const customer: Customer = {
      id: newId("cus"),
      object: "customer",
      address: null,
      balance: 0,
      created: this.now(),
      currency: null,
      default_source: null,
      delinquent: false,
      description: input.description,
      email: input.email,
      invoice_prefix: randomToken(8).toUpperCase(),
      livemode: false,
      metadata: input.metadata,
      name: input.name,
      next_invoice_sequence: 1,
      phone: input.phone,
      preferred_locales: [],
      shipping: null,
      tax_exempt: "none",
      test_clock: null,
    };
    this.store.put("customers", customer);
    this.emit("customer.created", customer, ctx);
    return customer;
  }

  // ---- checkout sessions ------------------------------------------------------------------------

  createCheckoutSession(input: NewCheckoutSession, ctx: RequestCtx): CheckoutSession {
    const now = this.now();
    if (input.customer && !this.store.get("customers", input.customer)) throw noSuch(input.customer, "customer", 400);
    const expiresAt = input.expiresAt ?? now + 24 * 3600;
    if (expiresAt < now + 30 * 60 - 60) throw invalid("The `expires_at` timestamp must be at least 30 minutes from Checkout Session creation.", "expires_at");
    if (expiresAt > now + 24 * 3600 + 60) throw invalid("The `expires_at` timestamp must be less than 24 hours from Checkout Session creation.", "expires_at");
    const total = input.lineItems.reduce((sum, li) => sum + li.unitAmount * li.quantity, 0);
    if (total < 50) throw invalid("The Checkout Session's total amount due must add up to at least $0.50 usd", undefined, "amount_too_small");
    if (total > 99_999_999) throw invalid("The Checkout Session's total amount due must be no more than $999,999.99 usd", undefined, "amount_too_large");

    const id = newId("cs_test");
    const items: LineItem[] = input.lineItems.map((li) => ({
      id: newId("li"),
      object: "item",
      amount_discount: 0,
      amount_subtotal: li.unitAmount * li.quantity,
      amount_tax: 0,
      amount_total: li.unitAmount * li.quantity,
      currency: li.currency,
      description: li.name,
      price: {
        id: newId("price"),
        object: "price",
        active: false,
        billing_scheme: "per_unit",
        created: now,
        currency: li.currency,
        livemode: false,
        metadata: {},
        nickname: null,
        product: newId("prod"),
        type: "one_time",
        unit_amount: li.unitAmount,
        unit_amount_decimal: String(li.unitAmount),
      },
      quantity: li.quantity,
    }));
    const session: CheckoutSession = {
      id,
      object: "checkout.session",
      amount_subtotal: total,
      amount_total: total,
      cancel_url: input.cancelUrl,
      client_reference_id: input.clientReferenceId,
      created: now,
      currency: CURRENCY,
      customer: input.customer,
      customer_creation: input.customer ? null : (input.customerCreation ?? "if_required"),
      customer_details: null,
      customer_email: input.customerEmail,
      expires_at: expiresAt,
      invoice: null,
      livemode: false,
      locale: null,
      metadata: input.metadata,
      mode: "payment",
      payment_intent: null,
      payment_link: null,
      payment_method_types: ["card"],
      payment_status: "unpaid",
      recovered_from: null,
      setup_intent: null,
      status: "open",
      submit_type: null,
      subscription: null,
      success_url: input.successUrl,
      total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
      ui_mode: "hosted",
      url: `${this.opts.publicBase()}/pay/${id}`,
    };
    this.store.put("checkoutSessions", session);
    this.state.lineItems[id] = items;
    this.state.sessionPrivate[id] = { paymentIntentData: input.paymentIntentData, paymentIntent: null };
    return session;
  }

  expireSession(id: string, ctx: RequestCtx): CheckoutSession {
    const s = this.store.get("checkoutSessions", id);
    if (!s) throw noSuch(id);
    if (s.status !== "open") throw invalid(`Only Checkout Sessions with a status in ["open"] can be expired.`, undefined, "checkout_session_not_open");
    s.status = "expired";
    s.url = null;
    this.emit("checkout.session.expired", s, ctx);
    return s;
  }

  /** Expires open sessions whose `expires_at` has passed. Returns how many changed. */
  expireDue(): number {
    const now = this.now();
    let n = 0;
    for (const s of Object.values(this.state.checkoutSessions)) {
      if (s.status === "open" && s.expires_at <= now) {
        this.expireSession(s.id, NO_REQUEST);
        n++;
      }
    }
    return n;
  }

  /** One attempt to pay a session from the hosted page. The card number itself is never stored. */
  pay(sessionId: string, card: CardInput): PaymentResult {
    const session = this.store.get("checkoutSessions", sessionId);
    if (!session || session.status !== "open") throw new Error(`session ${sessionId} is not open`);
    const priv = this.state.sessionPrivate[sessionId] ?? { paymentIntentData: { metadata: {}, description: null }, paymentIntent: null };
    this.state.sessionPrivate[sessionId] = priv;
    const now = this.now();
    const ctx = NO_REQUEST;

    let pi = priv.paymentIntent ? this.store.get("paymentIntents", priv.paymentIntent) : undefined;
    if (!pi) {
      const piId = newId("pi");
      pi = {
        id: piId,
        object: "payment_intent",
        amount: session.amount_total,
        amount_capturable: 0,
        amount_received: 0,
        canceled_at: null,
        cancellation_reason: null,
        capture_method: "automatic",
        client_secret: `${piId}_secret_${randomToken(25)}`,
        confirmation_method: "automatic",
        created: now,
        currency: session.currency,
        customer: session.customer,
        description: priv.paymentIntentData.description,
        last_payment_error: null,
        latest_charge: null,
        livemode: false,
        // Stripe copies payment_intent_data.metadata, not the session's own metadata.
        metadata: { ...priv.paymentIntentData.metadata },
        next_action: null,
        payment_method: null,
        payment_method_types: ["card"],
        receipt_email: null,
        status: "requires_payment_method",
      };
      this.store.put("paymentIntents", pi);
      priv.paymentIntent = pi.id;
      this.emit("payment_intent.created", pi, ctx);
    }

    const decline = testCardOutcome(card.number);
    const brand = cardBrand(card.number);
    const email = session.customer_email ?? (session.customer ? this.store.get("customers", session.customer)?.email : null) ?? card.email;
    let customerId = session.customer;
    if (!decline && !customerId && session.customer_creation === "always") {
      customerId = this.createCustomer({ email, name: card.name, description: null, phone: null, metadata: {} }, ctx).id;
    }
    const paymentMethod = newId("pm");
    const charge: Charge = {
      id: newId("ch"),
      object: "charge",
      amount: pi.amount,
      amount_captured: decline ? 0 : pi.amount,
      amount_refunded: 0,
      balance_transaction: null,
      billing_details: { address: null, email, name: card.name, phone: null },
      captured: !decline,
      created: now,
      currency: pi.currency,
      customer: customerId,
      description: pi.description,
      disputed: false,
      failure_code: decline?.code ?? null,
      failure_message: decline?.message ?? null,
      livemode: false,
      metadata: { ...pi.metadata },
      outcome: decline
        ? {
            network_status: "declined_by_network",
            reason: decline.declineCode ?? decline.code,
            risk_level: "normal",
            seller_message: "The bank did not return any further details with this decline.",
            type: "issuer_declined",
          }
        : { network_status: "approved_by_network", reason: null, risk_level: "normal", seller_message: "Payment complete.", type: "authorized" },
      paid: !decline,
      payment_intent: pi.id,
      payment_method: paymentMethod,
      payment_method_details: {
        type: "card",
        card: { brand, country: "US", exp_month: card.expMonth, exp_year: card.expYear, funding: "credit", last4: card.number.slice(-4), network: brand },
      },
      receipt_email: null,
      refunded: false,
      status: decline ? "failed" : "succeeded",
    };

    if (decline) {
      this.store.put("charges", charge);
      pi.latest_charge = charge.id;
      pi.payment_method = null;
      pi.last_payment_error = {
        charge: charge.id,
        code: decline.code as NonNullable<PaymentIntent["last_payment_error"]>["code"],
        ...(decline.declineCode ? { decline_code: decline.declineCode } : {}),
        doc_url: `https://stripe.com/docs/error-codes/${decline.code.replace(/_/g, "-")}`,
        message: decline.message,
        payment_method_type: "card",
        type: "card_error",
      };
      this.emit("charge.failed", charge, ctx);
      this.emit("payment_intent.payment_failed", pi, ctx);
      return { ok: false, decline, paymentIntent: pi };
    }

    const txn = ledger.addBalanceTransaction(this, "charge", charge.amount, this.fee(charge.amount), charge.id, pi.description);
    charge.balance_transaction = txn.id;
    this.store.put("charges", charge);
    Object.assign(pi, {
      amount_received: pi.amount,
      customer: customerId,
      last_payment_error: null,
      latest_charge: charge.id,
      payment_method: paymentMethod,
      status: "succeeded",
    } satisfies Partial<PaymentIntent>);
    Object.assign(session, {
      customer: customerId,
      customer_details: { address: null, email, name: card.name, phone: null, tax_exempt: "none", tax_ids: [] },
      payment_intent: pi.id,
      payment_status: "paid",
      status: "complete",
      url: null,
    } satisfies Partial<CheckoutSession>);
    this.emit("charge.succeeded", charge, ctx);
    this.emit("payment_intent.succeeded", pi, ctx);
    this.emit("checkout.session.completed", session, ctx);
    const redirectTo = session.success_url ? session.success_url.replace(/\{CHECKOUT_SESSION_ID\}|%7BCHECKOUT_SESSION_ID%7D/gi, session.id) : null;
    return { ok: true, session, redirectTo };
  }

  // ---- balance, refunds, payouts (ledger.ts) -------------------------------------------------

  availableBalance(): number {
    return ledger.availableBalance(this);
  }

  balance(): Balance {
    return ledger.balance(this);
  }

  createRefund(input: Parameters<typeof ledger.createRefund>[1], ctx: RequestCtx): Refund {
    return ledger.createRefund(this, input, ctx);
  }

  /** POST /v1/payouts: a manual payout. Stripe cannot tell which transactions it contains. */
  createManualPayout(input: Parameters<typeof ledger.createManualPayout>[1], ctx: RequestCtx): Payout {
    return ledger.createManualPayout(this, input, ctx);
  }

  /** The automatic (scheduled) payout of the whole available balance (ledger.ts). */
  runAutomaticPayout(ctx: RequestCtx = NO_REQUEST): Payout | null {
    return ledger.runAutomaticPayout(this, ctx);
  }
}

export * from "./account-types";
