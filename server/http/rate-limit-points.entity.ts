import { Column, Entity, Index, PrimaryColumn } from "typeorm";

/**
 * rate-limiter-flexible's MySQL store (server/http/rate-limits.ts): one row per limited key, the points taken in
 * its window and the window's end. The library writes it with `INSERT INTO … VALUES (key, points, expire)`, so the
 * columns stay in this order; the table is made by a migration (the library's `tableCreated: true`), never by the
 * library at runtime. Keys are "<limit>:<SHA-256 of the address, token or user>", so no address or token is stored.
 */
@Entity({ name: "rate_limit_points" })
@Index("IDX_rate_limit_points_expire", ["expire"])
export class RateLimitPoints {
  @PrimaryColumn({ type: "varchar", length: 255, charset: "ascii", collation: "ascii_bin" })
  key: string;

  @Column({ type: "int", default: 0 })
  points: number;

  /** Milliseconds since the epoch at which the window ends (the library's clock is Date.now()). */
  @Column({ type: "bigint", unsigned: true, nullable: true })
  expire: string | null;
}
