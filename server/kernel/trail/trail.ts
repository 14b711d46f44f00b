import type { EntityManager } from 'typeorm';
import { TrailEntry } from './trail-entry.entity.js';

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
  await manager.insert(TrailEntry, {
    actorId: actor.id,
    actorEmail: actor.email,
    action: record.action,
    entity: record.entity,
    entityId: record.entityId,
    siteId: record.siteId ?? null,
    before: record.before ?? undefined,
    after: record.after ?? undefined,
  });
}
