import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from "typeorm";
import type { CertificateStatus } from "../../shared/contracts/billing";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";

/** A resale or tax-exemption certificate, approved by the owner, valid until its expiry date. */
@Entity({ name: "tax_certificate" })
export class TaxCertificate {
  @PrimaryGeneratedColumn({ type: "int" })
  id: number;

  @Index()
  @Column({ type: "int" })
  accountId: number;

  @ManyToOne(() => CustomerAccount, { onDelete: "RESTRICT" })
  @JoinColumn({ name: "accountId" })
  account?: CustomerAccount;

  @Column({ type: "varchar", length: 80 })
  file: string;

  @Column({ type: "varchar", length: 40 })
  contentType: string;

  /** Bytes stored for this certificate: counted against the account's storage quota (rows from before: 0). */
  @Column({ type: "int", default: 0 })
  sizeBytes: number;

  @Column({ type: "varchar", length: 10, default: "pending" })
  status: CertificateStatus;

  @Column({ type: "date" })
  expiresOn: string;

  @Column({ type: "int", nullable: true })
  reviewedById: number | null;

  @ManyToOne(() => User, { nullable: true, onDelete: "RESTRICT" })
  @JoinColumn({ name: "reviewedById" })
  reviewedBy?: User | null;

  @CreateDateColumn({ type: "datetime", precision: 3, default: () => "CURRENT_TIMESTAMP(3)" })
  createdAt: Date;
}
