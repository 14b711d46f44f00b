import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { Company } from './company.entity.js';

@Entity('site')
export class Site {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'company_id' })
  companyId: string;

  @ManyToOne(() => Company, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'company_id' })
  company?: Company;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'text', default: '' })
  address: string;

  /** IANA name; every date of the site is a local date in this zone. */
  @Column({ type: 'varchar', length: 64, name: 'time_zone' })
  timeZone: string;

  /** 40 CFR 403.12(o) and 122.41(j)(2) require at least 3 years; a check constraint enforces it. */
  @Column({ type: 'smallint', name: 'retention_years', default: 5 })
  retentionYears: number;

  @Column({ type: 'varchar', length: 16, name: 'generator_status', default: 'small' })
  generatorStatus: 'large' | 'small' | 'very-small';

  @Column({ type: 'varchar', length: 16, name: 'manifest_rule', default: 'current' })
  manifestRule: 'current' | 'before-2025';

  /** Aggregate above-ground oil storage in US gallons (containers of 55 gal and more). */
  @Column({ type: 'numeric', precision: 12, scale: 2, name: 'oil_storage_capacity_gallons', nullable: true })
  oilStorageCapacityGallons: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
