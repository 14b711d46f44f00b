import type { DataSource, EntityManager } from 'typeorm';
import type { Actor } from './trail.js';
import { recordTrail } from './trail.js';
import { deleteRow, insertRow, selectRow, updateRow, type Row } from '../../db/rows.js';
import { notFound } from '../../errors/app-error.js';

/**
 * Create, update and delete of one plain row, each with its trail entry in the same
 * transaction. `view` shapes the row as the contract says; `check` runs inside the
 * transaction before the write (for rules that need the database).
 */
interface Target<V> {
  table: string;
  entity: string;
  view: (row: Row) => V;
  siteIdOf: (row: Row) => string | null;
}

export async function createTraced<V>(
  dataSource: DataSource,
  actor: Actor,
  target: Target<V>,
  fields: Row,
  hooks: { check?: (manager: EntityManager) => Promise<void>; afterWrite?: (manager: EntityManager, row: Row) => Promise<void> } = {},
): Promise<V> {
  return dataSource.transaction(async (manager) => {
    await hooks.check?.(manager);
    const row = await insertRow(manager, target.table, fields);
    await hooks.afterWrite?.(manager, row);
    const after = target.view(row);
    await recordTrail(manager, actor, {
      action: 'create',
      entity: target.entity,
      entityId: String(row.id),
      siteId: target.siteIdOf(row),
      after,
    });
    return after;
  });
}

export async function updateTraced<V>(
  dataSource: DataSource,
  actor: Actor,
  target: Target<V>,
  id: string,
  changes: Row,
  check?: (manager: EntityManager, before: Row) => Promise<void>,
): Promise<V> {
  return dataSource.transaction(async (manager) => {
    const beforeRow = await selectRow(manager, target.table, id, true);
    if (!beforeRow) throw notFound(target.entity);
    await check?.(manager, beforeRow);
    const row = await updateRow(manager, target.table, id, changes);
    const after = target.view(row);
    await recordTrail(manager, actor, {
      action: 'update',
      entity: target.entity,
      entityId: id,
      siteId: target.siteIdOf(row),
      before: target.view(beforeRow),
      after,
    });
    return after;
  });
}

export async function deleteTraced<V>(
  dataSource: DataSource,
  actor: Actor,
  target: Target<V>,
  id: string,
  check?: (manager: EntityManager, before: Row) => Promise<void>,
): Promise<void> {
  await dataSource.transaction(async (manager) => {
    const beforeRow = await selectRow(manager, target.table, id, true);
    if (!beforeRow) throw notFound(target.entity);
    await check?.(manager, beforeRow);
    await deleteRow(manager, target.table, id, target.entity);
    await recordTrail(manager, actor, {
      action: 'delete',
      entity: target.entity,
      entityId: id,
      siteId: target.siteIdOf(beforeRow),
      before: target.view(beforeRow),
    });
  });
}
