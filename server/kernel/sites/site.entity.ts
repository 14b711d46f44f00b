import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, UpdateDateColumn } from 'typeorm';
import { numeric } from '../../db/numeric-transformer.js';
import { Company } from './company.entity.js';

@Check('site_retention_years_check', `(retention_years >= 3)`)
@Check(
  'site_generator_status_check',
  `((generator_status)::text = ANY ((ARRAY['large'::character varying, 'small'::character varying, 'very-small'::character varying])::text[]))`,
)
@Check(
  'site_manifest_rule_check',
  `((manifest_rule)::text = ANY ((ARRAY['current'::character varying, 'before-2025'::character varying])::text[]))`,
)
@Check('site_oil_storage_capacity_gallons_check', `(oil_storage_capacity_gallons >= (0)::numeric)`)
@Unique('site_company_id_name_key', ['companyId', 'name'])
@Entity('site')
export class Site {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'company_id' })
  companyId: string;

  @ManyToOne(() => Company, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'company_id', foreignKeyConstraintName: 'site_company_id_fkey' })
  company?: Company;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'text', default: '' })
  address: string;

  /** IANA name; every date of the site is a local date in this zone. */
  @Column({ type: 'varchar', name: 'time_zone', length: 64 })
  timeZone: string;

  /** 40 CFR 403.12(o) and 122.41(j)(2) require at least 3 years; a check constraint enforces it. */
  @Column({ type: 'smallint', name: 'retention_years', default: 5 })
  retentionYears: number;

  @Column({ type: 'varchar', name: 'generator_status', length: 16, default: 'small' })
  generatorStatus: 'large' | 'small' | 'very-small';

  @Column({ type: 'varchar', name: 'manifest_rule', length: 16, default: 'current' })
  manifestRule: 'current' | 'before-2025';

  /** Aggregate above-ground oil storage in US gallons (containers of 55 gal and more). */
  @Column({ type: 'numeric', name: 'oil_storage_capacity_gallons', precision: 12, scale: 2, nullable: true, transformer: numeric })
  oilStorageCapacityGallons: number | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;

  /** Oil on hand when the site began its oil log in Decant, and the day it was measured. */
  @Column({ type: 'numeric', name: 'oil_opening_balance_litres', precision: 12, scale: 2, default: 0, transformer: numeric })
  oilOpeningBalanceLitres: number;

  @Column({ type: 'date', name: 'oil_opening_balance_on', nullable: true })
  oilOpeningBalanceOn: string | null;
}
