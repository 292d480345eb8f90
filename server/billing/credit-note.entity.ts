import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { CreditNoteDisposition } from "../../shared/contracts/billing";
import { Invoice } from "./invoice.entity";
import { CustomerAccount } from "../accounts/account.entity";

@Entity({ name: "credit_note" })
export class CreditNote {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 30 })
  number: string;

  @Column({ type: "int" })
  invoiceId: number;

  @ManyToOne(() => Invoice, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "invoiceId" })
  invoice?: Invoice;

  @Column({ type: "int" })
  accountId: number;

  @ManyToOne(() => CustomerAccount, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "accountId" })
  account?: CustomerAccount;

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
  disposition: CreditNoteDisposition;

  @Column({ type: "int", nullable: true })
  carriedToInvoiceId: number | null;

  @ManyToOne(() => Invoice, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "carriedToInvoiceId" })
  carriedToInvoice?: Invoice | null;

  @Column({ type: "varchar", length: 80, nullable: true })
  stripeRefundId: string | null;

  @Column({ type: "date" })
  issueDate: string;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
