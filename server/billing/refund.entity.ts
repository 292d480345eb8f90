import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { Invoice } from "./invoice.entity";
import { CreditNote } from "./credit-note.entity";

@Entity({ name: "refund" })
export class Refund {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  invoiceId: number;

  @ManyToOne(() => Invoice, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "invoiceId" })
  invoice?: Invoice;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 80 })
  stripeRefundId: string;

  @Column({ type: "varchar", length: 80, nullable: true })
  stripeChargeId: string | null;

  @Column({ type: "int" })
  amountCents: number;

  @Column({ type: "int", nullable: true })
  creditNoteId: number | null;

  @ManyToOne(() => CreditNote, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "creditNoteId" })
  creditNote?: CreditNote | null;

  /** Gave back an overpayment (Stripe refund metadata purpose=overpayment), not part of the sale. */
  @Column({ type: "boolean", default: false })
  overpayment: boolean;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
