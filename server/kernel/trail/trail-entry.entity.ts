import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** Append-only: triggers in the database refuse UPDATE, DELETE and TRUNCATE on this table. */
@Entity('trail_entry')
export class TrailEntry {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ type: 'timestamptz', name: 'occurred_at', default: () => 'now()' })
  occurredAt: Date;

  @Column({ type: 'uuid', name: 'actor_id', nullable: true })
  actorId: string | null;

  @Column({ type: 'varchar', length: 254, name: 'actor_email', nullable: true })
  actorEmail: string | null;

  @Column({ type: 'varchar', length: 40 })
  action: string;

  @Column({ type: 'varchar', length: 60 })
  entity: string;

  @Column({ type: 'varchar', length: 64, name: 'entity_id' })
  entityId: string;

  @Column({ type: 'uuid', name: 'site_id', nullable: true })
  siteId: string | null;

  @Column({ type: 'jsonb', nullable: true })
  before: unknown;

  @Column({ type: 'jsonb', nullable: true })
  after: unknown;
}
