import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { numeric } from '../../db/numeric-transformer.js';
import { Site } from '../../kernel/sites/site.entity.js';

@Check('parameter_fraction_check', `((fraction)::text = ANY ((ARRAY['HEM'::character varying, 'SGT-HEM'::character varying])::text[]))`)
// public.parameter USING btree (COALESCE(site_id, '00000000-0000-0000-0000-000000000000'::uuid), code)
@Index('UQ_parameter_code', { synchronize: false })
@Entity('parameter')
export class Parameter {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id', nullable: true })
  siteId: string | null;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'parameter_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', length: 60 })
  code: string;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'varchar', length: 10, nullable: true })
  fraction: 'HEM' | 'SGT-HEM' | null;

  @Column({ type: 'varchar', name: 'default_unit', length: 20 })
  defaultUnit: string;

  @Column({ type: 'numeric', name: 'snc_review_factor', precision: 4, scale: 2, nullable: true, transformer: numeric })
  sncReviewFactor: number | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
