import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn, OneToMany, VersionColumn } from "typeorm";
import type { OrderStatus } from "../../shared/schemas/orders";
import { OrderLine } from "./order-line.entity";

/** One order per account per delivery date. */
@Entity({ name: "customer_order" })
@Index(["accountId", "deliveryDate"], { unique: true })
@Index(["deliveryDate", "status"])
export class Order {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  accountId: number;

  @Column({ type: "date" })
  deliveryDate: string;

  @Column({ type: "varchar", length: 12, default: "open" })
  status: OrderStatus;

  @Column({ type: "varchar", length: 40, nullable: true })
  poNumber: string | null;

  @Column({ type: "varchar", length: 500, nullable: true })
  note: string | null;

  @Column({ type: "int", default: 0 })
  totalCents: number;

  /** "standing" when the standing-order job made it. */
  @Column({ type: "varchar", length: 10, default: "one_off" })
  source: "one_off" | "standing";

  /** Set once a person changes a standing-order order; the job then leaves it alone. */
  @Column({ type: "boolean", default: false })
  editedByHand: boolean;

  @Column({ type: "int", nullable: true })
  createdById: number | null;

  /** Set when the owner took or changed the order past its cut-off: who, when and why (a phone order). */
  @Column({ type: "int", nullable: true })
  cutoffOverrideById: number | null;

  @Column({ type: "datetime", precision: 3, nullable: true })
  cutoffOverrideAt: Date | null;

  @Column({ type: "varchar", length: 200, nullable: true })
  cutoffOverrideReason: string | null;

  @VersionColumn({ type: "int", default: 1 })
  version: number;

  @OneToMany(() => OrderLine, (l) => l.order, { cascade: false })
  lines?: OrderLine[];

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
