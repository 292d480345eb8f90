import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";

export type InvoiceStatus = "open" | "paid" | "void" | "partially_refunded" | "refunded";

/** The next invoice (or credit-note) number per series and year, taken under a row lock: gapless. */
@Entity({ name: "number_counter" })
export class NumberCounter {
  @PrimaryColumn({ type: "varchar", length: 20 })
  series: string;

  @PrimaryColumn({ type: "int" })
  year: number;

  @Column({ type: "int" })
  next: number;
}

@Entity({ name: "invoice" })
@Index(["accountId", "status"])
export class Invoice {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  /** e.g. HB-2026-00042 */
  @Index({ unique: true })
  @Column({ type: "varchar", length: 30 })
  number: string;

  @Column({ type: "int" })
  year: number;

  @Column({ type: "int" })
  seq: number;

  @Column({ type: "int" })
  accountId: number;

  /** "order": one delivered order; "statement": a week of deliveries for an account on terms. */
  @Column({ type: "varchar", length: 10 })
  kind: "order" | "statement";

  @Column({ type: "varchar", length: 20, default: "open" })
  status: InvoiceStatus;

  @Column({ type: "date" })
  issueDate: string;

  @Column({ type: "date" })
  dueDate: string;

  @Column({ type: "date", nullable: true })
  periodStart: string | null;

  @Column({ type: "date", nullable: true })
  periodEnd: string | null;

  @Column({ type: "char", length: 3 })
  currency: string;

  @Column({ type: "int" })
  subtotalCents: number;

  /** Basis points: 875 = 8.75 %. 0 when the account held a valid exemption certificate. */
  @Column({ type: "int" })
  taxRateBp: number;

  @Column({ type: "int" })
  taxCents: number;

  @Column({ type: "int" })
  totalCents: number;

  /** Credit notes applied against this invoice (short deliveries, or carried from earlier invoices). */
  @Column({ type: "int", default: 0 })
  creditedCents: number;

  @Column({ type: "int", default: 0 })
  paidCents: number;

  @Column({ type: "int", default: 0 })
  refundedCents: number;

  /**
   * The part of refundedCents that gave back an overpayment (a card payment that arrived after the invoice
   * was settled another way). It does not make the invoice "refunded": the sale itself was not refunded.
   */
  @Column({ type: "int", default: 0 })
  overpaymentRefundedCents: number;

  @Column({ type: "boolean", default: false })
  taxExempt: boolean;

  @Column({ type: "datetime", precision: 3, nullable: true })
  sentAt: Date | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}

@Entity({ name: "invoice_line" })
@Index(["invoiceId"])
export class InvoiceLine {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  invoiceId: number;

  @Index({ unique: true })
  @Column({ type: "int" })
  orderLineId: number;

  @Column({ type: "int" })
  orderId: number;

  @Column({ type: "date" })
  deliveryDate: string;

  @Column({ type: "varchar", length: 200 })
  description: string;

  @Column({ type: "int" })
  quantity: number;

  @Column({ type: "int" })
  unitPriceCents: number;

  @Column({ type: "int" })
  amountCents: number;
}

@Entity({ name: "payment" })
export class Payment {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index()
  @Column({ type: "int" })
  invoiceId: number;

  @Column({ type: "varchar", length: 20 })
  method: "card" | "bank_transfer" | "cheque" | "cash" | "other";

  @Column({ type: "int" })
  amountCents: number;

  @Column({ type: "varchar", length: 120, default: "" })
  reference: string;

  /** Unique: a payment intent is recorded once, whichever webhook brings it first. */
  @Index({ unique: true })
  @Column({ type: "varchar", length: 80, nullable: true })
  stripePaymentIntentId: string | null;

  @Index()
  @Column({ type: "varchar", length: 80, nullable: true })
  stripeChargeId: string | null;

  @Column({ type: "date" })
  receivedOn: string;

  @Column({ type: "int", nullable: true })
  recordedById: number | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

@Entity({ name: "credit_note" })
export class CreditNote {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 30 })
  number: string;

  @Column({ type: "int" })
  invoiceId: number;

  @Column({ type: "int" })
  accountId: number;

  @Column({ type: "varchar", length: 300 })
  reason: string;

  /** JSON [{ description, quantity, unitPriceCents, amountCents }] */
  @Column({ type: "text" })
  lines: string;

  @Column({ type: "int" })
  subtotalCents: number;

  @Column({ type: "int" })
  taxCents: number;

  @Column({ type: "int" })
  totalCents: number;

  /** "applied": reduced the invoice's amount due; "refund": refunded through Stripe; "carry": to the next invoice. */
  @Column({ type: "varchar", length: 10 })
  disposition: "applied" | "refund" | "carry";

  @Column({ type: "int", nullable: true })
  carriedToInvoiceId: number | null;

  @Column({ type: "varchar", length: 80, nullable: true })
  stripeRefundId: string | null;

  @Column({ type: "date" })
  issueDate: string;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

