import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

/** A remembered POST: the same Idempotency-Key from the same user gets the first answer again. */
@Entity({ name: "idempotency_key" })
@Index(["userId", "idemKey"], { unique: true })
export class IdempotencyRecord {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  userId: number;

  @Column({ type: "varchar", length: 100 })
  idemKey: string;

  @Column({ type: "char", length: 64 })
  requestHash: string;

  @Column({ type: "int" })
  status: number;

  @Column({ type: "mediumtext" })
  body: string;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
