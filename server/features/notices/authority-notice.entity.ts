import { Check, Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, OneToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import { StoredFile } from '../../kernel/files/stored-file.entity.js';
import { User } from '../../kernel/people/user.entity.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { FollowUp } from '../follow-ups/follow-up.entity.js';

/** The notice of a violation to the control authority: a draft until sent, then kept as sent. */
@Check('authority_notice_status_check', `((status)::text = ANY ((ARRAY['draft'::character varying, 'sent'::character varying])::text[]))`)
@Check(
  'authority_notice_check',
  `(((status)::text = 'draft'::text) OR ((sent_at IS NOT NULL) AND (to_address IS NOT NULL) AND (file_id IS NOT NULL)))`,
)
@Unique('authority_notice_follow_up_id_key', ['followUpId'])
@Entity('authority_notice')
export class AuthorityNotice {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'follow_up_id' })
  followUpId: string;

  @OneToOne(() => FollowUp, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'follow_up_id', foreignKeyConstraintName: 'authority_notice_follow_up_id_fkey' })
  followUp?: FollowUp;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'authority_notice_site_id_fkey' })
  site?: Site;

  @Column({ type: 'text', default: '' })
  cause: string;

  @Column({ type: 'text', name: 'corrective_action', default: '' })
  correctiveAction: string;

  @Column({ type: 'date', name: 'repeat_sample_on', nullable: true })
  repeatSampleOn: string | null;

  @Column({ type: 'varchar', length: 10, default: 'draft' })
  status: 'draft' | 'sent';

  @Column({ type: 'varchar', name: 'to_address', length: 254, nullable: true })
  toAddress: string | null;

  @Column({ type: 'uuid', name: 'file_id', nullable: true })
  fileId: string | null;

  @ManyToOne(() => StoredFile, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'file_id', foreignKeyConstraintName: 'authority_notice_file_id_fkey' })
  file?: StoredFile;

  @Column({ type: 'uuid', name: 'created_by' })
  createdBy: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'authority_notice_created_by_fkey' })
  createdByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @Column({ type: 'timestamptz', name: 'updated_at', default: () => 'now()' })
  updatedAt: Date;

  @Column({ type: 'timestamptz', name: 'sent_at', nullable: true })
  sentAt: Date | null;

  @Column({ type: 'uuid', name: 'sent_by', nullable: true })
  sentBy: string | null;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'sent_by', foreignKeyConstraintName: 'authority_notice_sent_by_fkey' })
  sentByRef?: User;
}
