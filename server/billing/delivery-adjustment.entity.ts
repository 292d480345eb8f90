import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { Order } from "../orders/order.entity";
import { Product } from "../catalog/product.entity";
import { CreditNote } from "./credit-note.entity";

/** What actually went out on a delivery, when it differs from the order. Becomes a credit note on invoicing. */
@Entity({ name: "delivery_adjustment" })
@Index(["orderId", "productId"], { unique: true })
export class DeliveryAdjustment {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  orderId: number;

  /** An adjustment records what went out on its order: it cannot outlive it. */
  @ManyToOne(() => Order, { onDelete: "CASCADE" })
  @JoinColumn({ name: "orderId" })
  order?: Order;

  @Column({ type: "int" })
  productId: number;

  @ManyToOne(() => Product, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "productId" })
  product?: Product;

  @Column({ type: "int" })
  deliveredQuantity: number;

  @Column({ type: "varchar", length: 200, default: "" })
  reason: string;

  @Column({ type: "int", nullable: true })
  creditNoteId: number | null;

  @ManyToOne(() => CreditNote, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "creditNoteId" })
  creditNote?: CreditNote | null;
}
