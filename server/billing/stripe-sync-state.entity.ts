import { Column, Entity, PrimaryColumn, UpdateDateColumn } from "typeorm";

/**
 * Where the catch-up job has got to, per kind: `createdCursor` is a Stripe `created` time (Unix seconds)
 * before which every event has been seen. One row per name; the job runs under a named lock, so one writer.
 */
@Entity({ name: "stripe_sync_state" })
export class StripeSyncState {
  @PrimaryColumn({ type: "varchar", length: 40 })
  name: string;

  @Column({ type: "int" })
  createdCursor: number;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
