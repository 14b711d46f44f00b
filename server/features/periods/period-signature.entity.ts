import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { PeriodSummary, SignatureInputs, SignOffItem } from '../../contracts/periods.js';
import { User } from '../../kernel/people/user.entity.js';
import { PeriodAmendment } from './period-amendment.entity.js';
import { ReportingPeriod } from './reporting-period.entity.js';

/**
 * One signed revision of a period: the frozen summary exactly as signed, the content hashes of
 * every input, the certification statement accepted, the signer, and the SHA-256 of all of it.
 * Append-only (a trigger refuses changes).
 */
@Check('period_signature_revision_check', `(revision >= 1)`)
@Unique('period_signature_period_id_revision_key', ['periodId', 'revision'])
@Entity('period_signature')
export class PeriodSignature {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'period_id' })
  periodId: string;

  @ManyToOne(() => ReportingPeriod, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'period_id', foreignKeyConstraintName: 'period_signature_period_id_fkey' })
  period?: ReportingPeriod;

  @Column({ type: 'smallint' })
  revision: number;

  @Column({ type: 'uuid', name: 'amendment_id', nullable: true })
  amendmentId: string | null;

  @ManyToOne(() => PeriodAmendment, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'amendment_id', foreignKeyConstraintName: 'period_signature_amendment_id_fkey' })
  amendment?: PeriodAmendment;

  @Column({ type: 'uuid', name: 'signed_by', nullable: true })
  signedBy: string | null;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'signed_by', foreignKeyConstraintName: 'period_signature_signed_by_fkey' })
  signer?: User;

  @Column({ type: 'varchar', name: 'signer_name', length: 200 })
  signerName: string;

  @Column({ type: 'varchar', name: 'signer_title', length: 200 })
  signerTitle: string;

  @Column({ type: 'timestamptz', name: 'signed_at', default: () => 'now()' })
  signedAt: Date;

  @Column({ type: 'varchar', name: 'statement_section', length: 40 })
  statementSection: string;

  @Column({ type: 'text' })
  statement: string;

  @Column({ type: 'jsonb' })
  acknowledged: SignOffItem[];

  @Column({ type: 'text', name: 'acknowledgement_note', nullable: true })
  acknowledgementNote: string | null;

  @Column({ type: 'jsonb' })
  summary: PeriodSummary;

  @Column({ type: 'jsonb' })
  inputs: SignatureInputs;

  @Column({ type: 'bigint', name: 'trail_head_seq' })
  trailHeadSeq: string;

  @Column({ type: 'char', name: 'trail_head_hash', length: 64 })
  trailHeadHash: string;

  @Column({ type: 'char', length: 64 })
  sha256: string;

  /** The period pack (PDF) as signed; read only when downloaded. */
  @Column({ type: 'bytea', name: 'pack_pdf', nullable: true, select: false })
  packPdf?: Buffer | null;

  @Column({ type: 'char', name: 'pack_sha256', length: 64, nullable: true })
  packSha256: string | null;

  /** The period pack's workbook (XLSX) as signed; read only when downloaded. */
  @Column({ type: 'bytea', name: 'pack_xlsx', nullable: true, select: false })
  packXlsx?: Buffer | null;

  @Column({ type: 'char', name: 'pack_xlsx_sha256', length: 64, nullable: true })
  packXlsxSha256: string | null;
}
