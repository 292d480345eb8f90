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
