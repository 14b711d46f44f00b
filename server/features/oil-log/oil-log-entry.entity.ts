import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { OilLogEntryView } from '../../contracts/oil.js';
import { numeric } from '../../db/numeric-transformer.js';
import { Equipment } from '../equipment/equipment.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { User } from '../../kernel/people/user.entity.js';

@Check('oil_log_entry_volume_litres_check', `(volume_litres >= (0)::numeric)`)
@Check(
  'oil_log_entry_entered_unit_check',
  `((entered_unit)::text = ANY ((ARRAY['gal'::character varying, 'L'::character varying])::text[]))`,
)
@Check('oil_log_entry_hours_run_check', `((hours_run >= (0)::numeric) AND (hours_run <= (24)::numeric))`)
@Index('IDX_oil_log_site_day', ['siteId', 'collectedOn'])
@Index('IDX_oil_log_equipment_day', ['equipmentId', 'collectedOn'])
@Entity('oil_log_entry')
export class OilLogEntry {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'equipment_id' })
  equipmentId: string;

  @ManyToOne(() => Equipment, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'equipment_id', foreignKeyConstraintName: 'oil_log_entry_equipment_id_fkey' })
  equipment?: Equipment;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'oil_log_entry_site_id_fkey' })
  site?: Site;

  @Column({ type: 'date', name: 'collected_on' })
  collectedOn: string;

  @Column({ type: 'numeric', name: 'volume_litres', precision: 14, scale: 6, transformer: numeric })
  volumeLitres: number;

  @Column({ type: 'numeric', name: 'entered_volume', precision: 12, scale: 3, transformer: numeric })
  enteredVolume: number;

  @Column({ type: 'varchar', name: 'entered_unit', length: 4 })
  enteredUnit: OilLogEntryView['enteredUnit'];

  @Column({ type: 'numeric', name: 'hours_run', precision: 4, scale: 1, nullable: true, transformer: numeric })
  hoursRun: number | null;

  @Column({ type: 'numeric', name: 'water_temperature_c', precision: 4, scale: 1, nullable: true, transformer: numeric })
  waterTemperatureC: number | null;

  @Column({ type: 'text', array: true, default: '{}' })
  observations: string[];

  @Column({ type: 'text', default: '' })
  note: string;

  @Column({ type: 'jsonb', default: '[]' })
  flags: OilLogEntryView['flags'];

  @Column({ type: 'uuid', name: 'entered_by' })
  enteredBy: string;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'entered_by', foreignKeyConstraintName: 'oil_log_entry_entered_by_fkey' })
  enteredByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
