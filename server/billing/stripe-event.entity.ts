import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import { Invoice } from "./invoice.entity";

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

  @ManyToOne(() => Invoice, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "invoiceId" })
  invoice?: Invoice | null;

  /** "webhook" (delivered) or "catch-up" (found later by listing Stripe's events or sessions). */
  @Column({ type: "varchar", length: 10, default: "webhook" })
  source: "webhook" | "catch-up";

  /** The event's own `created` (Unix seconds, Stripe's clock). */
  @Column({ type: "int", nullable: true })
  stripeCreated: number | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  receivedAt: Date;
}
