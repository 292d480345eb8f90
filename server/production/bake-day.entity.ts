import { Column, Entity, PrimaryColumn, UpdateDateColumn } from "typeorm";

/** What the baker sets for one bake day: extra pans per product; room, flour, paste, tap water and milk temperatures. */
@Entity({ name: "bake_day" })
export class BakeDay {
  @PrimaryColumn({ type: "date" })
  date: string;

  /** JSON { [productId]: extraPans } */
  @Column({ type: "text" })
  extraPans: string;

  @Column({ type: "decimal", precision: 4, scale: 1, default: 22 })
  roomC: string;

  @Column({ type: "decimal", precision: 4, scale: 1, default: 20 })
  flourC: string;

  @Column({ type: "decimal", precision: 4, scale: 1, default: 30 })
  pasteC: string;

  /** Tap water as it comes, °C (for the ice on the weigh-out cards). */
  @Column({ type: "decimal", precision: 4, scale: 1, default: 15 })
  tapC: string;

  /** Milk (and other liquids kept cold) as it comes out of the cooler, °C. */
  @Column({ type: "decimal", precision: 4, scale: 1, default: 4 })
  milkC: string;

  /** The frozen plan (JSON), stored at the cut-off or on a deliberate recalculation. */
  @Column({ type: "mediumtext", nullable: true })
  frozenPlan: string | null;

  @Column({ type: "datetime", precision: 3, nullable: true })
  frozenAt: Date | null;

  /** JSON { mixes: string[] ("formulaId:index"), waves: number[] } ticked off by the baker. */
  @Column({ type: "text" })
  progress: string;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
