import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";

@Entity({ name: "product" })
export class Product {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "varchar", length: 120 })
  name: string;

  @Column({ type: "text" })
  description: string;

  /** The photo as product screens show it (640 px WebP), a stored id under the uploads directory, or null. */
  @Column({ type: "varchar", length: 80, nullable: true })
  photoFile: string | null;

  /** The 160 px WebP for list tiles; null for photos stored before sizes were made (photoFile is shown then). */
  @Column({ type: "varchar", length: 80, nullable: true })
  photoThumbFile: string | null;

  /** The checked original, kept in the private originals store (never served); null for older photos. */
  @Column({ type: "varchar", length: 80, nullable: true })
  photoOriginalFile: string | null;

  @Column({ type: "varchar", length: 60 })
  saleUnit: string;

  /** The sale unit's plural as the owner wrote it ("trays of 15 rolls"); '' only on rows inserted raw (shared/quantity.ts suggests one then). */
  @Column({ type: "varchar", length: 60, default: "" })
  saleUnitPlural: string;

  @Column({ type: "int" })
  piecesPerUnit: number;

  @Column({ type: "int" })
  pieceGrams: number;

  @Column({ type: "varchar", length: 60 })
  panName: string;

  @Column({ type: "int" })
  panLengthMm: number;

  @Column({ type: "int" })
  panWidthMm: number;

  @Column({ type: "int" })
  unitsPerPan: number;

  @Column({ type: "int" })
  priceCents: number;

  @Column({ type: "int", default: 1 })
  minQuantity: number;

  @Column({ type: "int", default: 100 })
  maxQuantity: number;

  /** Overrides the bakery's lead days when larger; null = bakery default. */
  @Column({ type: "int", nullable: true })
  leadDays: number | null;

  /**
   * The product's own allergen codes, comma-separated, from the fixed list in shared/allergens.ts: what it adds to
   * those its formula and components derive (for a bought-in product, its whole declaration). Never a replacement.
   */
  @Column({ type: "varchar", length: 300, default: "" })
  allergens: string;

  @Column({ type: "varchar", length: 300, default: "" })
  mayContain: string;

  @Column({ type: "boolean", default: true })
  active: boolean;

  @Column({ type: "int", nullable: true })
  formulaId: number | null;

  /** The explicit choice "bought in / not planned": production plans no dough for it. Never together with a formula. */
  @Column({ type: "boolean", default: false })
  boughtIn: boolean;

  /** The product's own bake (°C, minutes) and cooling minutes; null = the formula's bake and cool steps. */
  @Column({ type: "int", nullable: true })
  bakeTempC: number | null;

  @Column({ type: "int", nullable: true })
  bakeMinutes: number | null;

  @Column({ type: "int", nullable: true })
  coolMinutes: number | null;

  @Column({ type: "int", default: 0 })
  sortOrder: number;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
