import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Exclusion,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Limit } from '../../contracts/setup.js';
import { numeric } from '../../db/numeric-transformer.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';
import { Parameter } from '../parameters/parameter.entity.js';
import { Permit } from './permit.entity.js';

@Check(
  'permit_limit_statistic_check',
  `((statistic)::text = ANY ((ARRAY['daily-maximum'::character varying, 'monthly-average'::character varying, 'instantaneous-minimum'::character varying, 'instantaneous-maximum'::character varying])::text[]))`,
)
@Check('permit_limit_frequency_count_check', `((frequency_count >= 1) AND (frequency_count <= 1000))`)
@Check(
  'permit_limit_frequency_per_check',
  `((frequency_per)::text = ANY ((ARRAY['day'::character varying, 'week'::character varying, 'month'::character varying, 'quarter'::character varying])::text[]))`,
)
@Check(
  'permit_limit_sample_type_check',
  `((sample_type)::text = ANY ((ARRAY['grab'::character varying, 'composite'::character varying])::text[]))`,
)
@Check('permit_limit_reported_decimals_check', `((reported_decimals >= 0) AND (reported_decimals <= 6))`)
@Check('permit_limit_applies_check', `((applies_to IS NULL) OR (applies_to >= applies_from))`)
@Index('IDX_permit_limit_point', ['dischargePointId', 'parameterId'])
@Index('IDX_permit_limit_series', ['seriesId'])
// Versions of one basis (point, parameter, statistic, concentration or mass) never overlap in time.
@Exclusion(
  'EX_permit_limit_versions',
  `USING gist (permit_id WITH =, discharge_point_id WITH =, parameter_id WITH =, statistic WITH =, ((unit)::text = ANY ((ARRAY['lb/day'::character varying, 'kg/day'::character varying])::text[])) WITH =, daterange(applies_from, applies_to, '[]') WITH &&)`,
)
@Entity('permit_limit')
export class PermitLimit {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'permit_id' })
  permitId: string;

  @ManyToOne(() => Permit, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'permit_id', foreignKeyConstraintName: 'permit_limit_permit_id_fkey' })
  permit?: Permit;

  @Column({ type: 'uuid', name: 'discharge_point_id' })
  dischargePointId: string;

  @ManyToOne(() => DischargePoint, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'discharge_point_id', foreignKeyConstraintName: 'permit_limit_discharge_point_id_fkey' })
  dischargePoint?: DischargePoint;

  @Column({ type: 'uuid', name: 'parameter_id' })
  parameterId: string;

  @ManyToOne(() => Parameter, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'parameter_id', foreignKeyConstraintName: 'permit_limit_parameter_id_fkey' })
  parameter?: Parameter;

  @Column({ type: 'varchar', length: 24 })
  statistic: Limit['statistic'];

  @Column({ type: 'numeric', precision: 14, scale: 4, transformer: numeric })
  value: number;

  @Column({ type: 'varchar', length: 20 })
  unit: Limit['unit'];

  @Column({ type: 'smallint', name: 'frequency_count' })
  frequencyCount: number;

  @Column({ type: 'varchar', name: 'frequency_per', length: 8 })
  frequencyPer: Limit['frequencyPer'];

  @Column({ type: 'varchar', name: 'sample_type', length: 10 })
  sampleType: Limit['sampleType'];

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;

  @Column({ type: 'smallint', name: 'reported_decimals', nullable: true })
  reportedDecimals: number | null;

  /** The first day this version applies. */
  @Column({ type: 'date', name: 'applies_from' })
  appliesFrom: string;

  /** The last day it applies; null while it is in force. */
  @Column({ type: 'date', name: 'applies_to', nullable: true })
  appliesTo: string | null;

  /** The same for every version of one limit: the id of its first version. */
  @Column({ type: 'uuid', name: 'series_id' })
  seriesId: string;
}
