import { Column, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from "typeorm";

/** An account's weekly standing order. The recurrence is an RFC 5545 RRULE (expanded with rrule). */
@Entity({ name: "standing_order" })
export class StandingOrder {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "int" })
  accountId: number;

  @Column({ type: "date" })
  startDate: string;

  @Column({ type: "date", nullable: true })
  endDate: string | null;

  @Column({ type: "int", default: 1 })
  intervalWeeks: number;

  /** e.g. "DTSTART:20261201T000000Z\nRRULE:FREQ=WEEKLY;INTERVAL=1;BYDAY=TU,TH;WKST=MO" */
  @Column({ type: "varchar", length: 500 })
  rrule: string;

  /** JSON array of YYYY-MM-DD dates the café is closed. */
  @Column({ type: "text" })
  skipDates: string;

  @Column({ type: "boolean", default: true })
  active: boolean;

  @UpdateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)", onUpdate: "CURRENT_TIMESTAMP(3)" })
  updatedAt: Date;
}
