import type { EntityManager } from 'typeorm';
import { conflict, notFound } from '../errors/app-error.js';

/**
 * Small SQL helpers for repositories that write plain rows: camelCase fields in, snake_case
 * columns out. Table and column names come from code, never from input.
 */
export const toSnake = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
export const toCamel = (name: string) => name.replace(/_([a-z0-9])/g, (_, c: string) => c.toUpperCase());

export type Row = Record<string, unknown>;

export function camelRow(row: Row): Row {
  return Object.fromEntries(Object.entries(row).map(([key, value]) => [toCamel(key), value]));
}

export async function insertRow(manager: EntityManager, table: string, fields: Row): Promise<Row> {
  const entries = Object.entries(fields).filter(([, value]) => value !== undefined);
  const columns = entries.map(([key]) => toSnake(key));
  const placeholders = entries.map((_, index) => `$${index + 1}`);
  const [row] = await manager.query(
    `INSERT INTO ${table} (${columns.join(', ')}) VALUES (${placeholders.join(', ')}) RETURNING *`,
    entries.map(([, value]) => jsonReady(value)),
  );
  return camelRow(row);
}

export async function selectRow(manager: EntityManager, table: string, id: string, lock = false): Promise<Row | null> {
  const [row] = await manager.query(`SELECT * FROM ${table} WHERE id = $1${lock ? ' FOR UPDATE' : ''}`, [id]);
  return row ? camelRow(row) : null;
}

export async function updateRow(manager: EntityManager, table: string, id: string, changes: Row): Promise<Row> {
  const entries = Object.entries(changes).filter(([, value]) => value !== undefined);
  const hasUpdatedAt = !['qc_batch', 'lab_sample', 'lab_result', 'stored_file'].includes(table);
  const sets = entries.map(([key], index) => `${toSnake(key)} = $${index + 2}`);
  if (hasUpdatedAt) sets.push('updated_at = now()');
  const [rows] = await manager.query(`UPDATE ${table} SET ${sets.join(', ')} WHERE id = $1 RETURNING *`, [
    id,
    ...entries.map(([, value]) => jsonReady(value)),
  ]);
  const row = Array.isArray(rows) ? rows[0] : rows;
  if (!row) throw notFound('Record');
  return camelRow(row);
}

/** Deletes a row; a foreign key that still refers to it turns into a 409 naming why. */
export async function deleteRow(manager: EntityManager, table: string, id: string, what: string): Promise<void> {
  try {
    await manager.query('SAVEPOINT before_delete');
    await manager.query(`DELETE FROM ${table} WHERE id = $1`, [id]);
    await manager.query('RELEASE SAVEPOINT before_delete');
  } catch (error) {
    if ((error as { code?: string }).code === '23503') {
      await manager.query('ROLLBACK TO SAVEPOINT before_delete');
      throw conflict(`${what} is used by other records and cannot be deleted`);
    }
    throw error;
  }
}

/** Turns a unique-constraint violation into a 409 on the named field. */
export async function uniquely<T>(work: () => Promise<T>, field: string, message: string): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if ((error as { code?: string }).code === '23505') throw conflict(message, { [field]: message });
    throw error;
  }
}

const jsonReady = (value: unknown) =>
  value !== null && typeof value === 'object' && !(value instanceof Date) ? JSON.stringify(value) : value;
