import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import { LabCertificate } from './lab-certificate.entity.js';

@Check('qc_batch_fraction_check', `((fraction)::text = ANY ((ARRAY['HEM'::character varying, 'SGT-HEM'::character varying])::text[]))`)
@Unique('qc_batch_certificate_id_code_key', ['certificateId', 'code'])
@Entity('qc_batch')
export class QcBatch {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'certificate_id' })
  certificateId: string;

  @ManyToOne(() => LabCertificate, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'certificate_id', foreignKeyConstraintName: 'qc_batch_certificate_id_fkey' })
  certificate?: LabCertificate;

  @Column({ type: 'varchar', length: 60 })
  code: string;

  @Column({ type: 'varchar', length: 10 })
  fraction: string;

  @Column({ type: 'numeric', name: 'opr_recovery_pct', precision: 7, scale: 2, nullable: true })
  oprRecoveryPct: string | null;

  @Column({ type: 'numeric', name: 'ms_recovery_pct', precision: 7, scale: 2, nullable: true })
  msRecoveryPct: string | null;

  @Column({ type: 'numeric', name: 'msd_recovery_pct', precision: 7, scale: 2, nullable: true })
  msdRecoveryPct: string | null;

  @Column({ type: 'numeric', name: 'rpd_pct', precision: 7, scale: 2, nullable: true })
  rpdPct: string | null;

  @Column({ type: 'numeric', name: 'method_blank', precision: 12, scale: 4, nullable: true })
  methodBlank: string | null;

  @Column({ type: 'numeric', name: 'spike_true', precision: 12, scale: 4, nullable: true })
  spikeTrue: string | null;

  @Column({ type: 'numeric', name: 'spike_background', precision: 12, scale: 4, nullable: true })
  spikeBackground: string | null;

  @Column({ type: 'numeric', name: 'ms_found', precision: 12, scale: 4, nullable: true })
  msFound: string | null;

  @Column({ type: 'numeric', name: 'msd_found', precision: 12, scale: 4, nullable: true })
  msdFound: string | null;

  @Column({ type: 'jsonb', default: '[]' })
  flags: unknown;
}
