import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from "typeorm";
import { User } from "../users/user.entity";

@Entity({ name: "payout_reconciliation" })
export class PayoutReconciliation {
  @PrimaryColumn({ type: "varchar", length: 80 })
  payoutId: string;

  @Column({ type: "int" })
  reconciledById: number;

  @ManyToOne(() => User, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "reconciledById" })
  reconciledBy?: User;

  @Column({ type: "datetime", precision: 3 })
  reconciledAt: Date;

  @Column({ type: "varchar", length: 300, default: "" })
  note: string;
}
