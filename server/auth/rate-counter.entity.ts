import { Column, Entity, Index, PrimaryColumn } from "typeorm";

/**
 * One rate-limit counter: how many attempts one key (an e-mail, an address, an e-mail at an address) made in the
 * window that began at `windowStart`. Rows, not memory, so every server instance counts the same attempts; changed
 * only by single `INSERT … ON DUPLICATE KEY UPDATE count = count + 1` statements under the row lock (see rate-limit.ts).
 * The key is stored as its SHA-256, so the table does not collect e-mail addresses.
 */
@Entity({ name: "auth_rate_counter" })
@Index("IDX_auth_rate_counter_window", ["windowStart"])
export class AuthRateCounter {
  @PrimaryColumn({ type: "varchar", length: 24 })
  scope: string;

  @PrimaryColumn({ type: "char", length: 64 })
  keyHash: string;

  @Column({ type: "int", default: 0 })
  count: number;

  @Column({ type: "datetime", precision: 3 })
  windowStart: Date;
}
