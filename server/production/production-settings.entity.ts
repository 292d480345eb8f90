import { Column, Entity, PrimaryColumn, UpdateDateColumn } from "typeorm";

/**
 * The bakehouse's production settings (one row, id 1): the crew and its person-minutes for dividing and
 * shaping, packing time before dispatch, when the shift starts, and which doughs are retarded overnight.
 * Without a row the defaults in server/production/settings.service.ts apply.
 */
@Entity({ name: "production_settings" })
export class ProductionSettings {
  @PrimaryColumn({ type: "int" })
  id: number;

  /** People on the shift who divide and shape. */
  @Column({ type: "int" })
  crewPeople: number;

  /** Person-minutes per piece to divide and round. */
  @Column({ type: "decimal", precision: 6, scale: 3 })
  divideMinutesPerPiece: string;

  /** Person-minutes per piece to shape. */
  @Column({ type: "decimal", precision: 6, scale: 3 })
  shapeMinutesPerPiece: string;

  /** Person-minutes per pan to fill and set it out. */
  @Column({ type: "decimal", precision: 6, scale: 3 })
  panMinutesPerPan: string;

  /** Minutes to pack and load before dispatch. */
  @Column({ type: "int" })
  packingMinutes: number;

  /** "03:00" bakery time, the last such time before dispatch; null = no shift start to check against. */
  @Column({ type: "char", length: 5, nullable: true })
  shiftStart: string | null;

  /** JSON [{ formulaId, hours }]: doughs retarded overnight and for how long. */
  @Column({ type: "text" })
  retard: string;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
