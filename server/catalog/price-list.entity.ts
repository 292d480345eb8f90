import { Column, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

/** A named price list: per-product prices ("fixed") or a percentage off the list price ("percent"). */
@Entity({ name: "price_list" })
export class PriceList {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 80 })
  name: string;

  @Column({ type: "varchar", length: 10 })
  kind: "fixed" | "percent";

  @Column({ type: "decimal", precision: 5, scale: 2, default: 0 })
  percentOff: string;
}
