import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, UpdateDateColumn } from 'typeorm';
import { numeric } from '../../db/numeric-transformer.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';

@Check(
  'equipment_kind_check',
  `((kind)::text = ANY ((ARRAY['belt-skimmer'::character varying, 'drum-skimmer'::character varying, 'disc-skimmer'::character varying, 'tube-skimmer'::character varying, 'mop-skimmer'::character varying, 'oil-water-separator'::character varying, 'sump'::character varying])::text[]))`,
)
@Check('equipment_rated_capacity_check', `(rated_capacity > (0)::numeric)`)
@Check('equipment_rated_unit_check', `((rated_unit)::text = ANY ((ARRAY['gal/h'::character varying, 'L/h'::character varying])::text[]))`)
@Check('equipment_upkeep_interval_days_check', `((upkeep_interval_days >= 1) AND (upkeep_interval_days <= 366))`)
@Check('equipment_specific_gravity_check', `((specific_gravity > 0.5) AND (specific_gravity < 1.2))`)
@Unique('equipment_site_id_name_key', ['siteId', 'name'])
@Entity('equipment')
export class Equipment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'equipment_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ type: 'varchar', length: 24 })
  kind: string;

  @Column({ type: 'varchar', length: 200, default: '' })
  serves: string;

  @Column({ type: 'numeric', name: 'rated_capacity', precision: 10, scale: 2, transformer: numeric })
  ratedCapacity: number;

  @Column({ type: 'varchar', name: 'rated_unit', length: 8 })
  ratedUnit: 'gal/h' | 'L/h';

  @Column({ type: 'varchar', name: 'medium_material', length: 80, nullable: true })
  mediumMaterial: string | null;

  @Column({ type: 'smallint', name: 'upkeep_interval_days' })
  upkeepIntervalDays: number;

  @Column({ type: 'numeric', name: 'specific_gravity', precision: 4, scale: 3, default: () => '0.88', transformer: numeric })
  specificGravity: number;

  /** The discharge point whose water passes through it, if any: a result there points to it. */
  @Column({ type: 'uuid', name: 'discharge_point_id', nullable: true })
  dischargePointId: string | null;

  @ManyToOne(() => DischargePoint, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'discharge_point_id', foreignKeyConstraintName: 'equipment_discharge_point_id_fkey' })
  dischargePoint?: DischargePoint;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
