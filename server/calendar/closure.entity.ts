import { Column, Entity, PrimaryColumn } from "typeorm";

/** A date the bakery does not deliver (holiday, closure). */
@Entity({ name: "bakery_closure" })
export class BakeryClosure {
  @PrimaryColumn({ type: "date" })
  date: string;

  @Column({ type: "varchar", length: 120, default: "" })
  note: string;
}
