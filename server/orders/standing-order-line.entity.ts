import { Column, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

@Entity({ name: "standing_order_line" })
@Index(["standingOrderId", "productId", "weekday"], { unique: true })
export class StandingOrderLine {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  standingOrderId: number;

  @Column({ type: "int" })
  productId: number;

  /** ISO weekday 1 (Mon) … 7 (Sun). */
  @Column({ type: "int" })
  weekday: number;

  @Column({ type: "int" })
  quantity: number;
}
