import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { TankCheckRequest, TankCheckView } from '../../contracts/tools.js';
import { User } from '../../kernel/people/user.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { Equipment } from '../equipment/equipment.entity.js';
import { FollowUp } from '../follow-ups/follow-up.entity.js';

/** A tank check as it was run: its inputs and results, dated; attached to a follow-up as evidence at most once. */
@Check(
  'tank_check_verdict_check',
  `((verdict)::text = ANY ((ARRAY['rises'::character varying, 'too-short'::character varying, 'oil-sinks'::character varying])::text[]))`,
)
@Index('IDX_tank_check_equipment', ['equipmentId', 'createdAt'])
@Index('IDX_tank_check_follow_up', ['followUpId'])
@Entity('tank_check')
export class TankCheck {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'tank_check_site_id_fkey' })
  site?: Site;

  @Column({ type: 'uuid', name: 'equipment_id', nullable: true })
  equipmentId: string | null;

  @ManyToOne(() => Equipment, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'equipment_id', foreignKeyConstraintName: 'tank_check_equipment_id_fkey' })
  equipment?: Equipment;

  @Column({ type: 'uuid', name: 'follow_up_id', nullable: true })
  followUpId: string | null;

  @ManyToOne(() => FollowUp, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'follow_up_id', foreignKeyConstraintName: 'tank_check_follow_up_id_fkey' })
  followUp?: FollowUp;

  @Column({ type: 'jsonb' })
  input: TankCheckRequest;

  @Column({ type: 'jsonb' })
  result: TankCheckView;

  @Column({ type: 'varchar', length: 10 })
  verdict: TankCheckView['verdict'];

  @Column({ type: 'uuid', name: 'checked_by' })
  checkedBy: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'checked_by', foreignKeyConstraintName: 'tank_check_checked_by_fkey' })
  checkedByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
