import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { Invoice } from "./invoice.entity";
import { Order } from "../orders/order.entity";
import { OrderLine } from "../orders/order-line.entity";

@Entity({ name: "invoice_line" })
@Index(["invoiceId"])
export class InvoiceLine {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  invoiceId: number;

  /** A line is part of its invoice: it cannot outlive it. */
  @ManyToOne(() => Invoice, { onDelete: "CASCADE" })
  @JoinColumn({ name: "invoiceId" })
  invoice?: Invoice;

  @Index({ unique: true })
  @Column({ type: "int" })
  orderLineId: number;

  @ManyToOne(() => OrderLine, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "orderLineId" })
  orderLine?: OrderLine;

  @Column({ type: "int" })
  orderId: number;

  @ManyToOne(() => Order, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "orderId" })
  order?: Order;

  @Column({ type: "date" })
  deliveryDate: string;

  @Column({ type: "varchar", length: 200 })
  description: string;

  @Column({ type: "int" })
  quantity: number;

  @Column({ type: "int" })
  unitPriceCents: number;

  @Column({ type: "int" })
  amountCents: number;
}
