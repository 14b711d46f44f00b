import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { Delivery, MailKind } from '../../contracts/mail.js';
import { User } from '../people/user.entity.js';

/** A person's choice for one kind of mail; absent, the role's default applies (contracts/mail.ts). */
@Check(
  'mail_preference_delivery_check',
  `((delivery)::text = ANY ((ARRAY['now'::character varying, 'digest'::character varying, 'off'::character varying])::text[]))`,
)
@Entity('mail_preference')
export class MailPreferenceRow {
  @PrimaryColumn({ type: 'uuid', name: 'user_id' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'mail_preference_user_id_fkey' })
  user?: User;

  @PrimaryColumn({ type: 'varchar', length: 30 })
  kind: MailKind;

  @Column({ type: 'varchar', length: 10 })
  delivery: Delivery;

  @Column({ type: 'timestamptz', name: 'updated_at', default: () => 'now()' })
  updatedAt: Date;
}
