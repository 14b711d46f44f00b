import type { DataSource, DeepPartial, EntityManager, EntityTarget, FindOptionsWhere, ObjectLiteral } from 'typeorm';
import { conflict, notFound } from '../../errors/app-error.js';
import { recordTrail, type Actor } from './trail.js';

/**
 * How one kind of plain record is written and shown: its entity, its name in the trail, the
 * contract view of a row, and the site it belongs to.
 */
export interface Target<E extends ObjectLiteral & { id: string }, V> {
  entityClass: EntityTarget<E>;
  entity: string;
  view: (row: E) => V;
  siteIdOf: (row: E) => string | null;
  /** What to do instead when kept records still refer to it (a 409 says it), e.g. mark it inactive. */
  insteadOfDelete?: string;
}

type Check<E> = (manager: EntityManager, before: E) => Promise<void>;

/**
 * Create, update and delete of one plain record through TypeORM, each with its trail entry in
 * the same transaction. `check` runs inside the transaction before the write (for rules that
 * need the database).
 */
export async function createTraced<E extends ObjectLiteral & { id: string }, V>(
  dataSource: DataSource,
  actor: Actor,
  target: Target<E, V>,
  fields: DeepPartial<E>,
  hooks: { check?: (manager: EntityManager) => Promise<void>; afterWrite?: (manager: EntityManager, row: E) => Promise<void> } = {},
): Promise<V> {
  return dataSource.transaction(async (manager) => {
    await hooks.check?.(manager);
    const saved = await manager.save(target.entityClass, manager.create(target.entityClass, fields));
    // Read back what the database holds (defaults, numeric text), as every later read will see it.
    const row = await findById(manager, target, saved.id);
    await hooks.afterWrite?.(manager, row!);
    const after = target.view(row!);
    await recordTrail(manager, actor, { action: 'create', entity: target.entity, entityId: row!.id, siteId: target.siteIdOf(row!), after });
    return after;
  });
}

export async function updateTraced<E extends ObjectLiteral & { id: string }, V>(
  dataSource: DataSource,
  actor: Actor,
  target: Target<E, V>,
  id: string,
  changes: DeepPartial<E>,
  check?: Check<E>,
): Promise<V> {
  return dataSource.transaction(async (manager) => {
    const before = await findById(manager, target, id, true);
    if (!before) throw notFound(target.entity);
    await check?.(manager, before);
    const written = Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined));
    // TypeORM's partial-update type cannot be derived from a generic entity; the target's own fields are written.
    if (Object.keys(written).length > 0) await manager.update(target.entityClass, { id } as FindOptionsWhere<E>, written as never);
    const row = (await findById(manager, target, id))!;
    const after = target.view(row);
    await recordTrail(manager, actor, {
      action: 'update',
      entity: target.entity,
      entityId: id,
      siteId: target.siteIdOf(row),
      before: target.view(before),
      after,
    });
    return after;
  });
}

/** Deletes a record; a foreign key that still refers to it turns into a 409 naming why. */
export async function deleteTraced<E extends ObjectLiteral & { id: string }, V>(
  dataSource: DataSource,
  actor: Actor,
  target: Target<E, V>,
  id: string,
  check?: Check<E>,
): Promise<void> {
  await dataSource.transaction(async (manager) => {
    const before = await findById(manager, target, id, true);
    if (!before) throw notFound(target.entity);
    await check?.(manager, before);
    try {
      await manager.delete(target.entityClass, { id } as FindOptionsWhere<E>);
    } catch (error) {
      if ((error as { code?: string }).code === '23503') {
        const instead = target.insteadOfDelete ? ` ${target.insteadOfDelete}` : '';
        throw conflict(`This ${target.entity} is referred to by kept records, so it cannot be deleted.${instead}`);
      }
      throw error;
    }
    await recordTrail(manager, actor, {
      action: 'delete',
      entity: target.entity,
      entityId: id,
      siteId: target.siteIdOf(before),
      before: target.view(before),
    });
  });
}

function findById<E extends ObjectLiteral & { id: string }>(manager: EntityManager, target: Target<E, unknown>, id: string, lock = false) {
  return manager.findOne(target.entityClass, {
    where: { id } as FindOptionsWhere<E>,
    ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
  });
}
