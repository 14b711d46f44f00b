import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { Flag } from '../../contracts/flags.js';
import { numeric } from '../../db/numeric-transformer.js';
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
  fraction: 'HEM' | 'SGT-HEM';

  @Column({ type: 'numeric', name: 'opr_recovery_pct', precision: 7, scale: 2, nullable: true, transformer: numeric })
  oprRecoveryPct: number | null;

  @Column({ type: 'numeric', name: 'ms_recovery_pct', precision: 7, scale: 2, nullable: true, transformer: numeric })
  msRecoveryPct: number | null;

  @Column({ type: 'numeric', name: 'msd_recovery_pct', precision: 7, scale: 2, nullable: true, transformer: numeric })
  msdRecoveryPct: number | null;

  @Column({ type: 'numeric', name: 'rpd_pct', precision: 7, scale: 2, nullable: true, transformer: numeric })
  rpdPct: number | null;

  @Column({ type: 'numeric', name: 'method_blank', precision: 12, scale: 4, nullable: true, transformer: numeric })
  methodBlank: number | null;

  @Column({ type: 'numeric', name: 'spike_true', precision: 12, scale: 4, nullable: true, transformer: numeric })
  spikeTrue: number | null;

  @Column({ type: 'numeric', name: 'spike_background', precision: 12, scale: 4, nullable: true, transformer: numeric })
  spikeBackground: number | null;

  @Column({ type: 'numeric', name: 'ms_found', precision: 12, scale: 4, nullable: true, transformer: numeric })
  msFound: number | null;

  @Column({ type: 'numeric', name: 'msd_found', precision: 12, scale: 4, nullable: true, transformer: numeric })
  msdFound: number | null;

  @Column({ type: 'jsonb', default: '[]' })
  flags: Flag[];
}
