import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import { Product } from "./product.entity";
import { Ingredient } from "../production/ingredient.entity";
import type { ComponentKind, ComponentPer } from "../../shared/components";

/**
 * One ingredient of one product component (shared/components.ts): a topping, wash, filling or garnish, weighed
 * per piece or per pan. Rows of one product with the same kind and name make one component ("Egg wash": egg + milk).
 */
@Entity({ name: "product_component" })
@Index("IDX_product_component_product", ["productId", "sortOrder"])
export class ProductComponent {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  productId: number;

  @ManyToOne(() => Product, { onDelete: "CASCADE" })
  @JoinColumn({ name: "productId" })
  product?: Product;

  /** Order on the product form and the weigh-out cards. */
  @Column({ type: "int", default: 0 })
  sortOrder: number;

  @Column({ type: "varchar", length: 12 })
  kind: ComponentKind;

  @Column({ type: "varchar", length: 80, default: "" })
  name: string;

  @Column({ type: "int" })
  ingredientId: number;

  @ManyToOne(() => Ingredient, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "ingredientId" })
  ingredient?: Ingredient;

  /** Grams per piece or per pan, to 0.1 g. DECIMAL comes back from mysql2 as a string. */
  @Column({ type: "decimal", precision: 8, scale: 1 })
  grams: string;

  @Column({ type: "varchar", length: 8 })
  per: ComponentPer;

  @Column({ type: "varchar", length: 200, default: "" })
  note: string;
}
