import { Column, Entity, PrimaryGeneratedColumn } from "typeorm";

/** One step in a payout's reconciliation history: reconciled (with its note) or undone (with its reason). */
@Entity({ name: "payout_reconciliation_event" })
export class PayoutReconciliationEvent {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "varchar", length: 80 })
  payoutId: string;

  @Column({ type: "varchar", length: 12 })
  action: "reconciled" | "undone";

  @Column({ type: "int" })
  byId: number;

  @Column({ type: "datetime", precision: 3 })
  at: Date;

  @Column({ type: "varchar", length: 300, default: "" })
  note: string;
}
