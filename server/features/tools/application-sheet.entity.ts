import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { ApplicationSheetContent } from '../../contracts/application-sheet.js';
import { User } from '../../kernel/people/user.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { Equipment } from '../equipment/equipment.entity.js';

/** One version of a piece of equipment's application sheet: appended, never changed. */
@Unique('application_sheet_equipment_id_version_key', ['equipmentId', 'version'])
@Entity('application_sheet')
export class ApplicationSheet {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'equipment_id' })
  equipmentId: string;

  @ManyToOne(() => Equipment, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'equipment_id', foreignKeyConstraintName: 'application_sheet_equipment_id_fkey' })
  equipment?: Equipment;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'application_sheet_site_id_fkey' })
  site?: Site;

  @Column({ type: 'smallint' })
  version: number;

  @Column({ type: 'jsonb' })
  content: ApplicationSheetContent;

  @Column({ type: 'varchar', length: 500, default: '' })
  reason: string;

  @Column({ type: 'uuid', name: 'saved_by' })
  savedBy: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'saved_by', foreignKeyConstraintName: 'application_sheet_saved_by_fkey' })
  savedByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'saved_at' })
  savedAt: Date;
}
