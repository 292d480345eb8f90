import { Column, Entity, PrimaryGeneratedColumn } from "typeorm";
import type { ReminderStage } from "../../shared/billing";

/** A payment reminder queued for an invoice: by hand ("manual", with who sent it) or by the schedule. */
@Entity({ name: "invoice_reminder" })
export class InvoiceReminder {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "int" })
  invoiceId: number;

  @Column({ type: "varchar", length: 12 })
  stage: ReminderStage;

  @Column({ type: "int", nullable: true })
  sentById: number | null;

  @Column({ type: "int", nullable: true })
  outboxMailId: number | null;

  /** When it was queued, by the server's clock (set on insert, so "reminded today" follows the bakery's day). */
  @Column({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
