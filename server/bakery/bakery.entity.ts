import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";

/** The bakery itself: one row. Its IANA time zone decides every "today" and cut-off. */
@Entity({ name: "bakery" })
export class Bakery {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Column({ type: "varchar", length: 160 })
  name: string;

  @Column({ type: "varchar", length: 64, default: "America/Chicago" })
  timeZone: string;

  /** ISO 4217 currency code. */
  @Column({ type: "char", length: 3, default: "USD" })
  currency: string;

  /** BCP 47 locale every date, time, number and amount is written in (shared/format.ts SUPPORTED_LOCALES). */
  @Column({ type: "varchar", length: 35, default: "en-US" })
  locale: string;

  @Column({ type: "varchar", length: 254, default: "" })
  email: string;

  @Column({ type: "varchar", length: 40, default: "" })
  phone: string;

  @Column({ type: "varchar", length: 500, default: "" })
  address: string;

  /** Delivery weekdays, ISO numbers 1 (Mon) … 7 (Sun), stored "1,2,3". */
  @Column({ type: "varchar", length: 20, default: "2,3,4,5,6" })
  deliveryWeekdays: string;

  /** Local cut-off time "HH:mm" on the day(s) before delivery. */
  @Column({ type: "char", length: 5, default: "14:00" })
  cutoffTime: string;

  @Column({ type: "int", default: 1 })
  leadDays: number;

  @Column({ type: "int", default: 28 })
  horizonDays: number;

  /** Local time the bread leaves, "HH:mm". Mixers, ovens and the crew are production settings (server/production). */
  @Column({ type: "char", length: 5, default: "06:30" })
  dispatchTime: string;

  /** Sales tax in basis points (875 = 8.75 %). */
  @Column({ type: "int", default: 0 })
  salesTaxRateBp: number;

  @Column({ type: "varchar", length: 8, default: "INV" })
  invoicePrefix: string;

  /** Days past due after which an account goes on credit hold. */
  @Column({ type: "int", default: 14 })
  creditHoldDays: number;

  @Column({ type: "varchar", length: 600, default: "" })
  paymentInstructions: string;

  /** Payment reminders by schedule (server/billing/reminders.service.ts REMINDER_SCHEDULE), off until turned on. */
  @Column({ type: "boolean", default: false })
  remindersOn: boolean;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
