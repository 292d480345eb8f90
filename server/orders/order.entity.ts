import { Column, CreateDateColumn, Entity, Index, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn, ManyToOne, JoinColumn, VersionColumn } from "typeorm";
import type { OrderStatus } from "../../shared/schemas/orders";

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

  @VersionColumn({ type: "int", default: 1 })
  version: number;

  @OneToMany(() => OrderLine, (l) => l.order, { cascade: false })
  lines?: OrderLine[];

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}

/** A line: prices are copied from the catalog when the order is placed or changed. */
@Entity({ name: "order_line" })
@Index(["orderId", "productId"], { unique: true })
@Index(["productId"])
export class OrderLine {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  orderId: number;

  @ManyToOne(() => Order, (o) => o.lines, { onDelete: "CASCADE" })
  @JoinColumn({ name: "orderId" })
  order?: Order;

  @Column({ type: "int" })
  productId: number;

  @Column({ type: "varchar", length: 120 })
  productName: string;

  @Column({ type: "varchar", length: 60 })
  saleUnit: string;

  /** The sale unit's plural as ordered (a snapshot, like the singular); '' only on rows inserted raw. */
  @Column({ type: "varchar", length: 60, default: "" })
  saleUnitPlural: string;

  @Column({ type: "int" })
  quantity: number;

  @Column({ type: "int" })
  unitPriceCents: number;

  @Column({ type: "int" })
  lineTotalCents: number;
}

/** A remembered POST: the same Idempotency-Key from the same user gets the first answer again. */
@Entity({ name: "idempotency_key" })
@Index(["userId", "idemKey"], { unique: true })
export class IdempotencyRecord {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  userId: number;

  @Column({ type: "varchar", length: 100 })
  idemKey: string;

  @Column({ type: "char", length: 64 })
  requestHash: string;

  @Column({ type: "int" })
  status: number;

  @Column({ type: "mediumtext" })
  body: string;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
