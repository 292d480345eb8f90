import { Column, Entity, Index, PrimaryGeneratedColumn, ManyToOne, JoinColumn, type Relation } from "typeorm";
import { Order } from "./order.entity";

/** A line: prices are copied from the catalog when the order is placed or changed. */
@Entity({ name: "order_line" })
@Index(["orderId", "productId"], { unique: true })
@Index(["productId"])
export class OrderLine {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  orderId: number;

  /** Relation<…>: Order and OrderLine import each other; the wrapper keeps decorator metadata from reading Order while it loads. */
  @ManyToOne(() => Order, (o) => o.lines, { onDelete: "CASCADE" })
  @JoinColumn({ name: "orderId" })
  order?: Relation<Order>;

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
