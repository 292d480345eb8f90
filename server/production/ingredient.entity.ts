import { Column, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
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
