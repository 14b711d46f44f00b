import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, UpdateDateColumn } from 'typeorm';
import { Site } from '../../kernel/sites/site.entity.js';

@Check(
  'discharge_point_receiving_check',
  `((receiving)::text = ANY ((ARRAY['sewer'::character varying, 'surface-water'::character varying])::text[]))`,
)
@Unique('discharge_point_site_id_code_key', ['siteId', 'code'])
@Entity('discharge_point')
export class DischargePoint {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'discharge_point_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', length: 40 })
  code: string;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'varchar', length: 20 })
  receiving: 'sewer' | 'surface-water';

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
