import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { PeriodStatus } from '../../contracts/periods.js';
import { Permit } from '../permits/permit.entity.js';

@Check(
  'reporting_period_status_check',
  `((status)::text = ANY ((ARRAY['open'::character varying, 'compiled'::character varying, 'signed'::character varying, 'amended'::character varying])::text[]))`,
)
@Check('reporting_period_check', `(ends_on >= starts_on)`)
@Unique('reporting_period_permit_id_starts_on_key', ['permitId', 'startsOn'])
@Index('IDX_reporting_period_locked', ['permitId'], { where: `status IN ('signed', 'amended')` })
@Entity('reporting_period')
export class ReportingPeriod {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'permit_id' })
  permitId: string;

  @ManyToOne(() => Permit, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'permit_id', foreignKeyConstraintName: 'reporting_period_permit_id_fkey' })
  permit?: Permit;

  @Column({ type: 'date', name: 'starts_on' })
  startsOn: string;

  @Column({ type: 'date', name: 'ends_on' })
  endsOn: string;

  @Column({ type: 'date', name: 'due_on' })
  dueOn: string;

  @Column({ type: 'varchar', length: 10, default: 'open' })
  status: PeriodStatus;

  @Column({ type: 'timestamptz', name: 'compiled_at', nullable: true })
  compiledAt: Date | null;

  @Column({ type: 'jsonb', nullable: true })
  summary: unknown | null;

  @Column({ type: 'date', name: 'submitted_on', nullable: true })
  submittedOn: string | null;

  /** How many times the period has been signed: 0 until its first signature. */
  @Column({ type: 'smallint', default: 0 })
  revision: number;
}
