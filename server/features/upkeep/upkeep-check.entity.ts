import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { UpkeepCheckView } from '../../contracts/oil.js';
import { numeric } from '../../db/numeric-transformer.js';
import { Equipment } from '../equipment/equipment.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { User } from '../../kernel/people/user.entity.js';

@Check(
  'upkeep_check_immersion_unit_check',
  `((immersion_unit)::text = ANY ((ARRAY['in'::character varying, 'cm'::character varying])::text[]))`,
)
@Index('IDX_upkeep_check_equipment_day', ['equipmentId', 'checkedOn'])
@Entity('upkeep_check')
export class UpkeepCheck {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'equipment_id' })
  equipmentId: string;

  @ManyToOne(() => Equipment, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'equipment_id', foreignKeyConstraintName: 'upkeep_check_equipment_id_fkey' })
  equipment?: Equipment;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'upkeep_check_site_id_fkey' })
  site?: Site;

  @Column({ type: 'date', name: 'checked_on' })
  checkedOn: string;

  @Column({ type: 'jsonb' })
  items: UpkeepCheckView['items'];

  @Column({ type: 'numeric', name: 'immersion_value', precision: 6, scale: 2, nullable: true, transformer: numeric })
  immersionValue: number | null;

  @Column({ type: 'varchar', name: 'immersion_unit', length: 4, nullable: true })
  immersionUnit: UpkeepCheckView['immersionUnit'];

  @Column({ type: 'smallint', name: 'failed_count', default: 0 })
  failedCount: number;

  @Column({ type: 'uuid', name: 'checked_by' })
  checkedBy: string;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'checked_by', foreignKeyConstraintName: 'upkeep_check_checked_by_fkey' })
  checkedByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
