import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import type { Metadata, BalanceTransaction, Charge, CheckoutSession, Customer, LineItem, PaymentIntent, Payout, Refund, StripeEvent } from "./types";

/**
 * The fake's whole state: Stripe objects by id (insertion order is creation order), plus the links
 * Stripe keeps to itself (which payout swept a balance transaction, which payment intent a session
 * is paying with) and the idempotency records. Written to a JSON file after each change: a temporary
 * file and a rename, so a crash never leaves half a file.
 */
export interface IdempotencyRecord {
  method: string;
  path: string;
  fingerprint: string;
  status: number;
  body: unknown;
  requestId: string;
  createdAt: number;
}

export interface SessionPrivate {
  /** `payment_intent_data` given at creation: copied onto the payment intent. */
  paymentIntentData: { metadata: Metadata; description: string | null };
  /** The payment intent the session's attempts use; shown as `payment_intent` once paid. */
  paymentIntent: string | null;
}

export interface FakeState {
  version: 1;
  customers: Record<string, Customer>;
  checkoutSessions: Record<string, CheckoutSession>;
  paymentIntents: Record<string, PaymentIntent>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  balanceTransactions: Record<string, BalanceTransaction>;
  payouts: Record<string, Payout>;
  events: Record<string, StripeEvent>;
  /** Line items of each session (Stripe serves them only through expand / their own list). */
  lineItems: Record<string, LineItem[]>;
  /** Balance transaction id → id of the automatic payout that paid it out (Stripe's `?payout=` filter). */
  txnPayout: Record<string, string>;
  /** What Stripe keeps per checkout session without showing it on the session object. */
  sessionPrivate: Record<string, SessionPrivate>;
  /** "<hash of API key>:<Idempotency-Key>" → the stored response. */
  idempotency: Record<string, IdempotencyRecord>;
}

export type Collection = "customers" | "checkoutSessions" | "paymentIntents" | "charges" | "refunds" | "balanceTransactions" | "payouts" | "events";

export const emptyState = (): FakeState => ({
  version: 1,
  customers: {},
  checkoutSessions: {},
  paymentIntents: {},
  charges: {},
  refunds: {},
  balanceTransactions: {},
  payouts: {},
  events: {},
  lineItems: {},
  txnPayout: {},
  sessionPrivate: {},
  idempotency: {},
});

const PREFIX_COLLECTION: Record<string, Collection> = {
  cus: "customers", cs: "checkoutSessions", pi: "paymentIntents", ch: "charges", re: "refunds", txn: "balanceTransactions", po: "payouts", evt: "events",
};

export function collectionOf(id: string): Collection | null {
  return PREFIX_COLLECTION[id.split("_")[0]!] ?? null;
}

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

export function randomToken(length: number): string {
  const bytes = crypto.randomBytes(length);
  let out = "";
  for (let i = 0; i < length; i++) out += ALPHABET[bytes[i]! % ALPHABET.length];
  return out;
}

/** Ids shaped like Stripe's: `cus_` + 14, `pi_` + 24, `cs_test_` + 58 characters. */
export function newId(prefix: string, length?: number): string {
  const len = length ?? (prefix === "cs_test" ? 58 : prefix === "cus" || prefix === "prod" ? 14 : 24);
  return `${prefix}_${randomToken(len)}`;
}

export class Store {
  state: FakeState;

  constructor(private readonly file: string | null) {
    this.state = file ? Store.load(file) : emptyState();
  }

  static load(file: string): FakeState {
    let text: string;
    try {
      text = fs.readFileSync(file, "utf8");
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === "ENOENT") return emptyState();
      throw err;
    }
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch {
      throw new Error(`Stripe fake: state file ${file} is not valid JSON; delete it to start empty`);
    }
    const s = parsed as Partial<FakeState> | null;
    if (!s || s.version !== 1) throw new Error(`Stripe fake: state file ${file} has an unknown format (version ${String(s?.version)})`);
    return { ...emptyState(), ...s };
  }

  /** Atomic write: a sibling temporary file, then rename over the old one. */
  save(): void {
    if (!this.file) return;
    fs.mkdirSync(path.dirname(this.file), { recursive: true });
    const tmp = `${this.file}.${process.pid}.${randomToken(6)}.tmp`;
    try {
      fs.writeFileSync(tmp, JSON.stringify(this.state, null, 1));
      fs.renameSync(tmp, this.file);
    } catch (err) {
      fs.rmSync(tmp, { force: true });
      throw err;
    }
  }

  reset(): void {
    this.state = emptyState();
    this.save();
  }

  get<C extends Collection>(collection: C, id: string): FakeState[C][string] | undefined {
    return (this.state[collection] as Record<string, FakeState[C][string]>)[id];
  }

  put<C extends Collection>(collection: C, obj: FakeState[C][string]): void {
    (this.state[collection] as Record<string, FakeState[C][string]>)[obj.id] = obj;
  }

  /** Any object by id, found through its prefix. */
  find(id: string): { collection: Collection; obj: FakeState[Collection][string] } | null {
    const collection = collectionOf(id);
    const obj = collection ? this.get(collection, id) : undefined;
    return collection && obj ? { collection, obj } : null;
  }

  /** Newest first, as Stripe lists. */
  newestFirst<C extends Collection>(collection: C): FakeState[C][string][] {
    return Object.values(this.state[collection] as Record<string, FakeState[C][string]>).reverse();
  }
}
