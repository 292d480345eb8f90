import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import { Invoice } from "./invoice.entity";

@Entity({ name: "checkout_session" })
export class CheckoutSessionRecord {
  @PrimaryColumn({ type: "varchar", length: 120 })
  id: string;

  @Index()
  @Column({ type: "int" })
  invoiceId: number;

  @ManyToOne(() => Invoice, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "invoiceId" })
  invoice?: Invoice;

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
