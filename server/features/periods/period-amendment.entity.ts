import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import { User } from '../../kernel/people/user.entity.js';
import { ReportingPeriod } from './reporting-period.entity.js';

/** An amendment opened on a signed period, with its reason. Append-only (a trigger refuses changes). */
@Check('period_amendment_reason_check', `(length(btrim(reason)) > 0)`)
@Unique('period_amendment_period_id_amends_revision_key', ['periodId', 'amendsRevision'])
@Entity('period_amendment')
export class PeriodAmendment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'period_id' })
  periodId: string;

  @ManyToOne(() => ReportingPeriod, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'period_id', foreignKeyConstraintName: 'period_amendment_period_id_fkey' })
  period?: ReportingPeriod;

  /** The signed revision it reopens; signing again makes revision amendsRevision + 1. */
  @Column({ type: 'smallint', name: 'amends_revision' })
  amendsRevision: number;

  @Column({ type: 'text' })
  reason: string;

  @Column({ type: 'uuid', name: 'opened_by', nullable: true })
  openedBy: string | null;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'opened_by', foreignKeyConstraintName: 'period_amendment_opened_by_fkey' })
  opener?: User;

  @Column({ type: 'varchar', name: 'opened_by_name', length: 200 })
  openedByName: string;

  @Column({ type: 'timestamptz', name: 'opened_at', default: () => 'now()' })
  openedAt: Date;
}
