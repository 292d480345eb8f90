import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from "typeorm";

export type OutboxStatus = "pending" | "sending" | "sent" | "failed";

/**
 * A mail waiting to go, written in the same transaction as the change that causes it; a worker sends it
 * with retries. The Message-ID is fixed when the row is written, so a retry is recognisably the same mail.
 */
@Entity({ name: "mail_outbox" })
@Index(["status", "nextAttemptAt"])
export class OutboxMail {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index({ unique: true })
  @Column({ type: "varchar", length: 190 })
  messageId: string;

  @Column({ type: "varchar", length: 40 })
  kind: string;

  @Column({ type: "varchar", length: 254 })
  toAddress: string;

  @Column({ type: "varchar", length: 160 })
  fromName: string;

  @Column({ type: "varchar", length: 300 })
  subject: string;

  @Column({ type: "mediumtext" })
  html: string;

  @Column({ type: "mediumtext" })
  text: string;

  /** JSON [{ filename, contentType, base64 }] */
  @Column({ type: "longtext", nullable: true })
  attachments: string | null;

  @Column({ type: "varchar", length: 10, default: "pending" })
  status: OutboxStatus;

  @Column({ type: "int", default: 0 })
  attempts: number;

  @Column({ type: "datetime", precision: 3 })
  nextAttemptAt: Date;

  @Column({ type: "varchar", length: 500, nullable: true })
  lastError: string | null;

  @Column({ type: "datetime", precision: 3, nullable: true })
  sentAt: Date | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
