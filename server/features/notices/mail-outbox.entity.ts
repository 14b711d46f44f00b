import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { MailKind } from '../../contracts/mail.js';
import { FollowUp } from '../follow-ups/follow-up.entity.js';
import { User } from '../../kernel/people/user.entity.js';
import type { MailContent } from '../../kernel/mail/outbox.js';

/** A mail to one recipient about one event, queued with the change that caused it (kernel/mail/outbox.ts). */
@Check(
  'mail_outbox_status_check',
  `((status)::text = ANY ((ARRAY['pending'::character varying, 'sent'::character varying, 'failed'::character varying, 'dropped'::character varying])::text[]))`,
)
@Unique('mail_outbox_event_key_recipient_key', ['eventKey', 'recipient'])
@Index('IDX_mail_outbox_pending', ['nextAttemptAt'], { where: `(status)::text = 'pending'::text` })
@Index('IDX_mail_outbox_follow_up', ['followUpId'], { where: 'follow_up_id IS NOT NULL' })
@Entity('mail_outbox')
export class MailOutbox {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', name: 'event_key', length: 200 })
  eventKey: string;

  @Column({ type: 'varchar', length: 30 })
  kind: MailKind;

  @Column({ type: 'uuid', name: 'user_id', nullable: true })
  userId: string | null;

  @ManyToOne(() => User, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'mail_outbox_user_id_fkey' })
  user?: User;

  @Column({ type: 'varchar', length: 320 })
  recipient: string;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  params: MailContent;

  @Column({ type: 'varchar', length: 300, nullable: true })
  subject: string | null;

  @Column({ type: 'uuid', name: 'follow_up_id', nullable: true })
  followUpId: string | null;

  @ManyToOne(() => FollowUp, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'follow_up_id', foreignKeyConstraintName: 'mail_outbox_follow_up_id_fkey' })
  followUp?: FollowUp;

  @Column({ type: 'varchar', length: 10, default: 'pending' })
  status: 'pending' | 'sent' | 'failed' | 'dropped';

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ type: 'timestamptz', name: 'next_attempt_at', default: () => 'now()' })
  nextAttemptAt: Date;

  @Column({ type: 'text', name: 'last_error', nullable: true })
  lastError: string | null;

  @Column({ type: 'timestamptz', name: 'sent_at', nullable: true })
  sentAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
