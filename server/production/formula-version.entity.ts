import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

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
