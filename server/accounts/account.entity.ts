import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import type { AccountStatus } from "../../shared/schemas/accounts";

/** A wholesale customer: a café, restaurant or shop that orders from the bakery. */
@Entity({ name: "customer_account" })
export class CustomerAccount {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index()
  @Column({ type: "varchar", length: 160 })
  businessName: string;

  @Column({ type: "varchar", length: 500 })
  deliveryAddress: string;

  @Column({ type: "varchar", length: 120, default: "" })
  contactName: string;

  @Column({ type: "varchar", length: 40, default: "" })
  contactPhone: string;

  @Column({ type: "varchar", length: 254 })
  billingEmail: string;

  @Column({ type: "varchar", length: 16, default: "active" })
  status: AccountStatus;

  @Column({ type: "text" })
  notes: string;

  /** Weekdays this account takes deliveries (its route days), "2,4,6"; null = every bakery delivery day. */
  @Column({ type: "varchar", length: 20, nullable: true })
  routeWeekdays: string | null;

  @Column({ type: "int", default: 0 })
  minimumOrderCents: number;

  @Column({ type: "int", nullable: true })
  priceListId: number | null;

  /** Secret for the account's private calendar feed URL; replaced to revoke. */
  @Index({ unique: true })
  @Column({ type: "varchar", length: 64, nullable: true })
  feedToken: string | null;

  /** "card": pay each invoice by card; "net7/14/30": a weekly statement due in N days. */
  @Column({ type: "varchar", length: 6, default: "card" })
  paymentTerms: "card" | "net7" | "net14" | "net30";

  /** Set when overdue invoices put the account on hold, so paying them lifts exactly that hold. */
  @Column({ type: "boolean", default: false })
  creditHold: boolean;

  @Column({ type: "varchar", length: 80, nullable: true })
  stripeCustomerId: string | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
