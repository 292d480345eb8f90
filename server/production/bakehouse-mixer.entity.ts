import { Column, Entity, PrimaryGeneratedColumn } from "typeorm";

/** A mixer: one mix at a time, up to its capacity of dough. */
@Entity({ name: "bakehouse_mixer" })
export class BakehouseMixer {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "varchar", length: 60 })
  name: string;

  @Column({ type: "decimal", precision: 6, scale: 2 })
  capacityKg: string;

  @Column({ type: "int", default: 0 })
  sortOrder: number;
}
