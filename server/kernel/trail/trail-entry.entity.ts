import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

@Index('IDX_trail_entry_entity', ['entity', 'entityId'])
@Index('IDX_trail_entry_site_time', ['siteId', 'occurredAt'])
@Index('UQ_trail_entry_chain_seq', ['chainSeq'], { unique: true })
/**
 * Append-only: triggers in the database refuse UPDATE, DELETE and TRUNCATE on this table, and
 * chain each new entry to the one before (chain_seq, prev_hash, hash are the trigger's to set).
 */
@Entity('trail_entry')
export class TrailEntry {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ type: 'timestamptz', name: 'occurred_at', default: () => 'now()' })
  occurredAt: Date;

  @Column({ type: 'uuid', name: 'actor_id', nullable: true })
  actorId: string | null;

  @Column({ type: 'varchar', name: 'actor_email', length: 254, nullable: true })
  actorEmail: string | null;

  @Column({ type: 'varchar', length: 40 })
  action: string;

  @Column({ type: 'varchar', length: 60 })
  entity: string;

  @Column({ type: 'varchar', name: 'entity_id', length: 64 })
  entityId: string;

  @Column({ type: 'uuid', name: 'site_id', nullable: true })
  siteId: string | null;

  @Column({ type: 'jsonb', nullable: true })
  before: unknown;

  @Column({ type: 'jsonb', nullable: true })
  after: unknown;

  @Column({ type: 'bigint', name: 'chain_seq', insert: false, update: false })
  chainSeq: string;

  @Column({ type: 'char', name: 'prev_hash', length: 64, insert: false, update: false })
  prevHash: string;

  @Column({ type: 'char', length: 64, insert: false, update: false })
  hash: string;

  /** The period amendment the change was made under (set by the database from the period lock). */
  @Index('IDX_trail_entry_amendment', { where: 'amendment_id IS NOT NULL' })
  @Column({ type: 'uuid', name: 'amendment_id', nullable: true })
  amendmentId: string | null;
}
