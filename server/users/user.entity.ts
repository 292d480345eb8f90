import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";
import type { Role } from "../../shared/roles";
import { CustomerAccount } from "../accounts/account.entity";

@Entity({ name: "user" })
export class User {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 254 })
  email: string;

  @Column({ type: "varchar", length: 100 })
  passwordHash: string;

  @Column({ type: "varchar", length: 16 })
  role: Role;

  @Column({ type: "varchar", length: 120 })
  name: string;

  /** Set for buyers only: the one customer account they order for. */
  @Column({ type: "int", nullable: true })
  accountId: number | null;

  @ManyToOne(() => CustomerAccount, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "accountId" })
  account?: CustomerAccount | null;

  @Column({ type: "boolean", default: false })
  disabled: boolean;

  @Column({ type: "datetime", precision: 3, nullable: true })
  lastSignInAt: Date | null;

  /**
   * Sign-in tokens carry the version they were issued under; authenticate() refuses any other. A password reset,
   * a role or account change, turning the sign-in off and signing out add one, so every earlier token dies at once.
   */
  @Column({ type: "int", default: 0 })
  tokenVersion: number;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
