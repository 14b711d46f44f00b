import { Check, Column, CreateDateColumn, Entity, Exclusion, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Permit as PermitView } from '../../contracts/setup.js';
import { numeric } from '../../db/numeric-transformer.js';
import { Permit } from './permit.entity.js';

/**
 * One version of the permit settings that change results. A period uses the version in force
 * on its first day (`permit_settings_on()` in the database); versions never overlap.
 */
@Check(
  'permit_settings_non_detect_policy_check',
  `((non_detect_policy)::text = ANY ((ARRAY['zero'::character varying, 'mdl'::character varying, 'ml'::character varying, 'half-mdl'::character varying])::text[]))`,
)
@Check('permit_settings_mass_loading_factor_check', `(mass_loading_factor = ANY (ARRAY[8.34, 8.3454]))`)
@Check(
  'permit_settings_snc_window_check',
  `((snc_window)::text = ANY ((ARRAY['calendar-halves'::character varying, 'rolling'::character varying])::text[]))`,
)
@Check('permit_settings_late_report_days_check', `((late_report_days >= 1) AND (late_report_days <= 365))`)
@Check(
  'permit_settings_monitoring_counts_check',
  `((monitoring_counts)::text = ANY ((ARRAY['sampling-days'::character varying, 'samples'::character varying])::text[]))`,
)
@Check('permit_settings_applies_check', `((applies_to IS NULL) OR (applies_to >= applies_from))`)
@Exclusion('EX_permit_settings_versions', `USING gist (permit_id WITH =, daterange(applies_from, applies_to, '[]') WITH &&)`)
@Entity('permit_settings')
export class PermitSettings {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'permit_id' })
  permitId: string;

  @ManyToOne(() => Permit, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'permit_id', foreignKeyConstraintName: 'permit_settings_permit_id_fkey' })
  permit?: Permit;

  @Column({ type: 'date', name: 'applies_from' })
  appliesFrom: string;

  @Column({ type: 'date', name: 'applies_to', nullable: true })
  appliesTo: string | null;

  @Column({ type: 'varchar', name: 'non_detect_policy', length: 10 })
  nonDetectPolicy: PermitView['nonDetectPolicy'];

  @Column({ type: 'numeric', name: 'mass_loading_factor', precision: 6, scale: 4, transformer: numeric })
  massLoadingFactor: number;

  @Column({ type: 'boolean', name: 'daily_max_applies_to_each_grab', default: false })
  dailyMaxAppliesToEachGrab: boolean;

  @Column({ type: 'varchar', name: 'snc_window', length: 16 })
  sncWindow: PermitView['sncWindow'];

  @Column({ type: 'smallint', name: 'late_report_days', default: 45 })
  lateReportDays: number;

  @Column({ type: 'varchar', name: 'monitoring_counts', length: 14, default: 'sampling-days' })
  monitoringCounts: PermitView['monitoringCounts'];

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
