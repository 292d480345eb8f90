import { Column, Entity, PrimaryColumn } from "typeorm";

/** The next invoice (or credit-note) number per series and year, taken under a row lock: gapless. */
@Entity({ name: "number_counter" })
export class NumberCounter {
  @PrimaryColumn({ type: "varchar", length: 20 })
  series: string;

  @PrimaryColumn({ type: "int" })
  year: number;

  @Column({ type: "int" })
  next: number;
}
