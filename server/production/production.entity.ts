import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import type { IngredientKind } from "../../shared/production";

@Entity({ name: "ingredient" })
export class Ingredient {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 120 })
  name: string;

  @Column({ type: "varchar", length: 12 })
  kind: IngredientKind;

  /** Water content, percent of weight (USDA FoodData Central values for dairy and egg). */
  @Column({ type: "decimal", precision: 5, scale: 2, default: 0 })
  waterPercent: string;

  /** Allergen codes from shared/allergens.ts, comma-separated. */
  @Column({ type: "varchar", length: 300, default: "" })
  allergens: string;

  /** e.g. "25 kg sack", "1 gal jug", "1 lb block". */
  @Column({ type: "varchar", length: 60 })
  packName: string;

  @Column({ type: "int" })
  packGrams: number;

  @Column({ type: "int", default: 0 })
  packCostCents: number;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}

/** A dough. Its body (lines, paste, steps) is kept as versions: a plan names the version it used. */
@Entity({ name: "formula" })
export class Formula {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 120 })
  name: string;

  @Column({ type: "int", default: 1 })
  currentVersion: number;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

@Entity({ name: "formula_version" })
@Index(["formulaId", "version"], { unique: true })
export class FormulaVersion {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  formulaId: number;

  @Column({ type: "int" })
  version: number;

  /** JSON: { name, lossPercent, ddtC, frictionC, paste, lines, steps, targetInternalC } */
  @Column({ type: "mediumtext" })
  body: string;

  @Column({ type: "int", nullable: true })
  editedById: number | null;

  @Column({ type: "varchar", length: 200, default: "" })
  note: string;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}

/** What the baker sets for one bake day: extra pans per product, room and flour temperatures. */
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