@Entity({ name: "refund" })
export class Refund {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  invoiceId: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 80 })
  stripeRefundId: string;

  @Column({ type: "varchar", length: 80, nullable: true })
  stripeChargeId: string | null;

  @Column({ type: "int" })
  amountCents: number;

  @Column({ type: "int", nullable: true })
  creditNoteId: number | null;

  /** Gave back an overpayment (Stripe refund metadata purpose=overpayment), not part of the sale. */
  @Column({ type: "boolean", default: false })
  overpayment: boolean;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

@Entity({ name: "checkout_session" })
export class CheckoutSessionRecord {
  @PrimaryColumn({ type: "varchar", length: 120 })
  id: string;

  @Index()
  @Column({ type: "int" })
  invoiceId: number;

  @Column({ type: "int" })
  amountCents: number;

  @Column({ type: "varchar", length: 500 })
  url: string;

  @Column({ type: "varchar", length: 12, default: "open" })
  status: "open" | "complete" | "expired";

  @Column({ type: "datetime", precision: 3 })
  expiresAt: Date;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

/**
 * Every Stripe event handled, by id: a replay or duplicate is acknowledged and changes nothing. An event that
 * does not match what Panwise created and what Stripe answers is kept as "rejected" with the reason, and
 * shown on the invoice it claimed to pay.
 */
@Entity({ name: "stripe_event" })
@Index(["invoiceId", "outcome"])
export class StripeEventRecord {
  @PrimaryColumn({ type: "varchar", length: 80 })
  id: string;

  @Column({ type: "varchar", length: 60 })
  type: string;

  /** "applied": handled (including events with nothing to change); "rejected": refused, never applied. */
  @Column({ type: "varchar", length: 10, default: "applied" })
  outcome: "applied" | "rejected";

  @Column({ type: "varchar", length: 300, default: "" })
  reason: string;

  /** The invoice the event named (its metadata), when it named one. */
  @Column({ type: "int", nullable: true })
  invoiceId: number | null;

  /** "webhook" (delivered) or "catch-up" (found later by listing Stripe's events or sessions). */
  @Column({ type: "varchar", length: 10, default: "webhook" })
  source: "webhook" | "catch-up";

  /** The event's own `created` (Unix seconds, Stripe's clock). */
  @Column({ type: "int", nullable: true })
  stripeCreated: number | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  receivedAt: Date;
}

/**
 * Where the catch-up job has got to, per kind: `createdCursor` is a Stripe `created` time (Unix seconds)
 * before which every event has been seen. One row per name; the job runs under a named lock, so one writer.
 */
@Entity({ name: "stripe_sync_state" })
export class StripeSyncState {
  @PrimaryColumn({ type: "varchar", length: 40 })
  name: string;

  @Column({ type: "int" })
  createdCursor: number;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}

@Entity({ name: "payout_reconciliation" })
export class PayoutReconciliation {
  @PrimaryColumn({ type: "varchar", length: 80 })
  payoutId: string;

  @Column({ type: "int" })
  reconciledById: number;

  @Column({ type: "datetime", precision: 3 })
  reconciledAt: Date;

  @Column({ type: "varchar", length: 300, default: "" })
  note: string;
}

/** A resale or tax-exemption certificate, approved by the owner, valid until its expiry date. */
@Entity({ name: "tax_certificate" })
export class TaxCertificate {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index()
  @Column({ type: "int" })
  accountId: number;

  @Column({ type: "varchar", length: 80 })
  file: string;

  @Column({ type: "varchar", length: 40 })
  contentType: string;

  /** Bytes stored for this certificate: counted against the account's storage quota (rows from before: 0). */
  @Column({ type: "int", default: 0 })
  sizeBytes: number;

  @Column({ type: "varchar", length: 10, default: "pending" })
  status: "pending" | "approved" | "rejected";

  @Column({ type: "date" })
  expiresOn: string;

  @Column({ type: "int", nullable: true })
  reviewedById: number | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

/** What actually went out on a delivery, when it differs from the order. Becomes a credit note on invoicing. */
@Entity({ name: "delivery_adjustment" })
@Index(["orderId", "productId"], { unique: true })
export class DeliveryAdjustment {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  orderId: number;

  @Column({ type: "int" })
  productId: number;

  @Column({ type: "int" })
  deliveredQuantity: number;

  @Column({ type: "varchar", length: 200, default: "" })
  reason: string;

  @Column({ type: "int", nullable: true })
  creditNoteId: number | null;
}
