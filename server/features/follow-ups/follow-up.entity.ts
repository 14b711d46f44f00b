import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { FollowUpStatus, ViolationFacts } from '../../contracts/follow-ups.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { StoredFile } from '../../kernel/files/stored-file.entity.js';
import { User } from '../../kernel/people/user.entity.js';

@Check(
  'follow_up_status_check',
  `((status)::text = ANY ((ARRAY['open'::character varying, 'done'::character varying, 'done-late'::character varying])::text[]))`,
)
@Unique('follow_up_kind_source_entity_source_id_key', ['kind', 'sourceEntity', 'sourceId'])
@Index('IDX_follow_up_site_status_due', ['siteId', 'status', 'dueAt'])
@Entity('follow_up')
export class FollowUp {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'follow_up_site_id_fkey' })
  site?: Site;

  @Column({ type: 'varchar', length: 40 })
  kind: string;

  @Column({ type: 'varchar', name: 'source_entity', length: 40 })
  sourceEntity: string;

  @Column({ type: 'uuid', name: 'source_id' })
  sourceId: string;

  @Column({ type: 'varchar', length: 300 })
  title: string;

  @Column({ type: 'timestamptz', name: 'due_at' })
  dueAt: Date;

  @Column({ type: 'varchar', length: 12, default: 'open' })
  status: FollowUpStatus;

  @Column({ type: 'uuid', name: 'owner_id', nullable: true })
  ownerId: string | null;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'owner_id', foreignKeyConstraintName: 'follow_up_owner_id_fkey' })
  owner?: User;

  @Column({ type: 'timestamptz', name: 'closed_at', nullable: true })
  closedAt: Date | null;

  @Column({ type: 'text', name: 'closing_note', nullable: true })
  closingNote: string | null;

  /** The record whose change resolved it, when Decant closed it by itself (a shipment, a certificate, a check). */
  @Column({ type: 'varchar', name: 'closed_by_entity', length: 40, nullable: true })
  closedByEntity: string | null;

  @Column({ type: 'uuid', name: 'closed_by_id', nullable: true })
  closedById: string | null;

  /** For a violation's follow-ups: what was over which limit, kept to draft the notice from. */
  @Column({ type: 'jsonb', nullable: true })
  facts: ViolationFacts | null;

  /** For a violation's notice: when the site became aware, the moment its clock runs from. */
  @Column({ type: 'timestamptz', name: 'aware_at', nullable: true })
  awareAt: Date | null;

  @Column({ type: 'varchar', name: 'aware_source', length: 300, nullable: true })
  awareSource: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @Column({ type: 'uuid', name: 'closing_file_id', nullable: true })
  closingFileId: string | null;

  @ManyToOne(() => StoredFile, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'closing_file_id', foreignKeyConstraintName: 'follow_up_closing_file_id_fkey' })
  closingFile?: StoredFile;
}
