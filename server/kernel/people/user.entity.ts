import { Column, CreateDateColumn, Entity, JoinTable, ManyToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Role } from '../../contracts/permissions.js';
import type { UnitSystem } from '../../contracts/users.js';
import { Site } from '../sites/site.entity.js';

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
  @Column({ type: 'varchar', length: 512, unique: true, nullable: true })
  subject: string | null;

  /** Null until an administrator grants a role: such a user can sign in but sees nothing. */
  @Column({ type: 'varchar', length: 20, nullable: true })
  role: Role | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  /** How volumes are shown to this person; data stay in litres. */
  @Column({ type: 'varchar', length: 8, name: 'unit_system', default: 'us' })
  unitSystem: UnitSystem;

  @ManyToMany(() => Site)
  @JoinTable({ name: 'user_site', joinColumn: { name: 'user_id' }, inverseJoinColumn: { name: 'site_id' } })
  sites?: Site[];

  @Column({ type: 'timestamptz', name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
