import { Column, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

@Entity({ name: "price_list_item" })
@Index(["priceListId", "productId"], { unique: true })
export class PriceListItem {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  priceListId: number;

  @Column({ type: "int" })
  productId: number;

  @Column({ type: "int" })
  priceCents: number;
}
