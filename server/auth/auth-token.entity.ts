import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from "typeorm";
import type { Role } from "../../shared/roles";

export type AuthTokenKind = "invitation" | "password_reset";

/**
 * A single-use, expiring link token (invitation or password reset). Only its SHA-256 is stored:
 * the token itself lives in the e-mailed link and nowhere else.
 */
@Entity({ name: "auth_token" })
export class AuthToken {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "varchar", length: 20 })
  kind: AuthTokenKind;

  @Index({ unique: true })
  @Column({ type: "char", length: 64 })
  tokenHash: string;

  @Index()
  @Column({ type: "varchar", length: 254 })
  email: string;

  /** The user a reset is for; null for an invitation until it is accepted. */
  @Column({ type: "int", nullable: true })
  userId: number | null;

  /** Invitations: the role and (buyers) account the new person gets. */
  @Column({ type: "varchar", length: 16, nullable: true })
  role: Role | null;

  @Column({ type: "int", nullable: true })
  accountId: number | null;

  @Column({ type: "varchar", length: 120, nullable: true })
  name: string | null;

  @Column({ type: "int", nullable: true })
  createdById: number | null;

  @Column({ type: "datetime", precision: 3 })
  expiresAt: Date;

  @Column({ type: "datetime", precision: 3, nullable: true })
  usedAt: Date | null;

  @Column({ type: "datetime", precision: 3, nullable: true })
  revokedAt: Date | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
