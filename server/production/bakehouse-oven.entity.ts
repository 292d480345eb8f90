import { Column, Entity, PrimaryGeneratedColumn } from "typeorm";

/** An oven: one load at a time, by usable shelf area or by named pan slots; time to change temperature, load and unload. */
@Entity({ name: "bakehouse_oven" })
export class BakehouseOven {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "varchar", length: 60 })
  name: string;

  /** "area" or "slots". */
  @Column({ type: "varchar", length: 8 })
  capacityKind: "area" | "slots";

  /** Usable shelf area per load, cm² (area ovens). */
  @Column({ type: "int", nullable: true })
  areaCm2: number | null;

  /** JSON array of slot names (slot ovens; "[]" for area ovens). */
  @Column({ type: "text" })
  slotNames: string;

  @Column({ type: "int", nullable: true })
  slotLengthMm: number | null;

  @Column({ type: "int", nullable: true })
  slotWidthMm: number | null;

  @Column({ type: "int" })
  tempChangeMinutes: number;

  @Column({ type: "int" })
  loadMinutes: number;

  @Column({ type: "int" })
  unloadMinutes: number;

  @Column({ type: "int", default: 0 })
  sortOrder: number;
}
