import { newId } from "./store";
import { invalid, noSuch } from "./params";
import type { Balance, BalanceTransaction, BalanceTransactionType, Charge, Metadata, Payout, Refund } from "./types";
import { BANK_ACCOUNT, CURRENCY, NO_REQUEST, type RequestCtx } from "./account-types";
import type { FakeAccount } from "./account";

/**
 * The fake account's money: balance transactions, the balance, refunds and payouts. Each takes the
 * account (its store, clock and event log); FakeAccount's methods of the same names call these.
 */

// ---- balance --------------------------------------------------------------------------------

export function addBalanceTransaction(acct: FakeAccount, type: BalanceTransactionType, amount: number, fee: number, source: string, description: string | null): BalanceTransaction {
  const now = acct.now();
  const txn: BalanceTransaction = {
    id: newId("txn"),
    object: "balance_transaction",
    amount,
    available_on: now,
    balance_type: "payments",
    created: now,
    currency: CURRENCY,
    description,
    exchange_rate: null,
    fee,
    fee_details: fee ? [{ amount: fee, application: null, currency: CURRENCY, description: "Stripe processing fees", type: "stripe_fee" }] : [],
    net: amount - fee,
    reporting_category: type,
    source,
    status: "available",
    type,
  };
  acct.store.put("balanceTransactions", txn);
  return txn;
}

export function availableBalance(acct: FakeAccount): number {
  return Object.values(acct.state.balanceTransactions).reduce((sum, t) => sum + (t.status === "available" ? t.net : 0), 0);
}

export function balance(acct: FakeAccount): Balance {
  const amount = availableBalance(acct);
  return {
    object: "balance",
    available: [{ amount, currency: CURRENCY, source_types: { card: amount } }],
    livemode: false,
    pending: [{ amount: 0, currency: CURRENCY, source_types: { card: 0 } }],
  };
}

// ---- refunds --------------------------------------------------------------------------------

export function createRefund(
  acct: FakeAccount,
  input: { charge: string | null; paymentIntent: string | null; amount: number | null; reason: Refund["reason"]; metadata: Metadata },
  ctx: RequestCtx,
): Refund {
  let charge: Charge | undefined;
  if (input.paymentIntent) {
    const pi = acct.store.get("paymentIntents", input.paymentIntent);
    if (!pi) throw noSuch(input.paymentIntent, "payment_intent", 400);
    if (pi.status !== "succeeded" || !pi.latest_charge) {
      throw invalid(`This PaymentIntent (${pi.id}) does not have a successful charge to refund.`, "payment_intent", "charge_not_refundable");
    }
    charge = acct.store.get("charges", pi.latest_charge);
    if (input.charge && input.charge !== pi.latest_charge) throw invalid(`Charge ${input.charge} does not belong to PaymentIntent ${pi.id}.`, "charge");
  } else if (input.charge) {
    charge = acct.store.get("charges", input.charge);
    if (!charge) throw noSuch(input.charge, "charge", 400);
  } else {
    throw invalid("One of the following params should be provided for this request: payment_intent or charge.", undefined, "parameter_missing");
  }
  if (!charge) throw new Error("payment intent without its charge");
  if (charge.status !== "succeeded") throw invalid(`Charge ${charge.id} has not succeeded and cannot be refunded.`, "charge", "charge_not_refundable");
  const remaining = charge.amount - charge.amount_refunded;
  if (remaining <= 0) throw invalid(`Charge ${charge.id} has already been refunded.`, "charge", "charge_already_refunded");
  const amount = input.amount ?? remaining;
  if (amount > remaining) {
    const usd = (n: number) => `$${(n / 100).toFixed(2)}`;
    throw invalid(`Refund amount (${usd(amount)}) is greater than unrefunded amount on charge (${usd(remaining)})`, "amount", "amount_too_large");
  }
  const id = newId("re");
  const txn = addBalanceTransaction(acct, "refund", -amount, 0, id, `REFUND FOR CHARGE${charge.description ? ` (${charge.description})` : ""}`);
  const refund: Refund = {
    id,
    object: "refund",
    amount,
    balance_transaction: txn.id,
    charge: charge.id,
    created: acct.now(),
    currency: charge.currency,
    metadata: input.metadata,
    payment_intent: charge.payment_intent,
    reason: input.reason,
    receipt_number: null,
    status: "succeeded",
  };
  acct.store.put("refunds", refund);
  const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded >= charge.amount;
  acct.emit("refund.created", refund, ctx);
  acct.emit("charge.refunded", charge, ctx, previous);
  return refund;
}

// ---- payouts --------------------------------------------------------------------------------

function makePayout(acct: FakeAccount, amount: number, automatic: boolean, fields: { description: string | null; metadata: Metadata; statementDescriptor: string | null }): Payout {
  const id = newId("po");
  const txn = addBalanceTransaction(acct, "payout", -amount, 0, id, fields.description);
  const now = acct.now();
  const payout: Payout = {
    id,
    object: "payout",
    amount,
    arrival_date: now,
    automatic,
    balance_transaction: txn.id,
    created: now,
    currency: CURRENCY,
    description: fields.description,
    destination: BANK_ACCOUNT,
    failure_balance_transaction: null,
    failure_code: null,
    failure_message: null,
    livemode: false,
    metadata: fields.metadata,
    method: "standard",
    original_payout: null,
    reconciliation_status: automatic ? "completed" : "not_applicable",
    reversed_by: null,
    source_type: "card",
    statement_descriptor: fields.statementDescriptor,
    status: "paid",
    type: "bank_account",
  };
  acct.store.put("payouts", payout);
  return payout;
}

/** POST /v1/payouts: a manual payout. Stripe cannot tell which transactions it contains. */
export function createManualPayout(acct: FakeAccount, input: { amount: number; description: string | null; metadata: Metadata; statementDescriptor: string | null }, ctx: RequestCtx): Payout {
  if (input.amount > availableBalance(acct)) {
    throw invalid(
      "You have insufficient funds in your Stripe account for this transfer. Your card balance is too low. You can use the /v1/balance endpoint to view your Stripe balance (for more details, see stripe.com/docs/api#balance).",
      "amount",
      "balance_insufficient",
    );
  }
  const payout = makePayout(acct, input.amount, false, input);
  acct.emit("payout.created", payout, ctx);
  acct.emit("payout.paid", payout, ctx);
  return payout;
}

/**
 * The automatic (scheduled) payout: sweeps the whole available balance and links every balance
 * transaction not yet paid out, and its own, so `?payout=po_...` lists them. Null when the balance is not positive.
 */
export function runAutomaticPayout(acct: FakeAccount, ctx: RequestCtx = NO_REQUEST): Payout | null {
  const amount = availableBalance(acct);
  if (amount <= 0) return null;
  const unlinked = Object.keys(acct.state.balanceTransactions).filter((id) => !acct.state.txnPayout[id]);
  const payout = makePayout(acct, amount, true, { description: "STRIPE PAYOUT", metadata: {}, statementDescriptor: null });
  for (const id of [...unlinked, payout.balance_transaction]) acct.state.txnPayout[id] = payout.id;
  acct.emit("payout.created", payout, ctx);
  acct.emit("payout.paid", payout, ctx);
  acct.emit("payout.reconciliation_completed", payout, ctx);
  return payout;
}
