import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, UpdateDateColumn } from 'typeorm';
import type { Permit as PermitView } from '../../contracts/setup.js';
import { Site } from '../../kernel/sites/site.entity.js';

@Check('permit_kind_check', `((kind)::text = ANY ((ARRAY['pretreatment'::character varying, 'npdes'::character varying])::text[]))`)
@Check(
  'permit_reporting_frequency_check',
  `((reporting_frequency)::text = ANY ((ARRAY['monthly'::character varying, 'quarterly'::character varying, 'semiannual'::character varying])::text[]))`,
)
@Check('permit_report_due_days_check', `((report_due_days >= 0) AND (report_due_days <= 365))`)
@Check('permit_check', `((effective_to IS NULL) OR (effective_to >= effective_from))`)
@Unique('permit_site_id_number_key', ['siteId', 'number'])
@Entity('permit')
export class Permit {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'permit_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', length: 20 })
  kind: PermitView['kind'];

  @Column({ type: 'varchar', length: 60 })
  number: string;

  @Column({ type: 'varchar', name: 'issuing_authority', length: 200 })
  issuingAuthority: string;

  @Column({ type: 'varchar', name: 'authority_email', length: 254, nullable: true })
  authorityEmail: string | null;

  @Column({ type: 'date', name: 'effective_from' })
  effectiveFrom: string;

  @Column({ type: 'date', name: 'effective_to', nullable: true })
  effectiveTo: string | null;

  @Column({ type: 'varchar', name: 'reporting_frequency', length: 12 })
  reportingFrequency: PermitView['reportingFrequency'];

  @Column({ type: 'smallint', name: 'report_due_days' })
  reportDueDays: number;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
