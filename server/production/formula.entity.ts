import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

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
