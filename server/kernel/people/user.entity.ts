import { Check, Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Role } from '../../contracts/permissions.js';
import type { UnitSystem } from '../../contracts/users.js';

@Check('app_user_email_check', `((email)::text = lower((email)::text))`)
@Check(
  'app_user_role_check',
  `((role)::text = ANY ((ARRAY['administrator'::character varying, 'coordinator'::character varying, 'operator'::character varying, 'auditor'::character varying])::text[]))`,
)
@Check('app_user_unit_system_check', `((unit_system)::text = ANY ((ARRAY['us'::character varying, 'metric'::character varying])::text[]))`)
@Entity('app_user')
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-case; the identity provider's e-mail claim links a first sign-in to a pre-registered user. */
  @Column({ type: 'varchar', length: 254, unique: true })
  email: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  /** `iss sub` of the identity provider, set at first sign-in. */
  @Column({ type: 'varchar', length: 512, nullable: true, unique: true })
  subject: string | null;

  /** Null until an administrator grants a role: such a user can sign in but sees nothing. */
  @Column({ type: 'varchar', length: 20, nullable: true })
  role: Role | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @Column({ type: 'timestamptz', name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;

  /** How volumes are shown to this person; data stay in litres. */
  @Column({ type: 'varchar', name: 'unit_system', length: 8, default: 'us' })
  unitSystem: UnitSystem;
}
