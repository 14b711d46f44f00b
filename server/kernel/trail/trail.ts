import type { EntityManager } from 'typeorm';

export interface Actor {
  id: string | null;
  email: string | null;
}

export interface TrailRecord {
  action: 'create' | 'update' | 'delete' | 'sign-in' | string;
  entity: string;
  entityId: string;
  siteId?: string | null;
  before?: unknown;
  after?: unknown;
}

/**
 * Writes one trail entry with the manager of the caller's transaction, so the change and its
 * record commit or roll back together. Call it from inside `dataSource.transaction`.
 */
export async function recordTrail(manager: EntityManager, actor: Actor, record: TrailRecord): Promise<void> {
  if (!manager.queryRunner?.isTransactionActive) {
    throw new Error('recordTrail must run inside the transaction that makes the change');
  }
  await manager.query(
    `INSERT INTO trail_entry (actor_id, actor_email, action, entity, entity_id, site_id, before, after)
     VALUES ($1, $2, $3, $4, $5, $6, $7::jsonb, $8::jsonb)`,
    [
      actor.id,
      actor.email,
      record.action,
      record.entity,
      record.entityId,
      record.siteId ?? null,
      record.before == null ? null : JSON.stringify(record.before),
      record.after == null ? null : JSON.stringify(record.after),
    ],
  );
}
