import { Column, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

/**
 * A failed sign-in, kept in the database (not in memory) so every server instance
 * counts the same attempts for the rate limit.
 */
@Entity({ name: "sign_in_failure" })
@Index(["email", "at"])
@Index(["ip", "at"])
export class SignInFailure {
  @PrimaryGeneratedColumn({ type: "bigint" })
  id: string;

  @Column({ type: "varchar", length: 254 })
  email: string;

  @Column({ type: "varchar", length: 64 })
  ip: string;

  @Column({ type: "datetime", precision: 3 })
  at: Date;
}
