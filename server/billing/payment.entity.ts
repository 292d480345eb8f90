import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { PaymentMethodCode } from "../../shared/billing";
import { Invoice } from "./invoice.entity";
import { User } from "../users/user.entity";

@Entity({ name: "payment" })
export class Payment {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index()
  @Column({ type: "int" })
  invoiceId: number;

  @ManyToOne(() => Invoice, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "invoiceId" })
  invoice?: Invoice;

  @Column({ type: "varchar", length: 20 })
  method: PaymentMethodCode;

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

  @ManyToOne(() => User, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "recordedById" })
  recordedBy?: User | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
