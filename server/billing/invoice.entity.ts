import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import { CustomerAccount } from "../accounts/account.entity";
import type { InvoiceKindCode, InvoiceStatusCode } from "../../shared/billing";

export type InvoiceStatus = InvoiceStatusCode;

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

  @ManyToOne(() => CustomerAccount, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "accountId" })
  account?: CustomerAccount;

  /** "order": one delivered order; "statement": a week of deliveries for an account on terms. */
  @Column({ type: "varchar", length: 10 })
  kind: InvoiceKindCode;

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
